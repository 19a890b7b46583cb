// The member page and the what-if re-run one stored member through intake and the engine. Check
// values: simply supported beam under uniform load, max deflection 5wL^4/(384EI) at midspan (AISC
// Steel Construction Manual Table 3-23, case 1, from memory); IBC 2021 Table 1604.3 floor members,
// live l/360 (from memory).
import { describe, expect, it } from "vitest";

import { applyWhatIf, getScheduleUnit } from "@/lib/server/schedules/apply-what-if";
import { runStoredMember } from "@/lib/server/schedules/run-stored-member";

const siHeader = { format: "sagline.schedule/v2", name: "Invented test schedule", units: { system: "SI" }, profile: { preset: "ibc-2021-floor" } };
const usHeader = { format: "sagline.schedule/v2", name: "Invented test schedule", units: { system: "US" }, profile: { preset: "ibc-2021-floor" } };

function beam(overrides: Record<string, unknown> = {}) {
  return {
    mark: "B1",
    category: "floor_beam",
    quantity: 1,
    material: { name: "test steel", E: 200000, creepFactor: 0 },
    section: { shape: "explicit", I: 4e7, A: 5000 },
    spans: [6],
    supports: ["pinned", "roller"],
    loads: [{ case: "live", type: "uniform", w: 10 }],
    ...overrides,
  };
}

describe("runStoredMember", () => {
  it("gives the closed-form deflection and reports what was used", () => {
    const run = runStoredMember(siHeader, beam());
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    // 5 x 10 N/mm x 6000^4 / (384 x 200000 x 4e7) = 21.09375 mm
    const live = run.result.checks.find((c) => c.combinationId === "live")!;
    expect(live.deflectionMm).toBeCloseTo(21.09375, 6);
    expect(live.allowedMm).toBeCloseTo(6000 / 360, 9);
    expect(run.model.spans).toHaveLength(1);
    expect(run.model.spans[0]).toMatchObject({ eMpa: 200000, iMm4: 4e7, areaMm2: 5000, lengthMm: 6000, kind: "span" });
    expect(run.model.supports.map((s) => s.kind)).toEqual(["pinned", "roller"]);
    expect(run.model.combinations.map((c) => c.id)).toContain("live");
    expect(run.model.checkLimits.every((l) => l.capGoverned === false)).toBe(true);
  });

  it("marks overhang tips as free nodes, not supports", () => {
    const run = runStoredMember(siHeader, beam({ overhangs: { right: 1.5 } }));
    expect(run.ok).toBe(true);
    if (!run.ok) return;
    expect(run.model.supports.map((s) => s.kind)).toEqual(["pinned", "roller", "free"]);
    expect(run.model.spans.map((s) => s.kind)).toEqual(["span", "cantilever"]);
  });

  it("names the field of input the engine cannot read", () => {
    const run = runStoredMember(siHeader, beam({ spans: [-1] }));
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues[0]?.path).toBe("members[0].spans[0]");
  });
});

describe("applyWhatIf", () => {
  it("replaces the section in the schedule's own units and passes a stiffer trial", () => {
    // I needed: 21.09375 mm / 16.667 mm x 4e7 = 5.0625e7 mm^4; try 6e7
    const trial = applyWhatIf(siHeader, beam(), { section: { shape: "explicit", dimensions: { I: 6e7, A: 5000 } }, material: null });
    expect(trial.section).toEqual({ shape: "explicit", I: { value: 6e7, unit: "mm^4" }, A: { value: 5000, unit: "mm^2" } });
    const run = runStoredMember(siHeader, trial);
    expect(run.ok && run.result.pass).toBe(true);
  });

  it("uses in^4 and ksi for a US schedule", () => {
    expect(getScheduleUnit(usHeader, "secondMoment")).toBe("in^4");
    expect(getScheduleUnit(usHeader, "modulus")).toBe("ksi");
    const trial = applyWhatIf(usHeader, beam(), { section: null, material: { eValue: 29000 } });
    expect(trial.material).toMatchObject({ E: { value: 29000, unit: "ksi" } });
  });

  it("keeps a library material's density when only E changes, so self-weight still works", () => {
    const trial = applyWhatIf(siHeader, beam({ material: "steel-s355", selfWeight: true }), { section: null, material: { eValue: 190000 } });
    expect(trial.material).toMatchObject({ E: { value: 190000, unit: "MPa" }, density: { value: 7850, unit: "kg/m^3" } });
    expect(runStoredMember(siHeader, trial).ok).toBe(true);
  });

  it("drops span-level sections so the trial applies to the whole member, and leaves the input untouched", () => {
    const input = beam({ spans: [{ length: 3, section: { shape: "rectangle", b: 100, h: 200 } }, 3], supports: ["pinned", "roller", "roller"] });
    const before = JSON.stringify(input);
    const trial = applyWhatIf(siHeader, input, { section: { shape: "rectangle", dimensions: { b: 200, h: 400 } }, material: null });
    expect(trial.spans).toEqual([{ length: 3 }, 3]);
    expect(JSON.stringify(input)).toBe(before);
  });
});
