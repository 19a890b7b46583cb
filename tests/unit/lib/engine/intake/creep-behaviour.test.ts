/**
 * Intake reads what the cited clauses need from the schedule: the wood's moisture condition and
 * the concrete's creep for the IBC 2021 Table 1604.3 D + L row (footnotes, from memory: 0.5 D
 * seasoned dry wood, 1.0 D other wood, zero for steel; concrete per ACI 318-19 24.2.4.1), and the
 * sustained live fraction of the ACI 318-19 presets.
 */
import { describe, expect, it } from "vitest";

import { checkMember } from "@/lib/engine/check-member";

import { createDoc, formatIssues, parseIssues, parseOk } from "./helpers";

const timberMember = { material: "timber-c24", section: { shape: "rectangle", b: 47, h: 200 }, loads: [{ case: "dead", type: "uniform", w: 0.3 }, { case: "live", type: "uniform", w: 0.6 }] };

function firstMember(doc: Record<string, unknown>) {
  const member = parseOk(doc).members[0];
  if (!member) throw new Error("no member");
  return member;
}

describe("IBC D + L creep component at intake", () => {
  it("steel and aluminium take zero", () => {
    expect(firstMember(createDoc()).ibcCreepComponentFactor).toBe(0);
    expect(firstMember(createDoc({ material: "aluminium-en1999" })).ibcCreepComponentFactor).toBe(0);
  });
  it("seasoned dry wood 0.5, unseasoned or wet 1.0, from moistureCondition or the NDS creep condition", () => {
    expect(firstMember(createDoc({ ...timberMember, moistureCondition: "seasoned_dry" })).ibcCreepComponentFactor).toBe(0.5);
    expect(firstMember(createDoc({ ...timberMember, moistureCondition: "unseasoned_or_wet" })).ibcCreepComponentFactor).toBe(1);
    expect(firstMember(createDoc({ ...timberMember, creep: { method: "nds", condition: "seasoned_dry" } })).ibcCreepComponentFactor).toBe(0.5);
  });
  it("wood whose condition is not given takes 1.0 D and says so on the result", () => {
    const member = firstMember(createDoc({ ...timberMember, creep: { method: "en1995", serviceClass: 1 } }));
    expect(member.ibcCreepComponentFactor).toBe(1);
    const result = checkMember(member, parseOk(createDoc(timberMember)).profile);
    expect(result.notes?.[0]).toContain("taken as 1.0 x dead (the conservative side)");
  });
  it("concrete takes ACI lambda, 2.0 when not given (xi = 2.0, rho' = 0: the largest, ACI 318-19 24.2.4.1, from memory)", () => {
    const concrete = { material: "concrete-fc30", section: { shape: "rectangle", b: 300, h: 500 } };
    expect(firstMember(createDoc({ ...concrete, creep: { method: "aci", durationMonths: 12, compressionRatio: 0.01 } })).ibcCreepComponentFactor).toBeCloseTo(1.4 / 1.5, 12);
    const unstated = firstMember(createDoc(concrete));
    expect(unstated.ibcCreepComponentFactor).toBe(2);
    expect(unstated.intakeNotes?.join(" ")).toContain("lambda = 2.0");
  });
  it("a custom material needs its creep said; moistureCondition on steel is refused", () => {
    expect(formatIssues(parseIssues(createDoc({ material: { E: 13800 } })))).toEqual([expect.stringMatching(/^members\[0\]\.creep: is required: the limit profile's IBC D \+ L row/)]);
    expect(firstMember(createDoc({ material: { E: 13800 }, moistureCondition: "seasoned_dry" })).ibcCreepComponentFactor).toBe(0.5);
    expect(formatIssues(parseIssues(createDoc({ moistureCondition: "seasoned_dry" })))).toEqual(["members[0].moistureCondition: applies to wood only, not steel (Structural steel S355 (EN 1993-1-1))"]);
  });
  it("a contradiction between moistureCondition and the NDS creep condition is refused", () => {
    const issues = formatIssues(parseIssues(createDoc({ ...timberMember, moistureCondition: "seasoned_dry", creep: { method: "nds", condition: "unseasoned_or_wet" } })));
    expect(issues).toEqual(['members[0].moistureCondition: contradicts creep.condition "unseasoned_or_wet"']);
  });
});

describe("ACI sustained live fraction", () => {
  const aci = (extra: Record<string, unknown>) => createDoc({ material: "concrete-fc30", section: { shape: "rectangle", b: 300, h: 500 }, creep: { method: "aci", durationMonths: 60, compressionRatio: 0 } }, { profile: { preset: "aci-318-19-floor", ...extra } });
  it("is read from profile and reaches the after-attachment combination", () => {
    expect(parseOk(aci({ sustainedLiveFraction: 0.3 })).profile.combinations[1]?.sustainedFactors).toEqual({ dead: 1, live: 0.3 });
    expect(parseOk(aci({})).profile.combinations[1]?.sustainedFactors).toEqual({ dead: 1, live: 1 });
  });
  it("is refused above 1 and on presets that do not read it", () => {
    expect(formatIssues(parseIssues(aci({ sustainedLiveFraction: 25 })))).toEqual(["profile.sustainedLiveFraction: is the sustained part of the live load, from 0 to 1 (e.g. 0.25), not a percentage"]);
    expect(formatIssues(parseIssues(createDoc({}, { profile: { preset: "ibc-2021-floor", sustainedLiveFraction: 0.3 } })))).toEqual([
      "profile.sustainedLiveFraction: applies only to the ACI 318-19 presets, not ibc-2021-floor",
    ]);
  });
});

it("a custom profile may give a cantilever its own ratio and use the IBC creep component", () => {
  const custom = {
    id: "project",
    label: "Project",
    source: "Project specification",
    cantileverSpanMultiplier: 2,
    combinations: [{ id: "total", label: "total", factors: { live: 1 }, sustainedFactors: { dead: 1 }, creep: "ibc_creep_component", limitRatio: 240, cantileverLimitRatio: 180 }],
  };
  const parsed = parseOk(createDoc({ loads: [{ case: "dead", type: "uniform", w: 1 }, { case: "live", type: "uniform", w: 2 }] }, { profile: { custom } }));
  expect(parsed.profile.combinations[0]).toMatchObject({ creep: "ibc_creep_component", cantileverLimitRatio: 180 });
  expect(parsed.members[0]?.ibcCreepComponentFactor).toBe(0);
});
