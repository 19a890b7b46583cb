/**
 * Partial and node-positioned loads, spring supports, shear deformation and self-weight, each
 * against a closed form written out beside it (citations "(from memory)": the books could not be
 * opened while writing these tests).
 */
import { describe, expect, it } from "vitest";
import { STANDARD_GRAVITY_M_PER_S2 } from "../../../../../lib/engine/model";
import { createCaseFactors, deflectionAt, findSpanExtreme, rotationAt, solveMember } from "../../../../../lib/engine/solver";
import { EI, E_MPA, I_MM4, createMember, createSpans, createSupports, expectRelative, getExtreme, solveCase } from "./fixtures";

const L = 6000;
const w = 12;
const P = 25_000;

/** AISC Manual Table 3-23, simple beam - concentrated load at any point (from memory). */
function deflectionUnderPointOnSimpleSpan(x: number, loadAt: number, p: number, length: number): number {
  if (x <= loadAt) {
    const b = length - loadAt;
    return (p * b * x * (length * length - b * b - x * x)) / (6 * EI * length);
  }
  const a = loadAt;
  const xr = length - x;
  return (p * a * xr * (length * length - a * a - xr * xr)) / (6 * EI * length);
}

// 5-point Gauss-Legendre (abscissae and weights from memory, Abramowitz & Stegun Table 25.4)
const GAUSS_X = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
const GAUSS_W = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];

/** Superposition: integral of the point-load formula over [c, d] (split at x, exact for cubics). */
function deflectionUnderPartialUniform(x: number, c: number, d: number, wLoad: number, length: number): number {
  const pieces = x > c && x < d ? [[c, x], [x, d]] : [[c, d]];
  let total = 0;
  for (const [lo, hi] of pieces as [number, number][]) {
    const half = (hi - lo) / 2;
    GAUSS_X.forEach((g, k) => {
      total += GAUSS_W[k]! * half * deflectionUnderPointOnSimpleSpan(x, lo + half * (1 + g), wLoad, length);
    });
  }
  return total;
}

describe("partial loads and loads at nodes", () => {
  it("partial uniform load on a simple span matches the superposed point-load formula", () => {
    const c = 1200;
    const d = 3900;
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w, startMm: c, endMm: d }]);
    const { solution, factors } = solveCase(member);
    for (const x of [500, 1200, 2000, 3000, 3900, 5200]) {
      expectRelative(deflectionAt(solution, factors, x), deflectionUnderPartialUniform(x, c, d, w, L));
    }
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, deflectionUnderPartialUniform(extreme.atMm, c, d, w, L));
    // the maximum is a stationary point: nothing 1e-4 L either side is larger
    for (const dx of [-1e-4 * L, 1e-4 * L]) {
      expect(deflectionUnderPartialUniform(extreme.atMm + dx, c, d, w, L)).toBeLessThan(extreme.deflectionMm);
    }
  });

  it("a trapezoidal load on a sub-range equals a uniform plus a triangle (superposition)", () => {
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "linear", loadCase: "A", startMm: 1000, endMm: 5000, wStartNPerMm: 4, wEndNPerMm: 10 }]);
    const parts = createMember(createSpans([L]), createSupports("pinned", "roller"), [
      { kind: "uniform", loadCase: "A", wNPerMm: 4, startMm: 1000, endMm: 5000 },
      { kind: "linear", loadCase: "A", startMm: 1000, endMm: 5000, wStartNPerMm: 0, wEndNPerMm: 6 },
    ]);
    const a = solveCase(member);
    const b = solveCase(parts);
    for (const x of [700, 2500, 4400]) expectRelative(deflectionAt(a.solution, a.factors, x), deflectionAt(b.solution, b.factors, x), 1e-12);
    // total load check against the uniform part computed by formula above
    const uniformPart = deflectionUnderPartialUniform(2500, 1000, 5000, 4, L);
    expect(deflectionAt(a.solution, a.factors, 2500)).toBeGreaterThan(uniformPart);
  });

  it("a point load on an unsupported interior node gives the simple-span formula PL^3/(48EI)", () => {
    // AISC Manual Table 3-23, simple beam - concentrated load at center (from memory); the span
    // is modelled as two segments with a free node between them.
    const member = createMember(createSpans([L / 2, L / 2]), createSupports("pinned", "free", "roller"), [{ kind: "point", loadCase: "A", atMm: L / 2, pN: P }]);
    const { solution, factors } = solveCase(member);
    expectRelative(deflectionAt(solution, factors, L / 2), (P * L ** 3) / (48 * EI));
    expectRelative(findSpanExtreme(solution, factors, 0).deflectionMm, (P * L ** 3) / (48 * EI));
  });

  it("a couple on an interior node matches the midspan-couple formula", () => {
    // Gere & Goodno, Appendix, simple beam with couple M0 at midspan (from memory):
    // v = -M0 x (L^2/4 - x^2) / (6 E I L), x <= L/2
    const M = 3.0e7;
    const member = createMember(createSpans([L / 2, L / 2]), createSupports("pinned", "free", "roller"), [{ kind: "moment", loadCase: "A", atMm: L / 2, mNmm: M }]);
    const { solution, factors } = solveCase(member);
    const x = 0.2 * L;
    expectRelative(deflectionAt(solution, factors, x), (-M * x * ((L * L) / 4 - x * x)) / (6 * EI * L));
    expectRelative(deflectionAt(solution, factors, L - x), (M * x * ((L * L) / 4 - x * x)) / (6 * EI * L));
  });

  it("a point load directly over an interior support deflects nothing", () => {
    const member = createMember(createSpans([L, L]), createSupports("pinned", "pinned", "pinned"), [{ kind: "point", loadCase: "A", atMm: L, pN: P }]);
    const { solution, factors } = solveCase(member);
    for (const x of [1000, 6000, 9000]) expect(deflectionAt(solution, factors, x)).toBe(0);
  });
});

