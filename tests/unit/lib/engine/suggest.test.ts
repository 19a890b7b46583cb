/**
 * Resizing advice. Expected minimum I values come straight from the deflection formulas solved
 * for I (AISC Manual Table 3-23, simple beam - uniform load, from memory: delta = 5wL^4/(384EI));
 * the catalogue is invented for the test (names are not real products).
 */
import { describe, expect, it } from "vitest";
import { checkMember } from "../../../../lib/engine/check-member";
import { STANDARD_GRAVITY_M_PER_S2, type CatalogueSection, type LimitProfile, type Member } from "../../../../lib/engine/model";
import { EngineInputError } from "../../../../lib/engine/solver";
import { E_MPA, createMember, createSpans, createSupports, expectRelative } from "./solver/fixtures";

const L = 8000;
const w = 10;
const profile: LimitProfile = {
  id: "floor",
  label: "Floor",
  source: "IBC 2021 Table 1604.3 (from memory)",
  cantileverSpanMultiplier: 2,
  combinations: [
    { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
    { id: "D+L", label: "Dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
};

function createWeakBeam(iMm4: number, extra: Partial<Member> = {}, spans = createSpans([L], E_MPA, iMm4)): Member {
  return createMember(spans, createSupports("pinned", "roller"), [
    { kind: "uniform", loadCase: "dead", wNPerMm: 4 },
    { kind: "uniform", loadCase: "live", wNPerMm: w },
  ], extra);
}

// minimum I per combination: 5 w L^4 / (384 E (L/N))
const getRequiredI = (wLoad: number, ratio: number): number => (5 * wLoad * L ** 4) / (384 * E_MPA * (L / ratio));
const expectedMinI = Math.max(getRequiredI(w, 360), getRequiredI(14, 240));

const catalogue: CatalogueSection[] = [
  { name: "TEST-B 400x60", iMm4: 3.2e8, areaMm2: 7600, massKgPerM: 59.7 },
  { name: "TEST-B 300x40", iMm4: 1.1e8, areaMm2: 5100, massKgPerM: 40.0 },
  { name: "TEST-B 450x75", iMm4: 4.6e8, areaMm2: 9500, massKgPerM: 74.6 },
  { name: "TEST-B 350x52", iMm4: expectedMinI * 1.02, areaMm2: 6600, massKgPerM: 51.8 },
];

describe("minimum I", () => {
  it("a failing member gets I x utilization, the I at which the governing check is exactly 1", () => {
    const result = checkMember(createWeakBeam(1e8), profile);
    expect(result.pass).toBe(false);
    expectRelative(result.suggestion!.minIMm4, expectedMinI);
    const resized = checkMember(createWeakBeam(result.suggestion!.minIMm4), profile);
    expectRelative(resized.governing!.utilization, 1, 1e-12);
  });

  it("a passing member gets no suggestion", () => {
    const result = checkMember(createWeakBeam(expectedMinI * 1.01), profile);
    expect(result.pass).toBe(true);
    expect(result.suggestion).toBeNull();
  });

  it("spans with different I are resized to one uniform I", () => {
    const spans = [{ lengthMm: L / 2, eMpa: E_MPA, iMm4: 5e7 }, { lengthMm: L / 2, eMpa: E_MPA, iMm4: 9e7 }];
    const member = createMember(spans, createSupports("pinned", "free", "roller"), [
      { kind: "uniform", loadCase: "dead", wNPerMm: 4 },
      { kind: "uniform", loadCase: "live", wNPerMm: w },
    ]);
    expectRelative(checkMember(member, profile).suggestion!.minIMm4, expectedMinI);
  });

  it("with shear deformation: I = 5wL^4 / (384 E (allowed - wL^2/(8kGA)))", () => {
    // shear term from Timoshenko beam theory (ENGINEERING.md, from memory)
    const kGA = 77_000 * 800;
    const member = createWeakBeam(1e8, { includeShearDeformation: true }, [{ lengthMm: L, eMpa: E_MPA, iMm4: 1e8, gMpa: 77_000, shearAreaMm2: 800 }]);
    const getRequiredIWithShear = (wLoad: number, ratio: number): number => (5 * wLoad * L ** 4) / (384 * E_MPA * (L / ratio - (wLoad * L * L) / (8 * kGA)));
    expectRelative(checkMember(member, profile).suggestion!.minIMm4, Math.max(getRequiredIWithShear(w, 360), getRequiredIWithShear(14, 240)), 1e-9);
  });

  it("when shear deflection alone exceeds the limit no I passes: no suggestion and a note", () => {
    const member = createWeakBeam(1e8, { includeShearDeformation: true }, [{ lengthMm: L, eMpa: E_MPA, iMm4: 1e8, gMpa: 77_000, shearAreaMm2: 1 }]);
    const result = checkMember(member, profile);
    expect(result.pass).toBe(false);
    expect(result.suggestion).toBeNull();
    expect(result.notes?.[0]).toMatch(/shear/);
  });

  it("a frequency-governed member needs I x (minHz / f)^2", () => {
    const vibration: LimitProfile = { ...profile, combinations: [], frequency: { minHz: 8, massFactors: { dead: 1 } } };
    const result = checkMember(createWeakBeam(1e8), vibration);
    expect(result.pass).toBe(false);
    const ratio = 8 / result.frequency!.hz;
    expectRelative(result.suggestion!.minIMm4, 1e8 * ratio * ratio);
    expectRelative(checkMember(createWeakBeam(result.suggestion!.minIMm4), vibration).frequency!.hz, 8, 1e-12);
  });
});

describe("lightest catalogue section", () => {
  it("picks the lightest section that passes, not the first or the stiffest", () => {
    const result = checkMember(createWeakBeam(1e8), profile, catalogue);
    expect(result.suggestion!.sectionName).toBe("TEST-B 350x52");
  });

  it("re-evaluates self-weight with each section's area", () => {
    // a section just stiff enough without self-weight fails once its own weight is added:
    // dead + live = (4 + A rho g) N/mm against L/240, live alone unaffected
    const density = 7850;
    const selfWeight = (area: number): number => area * density * 1e-9 * STANDARD_GRAVITY_M_PER_S2;
    const heavyArea = 20_000;
    const iWithoutSelfWeight = Math.max(getRequiredI(w, 360), getRequiredI(14, 240)) * 1.001;
    const iWithSelfWeight = Math.max(getRequiredI(w, 360), getRequiredI(14 + selfWeight(5000), 240)) * 1.001;
    const sections: CatalogueSection[] = [
      { name: "HEAVY-THIN", iMm4: iWithoutSelfWeight, areaMm2: heavyArea, massKgPerM: 30 },
      { name: "LIGHT-DEEP", iMm4: iWithSelfWeight, areaMm2: 5000, massKgPerM: 39 },
    ];
    expect(getRequiredI(14 + selfWeight(heavyArea), 240)).toBeGreaterThan(iWithoutSelfWeight);
    const spans = [{ lengthMm: L, eMpa: E_MPA, iMm4: 1e8, areaMm2: 5000, densityKgPerM3: density }];
    const result = checkMember(createWeakBeam(1e8, { selfWeightCase: "dead" }, spans), profile, sections);
    expect(result.suggestion!.sectionName).toBe("LIGHT-DEEP");
  });

  it("none passing or no catalogue gives sectionName null", () => {
    const small: CatalogueSection[] = [{ name: "TEST-B 200x20", iMm4: 2e7, areaMm2: 2500, massKgPerM: 19.6 }];
    expect(checkMember(createWeakBeam(1e8), profile, small).suggestion!.sectionName).toBeNull();
    expect(checkMember(createWeakBeam(1e8), profile).suggestion!.sectionName).toBeNull();
  });

  it("an invalid catalogue entry is an input error naming it", () => {
    const bad: CatalogueSection[] = [{ name: "TEST-X", iMm4: -1, areaMm2: 100, massKgPerM: 1 }];
    expect(() => checkMember(createWeakBeam(1e8), profile, bad)).toThrow(EngineInputError);
    expect(() => checkMember(createWeakBeam(1e8), profile, bad)).toThrow(/catalogue\[0\]\.iMm4/);
  });
});
