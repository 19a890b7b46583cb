/**
 * First natural frequency. Expected values are computed in SI units (Pa, m^4, kg/m, m) so the
 * unit handling of the engine (mm, N, kg/mm) is checked too. Formulas: f1 = (beta L)^2/(2 pi L^2)
 * sqrt(EI/m) with beta L = pi, 1.8751, 4.7300, 3.9266 (Roark's Formulas Table 16.1, from memory;
 * ENGINEERING.md); the "18 over root delta" rule (AISC Design Guide 11, from memory).
 */
import { describe, expect, it } from "vitest";
import { FIRST_MODE_BETA_L, computeFrequency } from "../../../../lib/engine/frequency";
import { STANDARD_GRAVITY_M_PER_S2, type LimitProfile, type Member, type SupportKind } from "../../../../lib/engine/model";
import { EngineInputError } from "../../../../lib/engine/solver";
import { E_MPA, I_MM4, createMember, createSpans, createSupports, expectRelative } from "./solver/fixtures";

const L = 7000;
const wDead = 3; // N/mm
const profile: LimitProfile = {
  id: "vib",
  label: "Floor vibration",
  source: "common practice",
  cantileverSpanMultiplier: 2,
  combinations: [],
  frequency: { minHz: 4, massFactors: { dead: 1, live: 0.1 } },
};

function getSiFrequency(betaL: number, lengthMm: number, massNPerMm: number): number {
  const eiSi = E_MPA * 1e6 * I_MM4 * 1e-12; // N m^2
  const massKgPerM = (massNPerMm * 1000) / STANDARD_GRAVITY_M_PER_S2;
  const lengthM = lengthMm / 1000;
  return ((betaL * betaL) / (2 * Math.PI * lengthM * lengthM)) * Math.sqrt(eiSi / massKgPerM);
}

function createUniformBeam(kinds: SupportKind[], extra: Partial<Member> = {}): Member {
  return createMember(createSpans([L]), createSupports(...kinds), [
    { kind: "uniform", loadCase: "dead", wNPerMm: wDead },
    { kind: "uniform", loadCase: "live", wNPerMm: 5 },
    { kind: "moment", loadCase: "dead", atMm: 1000, mNmm: 1e6 }, // couples carry no mass
  ], extra);
}

describe("eigenvalues", () => {
  it("beta L satisfy their characteristic equations (Roark's Formulas Table 16.1, from memory)", () => {
    const { fixedFree, fixedFixed, fixedPinned, pinnedPinned } = FIRST_MODE_BETA_L;
    expect(Math.abs(Math.cos(fixedFree) * Math.cosh(fixedFree) + 1)).toBeLessThan(1e-12);
    expect(Math.abs(Math.cos(fixedFixed) * Math.cosh(fixedFixed) - 1)).toBeLessThan(1e-10);
    expect(Math.abs(Math.tan(fixedPinned) - Math.tanh(fixedPinned))).toBeLessThan(1e-12);
    expect(Math.abs(Math.sin(pinnedPinned))).toBeLessThan(1e-15);
    expect([fixedFree, fixedFixed, fixedPinned].map((x) => x.toFixed(4))).toEqual(["1.8751", "4.7300", "3.9266"]);
  });
});

describe("exact single-span frequencies", () => {
  const mass = wDead + 0.1 * 5;
  it.each<[string, SupportKind[], number]>([
    ["pinned-pinned", ["pinned", "roller"], Math.PI],
    ["fixed-free", ["fixed", "free"], 1.8751040687119611],
    ["free-fixed", ["free", "fixed"], 1.8751040687119611],
    ["fixed-fixed", ["fixed", "fixed"], 4.730040744862704],
    ["fixed-pinned", ["fixed", "pinned"], 3.926602312047919],
  ])("%s", (_name, kinds, betaL) => {
    const result = computeFrequency(createUniformBeam(kinds), profile)!;
    expect(result.method).toBe("exact");
    expectRelative(result.hz, getSiFrequency(betaL, L, mass), 1e-12);
    expect(result.minHz).toBe(4);
    // pass when the closed-form frequency reaches the profile's 4 Hz minimum
    expect(result.pass).toBe(getSiFrequency(betaL, L, mass) >= 4);
  });

  it("simply supported: f1 = pi/(2L^2) sqrt(EI/m) agrees with 17.75/sqrt(delta_mm) (AISC Design Guide 11, from memory)", () => {
    const result = computeFrequency(createUniformBeam(["pinned", "roller"]), profile)!;
    const deltaMm = (5 * mass * L ** 4) / (384 * E_MPA * I_MM4); // AISC Table 3-23 (from memory)
    // (pi/2) sqrt(5 g / (384 delta)) with g in mm/s^2 is exactly the same as the eigen formula
    expectRelative(result.hz, (Math.PI / 2) * Math.sqrt((5 * STANDARD_GRAVITY_M_PER_S2 * 1000) / (384 * deltaMm)), 1e-12);
    expectRelative(result.hz, 17.75 / Math.sqrt(deltaMm), 2e-3);
  });

  it("self-weight counts as mass", () => {
    const area = 6000;
    const density = 7850;
    const member = createMember([{ lengthMm: L, eMpa: E_MPA, iMm4: I_MM4, areaMm2: area, densityKgPerM3: density }], createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: wDead }], { selfWeightCase: "dead" });
    const selfWeightNPerMm = area * density * 1e-9 * STANDARD_GRAVITY_M_PER_S2;
    expectRelative(computeFrequency(member, profile)!.hz, getSiFrequency(Math.PI, L, wDead + selfWeightNPerMm), 1e-12);
  });
});