describe("spring supports", () => {
  it("a span on two equal springs: rigid settlement w L/(2k) plus bending", () => {
    // statics (common practice): each spring carries wL/2; bending from AISC Manual Table 3-23,
    // simple beam - uniformly distributed load (from memory)
    const k = 2_000; // N/mm
    const member = createMember(createSpans([L]), [{ kind: "spring", springNPerMm: k }, { kind: "spring", springNPerMm: k }], [{ kind: "uniform", loadCase: "A", wNPerMm: w }]);
    const { solution, factors } = solveCase(member);
    const settlement = (w * L) / (2 * k);
    for (const x of [0, 1500, 3000, 6000]) {
      expectRelative(deflectionAt(solution, factors, x), settlement + (w * x * (L ** 3 - 2 * L * x * x + x ** 3)) / (24 * EI));
    }
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, settlement + (5 * w * L ** 4) / (384 * EI));
    expect(Math.abs(extreme.atMm - L / 2)).toBeLessThanOrEqual(1e-6 * L);
  });

  it("a pinned end and a spring end under a centre point: P L^3/(48EI) + P/(4k) at midspan", () => {
    // statics (common practice): the spring carries P/2 and the chord rotates about the pin, so
    // midspan settles by half of P/(2k); bending from AISC Manual Table 3-23 centre point (from memory)
    const k = 5_000;
    const member = createMember(createSpans([L]), [{ kind: "pinned" }, { kind: "spring", springNPerMm: k }], [{ kind: "point", loadCase: "A", atMm: L / 2, pN: P }]);
    const { solution, factors } = solveCase(member);
    expectRelative(deflectionAt(solution, factors, L / 2), (P * L ** 3) / (48 * EI) + P / (4 * k));
    expectRelative(deflectionAt(solution, factors, L), P / (2 * k));
  });

  it("a cantilever propped by a tip spring: tip P/(k + 3EI/L^3)", () => {
    // tip stiffness of the cantilever 3EI/L^3 (AISC Manual Table 3-23, cantilever - load at free
    // end, from memory) acting in parallel with the spring
    const k = 800;
    const member = createMember(createSpans([L]), [{ kind: "fixed" }, { kind: "spring", springNPerMm: k }], [{ kind: "point", loadCase: "A", atMm: L, pN: P }]);
    expectRelative(getExtreme(member).deflectionMm, P / (k + (3 * EI) / L ** 3));
  });

  it("stiffer springs converge to pinned supports as settlement / bending = (wL/2k) / (5wL^4/384EI)", () => {
    const pinned = getExtreme(createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }])).deflectionMm;
    let previous = Infinity;
    for (const k of [1e3, 1e5, 1e7, 1e9]) {
      const sprung = getExtreme(createMember(createSpans([L]), [{ kind: "spring", springNPerMm: k }, { kind: "spring", springNPerMm: k }], [{ kind: "uniform", loadCase: "A", wNPerMm: w }])).deflectionMm;
      const excess = sprung / pinned - 1;
      expectRelative(excess, ((w * L) / (2 * k)) / ((5 * w * L ** 4) / (384 * EI)), 1e-6);
      expect(excess).toBeLessThan(previous);
      previous = excess;
    }
  });
});

