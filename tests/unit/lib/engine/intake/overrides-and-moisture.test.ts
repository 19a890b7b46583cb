// Intake rules that keep a cited label honest: wet service cannot take the IBC dry-wood creep
// component, an edited combination says it was edited, and a governing cap is reported as its l/N.
import { describe, expect, it } from "vitest";

import { checkMember } from "@/lib/engine/check-member";
import { createDoc, formatIssues, parseIssues, parseOk } from "./helpers";

describe("moisture condition against the EN 1995 service class", () => {
  it("refuses seasoned_dry beside service class 3 (wet service, EN 1995-1-1 2.3.1.3, from memory): IBC 2021 Table 1604.3 allows 0.5 D only for dry use (from memory)", () => {
    const doc = createDoc({ material: "timber-c24", creep: { method: "en1995", serviceClass: 3 }, moistureCondition: "seasoned_dry" });
    expect(formatIssues(parseIssues(doc))).toEqual(['members[0].moistureCondition: contradicts creep.serviceClass 3 (wet service): give "unseasoned_or_wet"']);
  });

  it("accepts unseasoned_or_wet beside service class 3", () => {
    expect(parseOk(createDoc({ material: "timber-c24", creep: { method: "en1995", serviceClass: 3 }, moistureCondition: "unseasoned_or_wet" })).members).toHaveLength(1);
  });
});

describe("overridden combinations", () => {
  it("an edited combination's label says it was edited; an untouched one keeps the preset's", () => {
    const schedule = parseOk(createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { limitRatio: 480 } } } } }));
    const [live, total] = schedule.profile.combinations;
    expect(live?.label.endsWith("(edited)")).toBe(true);
    expect(total?.label.endsWith("(edited)")).toBe(false);
  });

  it("a governing cap is reported as its own l/N, so achieved below limit means a fail", () => {
    // live 2 kN/m on 5 m, b 100 h 200 steel: 5wL^4/(384EI) = 5 x 2 x 5000^4 / (384 x 210,000 x 6.67e7) = 1.16 mm (AISC Manual Table 3-23 case 1, from memory), above the 1 mm cap
    const schedule = parseOk(createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { cap: 1 } } } } }));
    const check = checkMember(schedule.members[0]!, schedule.profile).checks.find((c) => c.combinationId === "live")!;
    expect(check.allowedMm).toBe(1);
    expect(check.limitRatio).toBeCloseTo(5000 / 1, 9);
    expect(check.pass).toBe(false);
    expect(check.achievedRatio!).toBeLessThan(check.limitRatio!);
  });
});