describe("Rayleigh quotient", () => {
  it("a massless span with one point mass is exact: f = sqrt(48EI/(M L^3))/(2 pi)", () => {
    // single degree of freedom: stiffness 48EI/L^3 (AISC Table 3-23 centre point, from memory)
    const p = 20_000;
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "point", loadCase: "dead", atMm: L / 2, pN: p }]);
    const result = computeFrequency(member, profile)!;
    expect(result.method).toBe("rayleigh");
    const stiffnessNPerM = (48 * E_MPA * 1e6 * I_MM4 * 1e-12) / (L / 1000) ** 3;
    expectRelative(result.hz, Math.sqrt(stiffnessNPerM / (p / STANDARD_GRAVITY_M_PER_S2)) / (2 * Math.PI), 1e-10);
  });

  it("uniform span on very stiff springs: an upper bound within 0.1% of the exact value", () => {
    const member = createMember(createSpans([L]), [{ kind: "spring", springNPerMm: 1e12 }, { kind: "spring", springNPerMm: 1e12 }], [{ kind: "uniform", loadCase: "dead", wNPerMm: wDead }]);
    const result = computeFrequency(member, profile)!;
    const exact = getSiFrequency(Math.PI, L, wDead);
    expect(result.method).toBe("rayleigh");
    expect(result.hz).toBeGreaterThan(exact * (1 - 1e-6));
    expect(result.hz / exact - 1).toBeLessThan(1e-3);
  });

  it("two equal continuous spans: the fundamental mode is antisymmetric, at the single-span frequency", () => {
    // common practice: each span vibrates as a simple span with a node over the middle support
    const member = createMember(createSpans([L, L]), createSupports("pinned", "roller", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: wDead }]);
    const result = computeFrequency(member, profile)!;
    const exact = getSiFrequency(Math.PI, L, wDead);
    expect(result.hz).toBeGreaterThan(exact * (1 - 1e-6));
    expect(result.hz / exact - 1).toBeLessThan(1e-3);
  });

  it("a cantilever modelled as two segments: an upper bound within 1% of the exact 1.8751 value", () => {
    // Rayleigh's quotient with the static shape overestimates slightly (common practice: about
    // 0.4% for a uniform cantilever); the exact value is Roark's Formulas Table 16.1 (from memory)
    const member = createMember(createSpans([L / 2, L / 2]), createSupports("fixed", "free", "free"), [{ kind: "uniform", loadCase: "dead", wNPerMm: wDead }]);
    const result = computeFrequency(member, profile)!;
    const exact = getSiFrequency(FIRST_MODE_BETA_L.fixedFree, L, wDead);
    expect(result.method).toBe("rayleigh");
    expect(result.hz).toBeGreaterThan(exact);
    expect(result.hz / exact - 1).toBeLessThan(1e-2);
  });

  it("stiffer members vibrate faster: f grows with sqrt(I)", () => {
    const base = createMember(createSpans([L, 3000]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "dead", wNPerMm: wDead }]);
    const stiffer = { ...base, spans: base.spans.map((span) => ({ ...span, iMm4: span.iMm4 * 4 })) };
    expectRelative(computeFrequency(stiffer, profile)!.hz, 2 * computeFrequency(base, profile)!.hz, 1e-10);
  });
});

describe("frequency input", () => {
  it("no frequency limit gives null", () => {
    expect(computeFrequency(createUniformBeam(["pinned", "roller"]), { ...profile, frequency: undefined })).toBeNull();
  });

  it("no mass is an input error naming the mass factors", () => {
    const noMass: LimitProfile = { ...profile, frequency: { minHz: 3, massFactors: { snow: 1 } } };
    expect(() => computeFrequency(createUniformBeam(["pinned", "roller"]), noMass)).toThrow(EngineInputError);
    try {
      computeFrequency(createUniformBeam(["pinned", "roller"]), noMass);
    } catch (error) {
      expect((error as EngineInputError).issues[0]!.path).toBe("frequency.massFactors");
    }
  });

  it("an upward load counted as mass is an input error naming the load", () => {
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: -2 }]);
    expect(() => computeFrequency(member, profile)).toThrow(/loads\[0\]/);
  });
});