describe("shear deformation (Timoshenko beam)", () => {
  const G = 77_000;
  const shearArea = 2_400; // k*A, mm^2
  const kGA = G * shearArea;
  const withShear = { includeShearDeformation: true };
  const spans = [{ lengthMm: L, eMpa: E_MPA, iMm4: I_MM4, gMpa: G, shearAreaMm2: shearArea }];

  it("simple span, uniform load: 5wL^4/(384EI) + wL^2/(8kGA)", () => {
    // bending: AISC Manual Table 3-23 (from memory); shear term: Timoshenko and Gere, Mechanics of Materials, Timoshenko beam
    // theory (from memory), v_s = M(x)/(kGA) with M(L/2) = wL^2/8
    const member = createMember(spans, createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }], withShear);
    const { solution, factors } = solveCase(member);
    expectRelative(findSpanExtreme(solution, factors, 0).deflectionMm, (5 * w * L ** 4) / (384 * EI) + (w * L * L) / (8 * kGA));
    const x = 1700;
    expectRelative(deflectionAt(solution, factors, x), (w * x * (L ** 3 - 2 * L * x * x + x ** 3)) / (24 * EI) + (w * x * (L - x)) / (2 * kGA));
  });

  it("simple span, centre point: PL^3/(48EI) + PL/(4kGA)", () => {
    // shear term from M(L/2)/(kGA) = (PL/4)/(kGA) (Timoshenko beam theory, from memory)
    const member = createMember(spans, createSupports("pinned", "roller"), [{ kind: "point", loadCase: "A", atMm: L / 2, pN: P }], withShear);
    expectRelative(getExtreme(member).deflectionMm, (P * L ** 3) / (48 * EI) + (P * L) / (4 * kGA));
  });

  it("cantilever, tip point: PL^3/(3EI) + PL/(kGA)", () => {
    // Roark's Formulas, shear deflection of a cantilever, from memory
    const member = createMember(spans, createSupports("fixed", "free"), [{ kind: "point", loadCase: "A", atMm: L, pN: P }], withShear);
    expectRelative(getExtreme(member).deflectionMm, (P * L ** 3) / (3 * EI) + (P * L) / kGA);
  });

  it("fixed-fixed, uniform load (indeterminate): wL^4/(384EI) + wL^2/(8kGA)", () => {
    // symmetry keeps the end moments at wL^2/12, so the shear part is the simple span's
    // (Timoshenko beam theory, from memory)
    const member = createMember(spans, createSupports("fixed", "fixed"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }], withShear);
    const { solution, factors } = solveCase(member);
    expectRelative(deflectionAt(solution, factors, L / 2), (w * L ** 4) / (384 * EI) + (w * L * L) / (8 * kGA));
    expect(Math.abs(rotationAt(solution, factors, 0))).toBe(0);
  });
});

describe("self-weight", () => {
  it("adds A rho g to the named case on every span", () => {
    // mass per length A * rho (mm^2 * kg/m^3 * 1e-9 = kg/mm), weight times g_n (NIST SP 330, from
    // memory: 9.80665 m/s^2); deflection AISC Manual Table 3-23 simple beam uniform (from memory)
    const area = 5_380;
    const density = 7_850;
    const member = createMember([{ lengthMm: L, eMpa: E_MPA, iMm4: I_MM4, areaMm2: area, densityKgPerM3: density }], createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: w }], { selfWeightCase: "dead" });
    const solution = solveMember(member);
    const selfWeight = area * density * 1e-9 * STANDARD_GRAVITY_M_PER_S2;
    const factors = createCaseFactors(solution, { dead: 1 });
    expectRelative(findSpanExtreme(solution, factors, 0).deflectionMm, (5 * (w + selfWeight) * L ** 4) / (384 * EI));
    const liveOnly = createCaseFactors(solution, { live: 1 });
    expect(findSpanExtreme(solution, liveOnly, 0).deflectionMm).toBe(0);
  });
});
