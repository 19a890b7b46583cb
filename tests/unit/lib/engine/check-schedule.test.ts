import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import { checkParsedSchedule, checkSchedule } from "@/lib/engine/check-schedule";
import { findMaterial } from "@/lib/engine/materials";
import { STANDARD_GRAVITY_M_PER_S2 } from "@/lib/engine/model";
import { EngineInputError } from "@/lib/engine/solver/engine-input-error";

import { createDoc, parseOk } from "./intake/helpers";

const example = JSON.parse(readFileSync(new URL("../../../../examples/lumenbrook-depot-hall-b.json", import.meta.url), "utf8"));

/** Self-weight, N/mm, of area mm^2 at the library density of a material (kg/m^3 x g x mm^2 x 1e-9). */
function getSelfWeightNPerMm(areaMm2: number, materialId: string): number {
  const found = findMaterial(materialId);
  if (!found.ok || found.material.densityKgPerM3 === null) throw new Error(`no density for ${materialId}`);
  return areaMm2 * 1e-9 * found.material.densityKgPerM3 * STANDARD_GRAVITY_M_PER_S2;
}

// The example uses en1995-timber-floor: w_inst is the characteristic combination dead + live
// (EN 1995-1-1 2.2.3(2), from memory), self-weight included in dead.
describe("checkSchedule on the Lumenbrook Depot example", () => {
  const outcome = checkSchedule(example);
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.issues));

  it("checks every member and counts passes and failures", () => {
    expect(outcome.results.map((r) => r.mark)).toEqual(["B1", "J1", "BAL1", "G1", "L1", "B2"]);
    expect(outcome.summary).toEqual({ members: 6, passed: 5, failed: 1 });
  });

  it("B1 w_inst is 5wL^4/(384EI) with w = 6.0 + 7.5 N/mm + self-weight, L = 6000 mm (AISC Manual Table 3-23 case 1), so units came through intake", () => {
    const iMm4 = (150 * 300 ** 3 - (150 - 7.1) * (300 - 21.4) ** 3) / 12;
    const w = 6.0 + 7.5 + getSelfWeightNPerMm(2 * 150 * 10.7 + (300 - 21.4) * 7.1, "steel-s355");
    const expectedMm = (5 * w * 6000 ** 4) / (384 * 210000 * iMm4);
    const live = outcome.results[0]?.checks.find((c) => c.combinationId === "w_inst");
    expect(live?.deflectionMm).toBeCloseTo(expectedMm, 6);
    expect(live?.allowedMm).toBeCloseTo(6000 / 360, 9); // the schedule's w_inst override, l/360
  });

  it("J1 w_inst uses (0.5 + 1.5) kPa x 0.4 m = 0.8 N/mm + self-weight on a 3.9 m C24 47 x 200 joist (AISC Manual Table 3-23 case 1)", () => {
    const w = 0.8 + getSelfWeightNPerMm(47 * 200, "timber-c24");
    const expectedMm = (5 * w * 3900 ** 4) / (384 * 11000 * ((47 * 200 ** 3) / 12));
    const live = outcome.results[1]?.checks.find((c) => c.combinationId === "w_inst");
    expect(live?.deflectionMm).toBeCloseTo(expectedMm, 6);
  });

  it("B2 (8 m, 200 deep) fails: w_inst is 5wL^4/(384EI) with w = 3.0 + 5.0 N/mm + self-weight, against l/360 = 22.2 mm", () => {
    const b2 = outcome.results[5];
    expect(b2?.pass).toBe(false);
    const iMm4 = (100 * 200 ** 3 - (100 - 5.6) * (200 - 17) ** 3) / 12;
    const live = b2?.checks.find((c) => c.combinationId === "w_inst");
    const w = 3.0 + 5.0 + getSelfWeightNPerMm(2 * 100 * 8.5 + (200 - 17) * 5.6, "steel-s355");
    expect(live?.deflectionMm).toBeCloseTo((5 * w * 8000 ** 4) / (384 * 210000 * iMm4), 6);
    expect(live?.pass).toBe(false);
  });
});

describe("engine errors per member", () => {
  const schedule = parseOk(createDoc());

  it("turns an EngineInputError into issues under the member's path", () => {
    const outcome = checkParsedSchedule(schedule, undefined, () => {
      throw new EngineInputError([{ path: "spans[0].eMpa", message: "must be positive" }]);
    });
    expect(outcome).toEqual({ ok: false, issues: [{ path: "members[0].spans[0] (engine spans[0].eMpa)", message: "must be positive" }] });
  });

  it("maps engine spans and supports back through overhangs, and lists profile issues once", () => {
    const withOverhang = parseOk(createDoc({ overhangs: { left: 1 } }));
    const doc = createDoc();
    doc.members = [...(doc.members as unknown[]), { ...((doc.members as Record<string, unknown>[])[0] ?? {}), mark: "B2" }];
    const twoMembers = parseOk(doc);
    const outcome = checkParsedSchedule(withOverhang, undefined, () => {
      throw new EngineInputError([
        { path: "spans[0].iMm4", message: "a" },
        { path: "spans[1]", message: "b" },
        { path: "supports[0].kind", message: "c" },
        { path: "loads[0]", message: "d" },
      ]);
    });
    expect(outcome.ok ? [] : outcome.issues.map((i) => i.path)).toEqual([
      "members[0].overhangs.left (engine spans[0].iMm4)",
      "members[0].spans[0]",
      "members[0].overhangs.left (engine supports[0].kind)",
      "members[0].loads[0]",
    ]);
    const profileIssue = checkParsedSchedule(twoMembers, undefined, () => {
      throw new EngineInputError([{ path: "profile.combinations[0].limitRatio", message: "must be positive" }]);
    });
    expect(profileIssue).toEqual({ ok: false, issues: [{ path: "profile.combinations[0].limitRatio", message: "must be positive" }] });
  });

  it("lets any other error propagate (a defect, not bad input)", () => {
    expect(() =>
      checkParsedSchedule(schedule, undefined, () => {
        throw new TypeError("bug");
      }),
    ).toThrow(TypeError);
  });

  it("returns parse issues without checking", () => {
    const outcome = checkSchedule(createDoc({ spans: [0] }));
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.issues[0]?.path).toBe("members[0].spans[0]");
  });
});
