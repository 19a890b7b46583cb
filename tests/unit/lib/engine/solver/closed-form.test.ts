/**
 * The solver against closed-form beam formulas (uniform EI, Euler-Bernoulli). Every expected value
 * is the published formula written out, with its source beside it. None of the books could be
 * opened while writing these tests, so every citation is marked "(from memory)"; each formula was
 * also re-derived by integrating M/EI before use.
 */
import { describe, expect, it } from "vitest";
import { deflectionAt, findSpanExtreme, rotationAt } from "../../../../../lib/engine/solver";
import { EI, createMember, createSpans, createSupports, expectRelative, getExtreme, solveCase } from "./fixtures";

const L = 6000; // mm
const w = 12; // N/mm
const P = 25_000; // N

describe("simply supported span", () => {
  const uniform = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]);

  it("uniform load: midspan maximum 5wL^4/(384EI)", () => {
    // AISC Manual Table 3-23, simple beam - uniformly distributed load (from memory)
    const extreme = getExtreme(uniform);
    expectRelative(extreme.deflectionMm, (5 * w * L ** 4) / (384 * EI));
    expect(Math.abs(extreme.atMm - L / 2)).toBeLessThanOrEqual(1e-6 * L);
  });

  it("uniform load: end slopes wL^3/(24EI), deflection along the span", () => {
    // Gere & Goodno, Appendix, simple beam with uniform load (from memory): theta_A = wL^3/(24EI);
    // AISC Manual Table 3-23 (from memory): delta_x = w x (L^3 - 2 L x^2 + x^3) / (24 EI)
    const { solution, factors } = solveCase(uniform);
    expectRelative(rotationAt(solution, factors, 0), (w * L ** 3) / (24 * EI));
    expectRelative(rotationAt(solution, factors, L), -(w * L ** 3) / (24 * EI));
    for (const x of [0.1 * L, 0.25 * L, 0.7 * L, 0.93 * L]) {
      expectRelative(deflectionAt(solution, factors, x), (w * x * (L ** 3 - 2 * L * x * x + x ** 3)) / (24 * EI));
    }
  });

  it("centre point load: PL^3/(48EI), end slope PL^2/(16EI)", () => {
    // AISC Manual Table 3-23, simple beam - concentrated load at center (from memory);
    // Gere & Goodno, Appendix (from memory): theta_A = P L^2 / (16 EI)
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "point", loadCase: "A", atMm: L / 2, pN: P }]);
    const { solution, factors } = solveCase(member);
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, (P * L ** 3) / (48 * EI));
    expect(Math.abs(extreme.atMm - L / 2)).toBeLessThanOrEqual(1e-6 * L);
    expectRelative(rotationAt(solution, factors, 0), (P * L ** 2) / (16 * EI));
  });

  it("off-centre point load: under the load Pa^2b^2/(3EIL), maximum and its position", () => {
    // AISC Manual Table 3-23, simple beam - concentrated load at any point (from memory):
    // delta_a = P a^2 b^2 / (3 E I L); for a > b, delta_max = P a b (a + 2b) sqrt(3a(a + 2b)) / (27 E I L)
    // at x = sqrt(a (a + 2b) / 3) from the left support.
    const a = 4200;
    const b = L - a;
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "point", loadCase: "A", atMm: a, pN: P }]);
    const { solution, factors } = solveCase(member);
    expectRelative(deflectionAt(solution, factors, a), (P * a * a * b * b) / (3 * EI * L));
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, (P * a * b * (a + 2 * b) * Math.sqrt(3 * a * (a + 2 * b))) / (27 * EI * L));
    expect(Math.abs(extreme.atMm - Math.sqrt((a * (a + 2 * b)) / 3))).toBeLessThanOrEqual(1e-6 * L);
  });

  it("load increasing linearly to one end (triangle): maximum 0.01304 W L^3/EI at L sqrt(1 - sqrt(8/15))", () => {
    // AISC Manual Table 3-23, simple beam - load increasing uniformly to one end (from memory):
    // delta_x = W x (3x^4 - 10 L^2 x^2 + 7 L^4) / (180 E I L^2), W = total load; the maximum is at
    // the root of 15x^4 - 30 L^2 x^2 + 7 L^4 = 0, x = L sqrt(1 - sqrt(8/15)) = 0.5193 L.
    const wMax = 20;
    const W = (wMax * L) / 2;
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "linear", loadCase: "A", startMm: 0, endMm: L, wStartNPerMm: 0, wEndNPerMm: wMax }]);
    const { solution, factors } = solveCase(member);
    const getDeflection = (x: number): number => (W * x * (3 * x ** 4 - 10 * L * L * x * x + 7 * L ** 4)) / (180 * EI * L * L);
    const xMax = L * Math.sqrt(1 - Math.sqrt(8 / 15));
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, getDeflection(xMax));
    expect(Math.abs(extreme.atMm - xMax)).toBeLessThanOrEqual(1e-6 * L);
    expectRelative(extreme.deflectionMm, (0.01304 * W * L ** 3) / EI, 5e-4); // the table prints the coefficient to 4 figures
    for (const x of [0.2 * L, 0.8 * L]) expectRelative(deflectionAt(solution, factors, x), getDeflection(x));
  });

  it("couple at the left end: theta_A = M L/(3EI), theta_B = M L/(6EI), maximum M L^2/(9 sqrt3 EI)", () => {
    // Gere & Goodno, Appendix, simple beam with couple M0 at the left support (from memory):
    // v = M0 x (L - x)(2L - x) / (6 E I L), max at x = L (1 - 1/sqrt(3)).
    const M = 4.0e7; // N*mm, clockwise
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "moment", loadCase: "A", atMm: 0, mNmm: M }]);
    const { solution, factors } = solveCase(member);
    expectRelative(rotationAt(solution, factors, 0), (M * L) / (3 * EI));
    expectRelative(rotationAt(solution, factors, L), -(M * L) / (6 * EI));
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, (M * L * L) / (9 * Math.sqrt(3) * EI));
    expect(Math.abs(extreme.atMm - L * (1 - 1 / Math.sqrt(3)))).toBeLessThanOrEqual(1e-6 * L);
    const x = 0.3 * L;
    expectRelative(deflectionAt(solution, factors, x), (M * x * (L - x) * (2 * L - x)) / (6 * EI * L));
  });

  it("couple at midspan: antisymmetric shape, extremes M L^2/(72 sqrt3 EI) at L/(2 sqrt3) from either end", () => {
    // Gere & Goodno, Appendix, simple beam with couple M0 at distance a (from memory), a = L/2:
    // v = -M0 x (L^2/4 - x^2) / (6 E I L) for x <= L/2 (negative = upward here), zero at midspan.
    const M = 4.0e7;
    const member = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "moment", loadCase: "A", atMm: L / 2, mNmm: M }]);
    const { solution, factors } = solveCase(member);
    const getDeflection = (x: number): number => (-M * x * (L * L / 4 - x * x)) / (6 * EI * L);
    for (const x of [0.1 * L, 0.3 * L, 0.45 * L]) {
      expectRelative(deflectionAt(solution, factors, x), getDeflection(x));
      expectRelative(deflectionAt(solution, factors, L - x), -getDeflection(x));
    }
    expect(Math.abs(deflectionAt(solution, factors, L / 2))).toBeLessThanOrEqual(1e-12 * Math.abs(getDeflection(L / 4)));
    const extreme = findSpanExtreme(solution, factors, 0);
    const expectedMagnitude = (M * L * L) / (72 * Math.sqrt(3) * EI);
    expectRelative(Math.abs(extreme.deflectionMm), expectedMagnitude);
    const xLeft = L / (2 * Math.sqrt(3));
    const expectedX = extreme.deflectionMm < 0 ? xLeft : L - xLeft;
    expect(Math.abs(extreme.atMm - expectedX)).toBeLessThanOrEqual(1e-6 * L);
  });
});

describe("cantilever", () => {
  it("uniform load: tip wL^4/(8EI), tip slope wL^3/(6EI)", () => {
    // AISC Manual Table 3-23, cantilever beam - uniformly distributed load (from memory);
    // Gere & Goodno, Appendix (from memory): theta_B = w L^3 / (6 E I)
    const member = createMember(createSpans([L]), createSupports("fixed", "free"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]);
    const { solution, factors } = solveCase(member);
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, (w * L ** 4) / (8 * EI));
    expect(Math.abs(extreme.atMm - L)).toBeLessThanOrEqual(1e-6 * L);
    expectRelative(rotationAt(solution, factors, L), (w * L ** 3) / (6 * EI));
    // AISC (from memory): delta_x = w (x'^4 - 4 L^3 x' + 3 L^4) / (24 E I), x' from the free end
    const xFree = 0.35 * L;
    expectRelative(deflectionAt(solution, factors, L - xFree), (w * (xFree ** 4 - 4 * L ** 3 * xFree + 3 * L ** 4)) / (24 * EI));
  });

  it("tip point load, fixed at the right: tip PL^3/(3EI), tip slope PL^2/(2EI)", () => {
    // AISC Manual Table 3-23, cantilever beam - concentrated load at free end (from memory)
    const member = createMember(createSpans([L]), createSupports("free", "fixed"), [{ kind: "point", loadCase: "A", atMm: 0, pN: P }]);
    const { solution, factors } = solveCase(member);
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, (P * L ** 3) / (3 * EI));
    expect(extreme.atMm).toBeLessThanOrEqual(1e-6 * L);
    // free end on the left: the beam rises to the right, a counterclockwise (negative) rotation
    expectRelative(rotationAt(solution, factors, 0), -(P * L * L) / (2 * EI));
  });
});

describe("fixed ends and propped cantilever", () => {
  it("fixed-fixed, uniform load: wL^4/(384EI) at midspan", () => {
    // AISC Manual Table 3-23, beam fixed at both ends - uniformly distributed load (from memory)
    const extreme = getExtreme(createMember(createSpans([L]), createSupports("fixed", "fixed"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]));
    expectRelative(extreme.deflectionMm, (w * L ** 4) / (384 * EI));
    expect(Math.abs(extreme.atMm - L / 2)).toBeLessThanOrEqual(1e-6 * L);
  });

  it("fixed-fixed, centre point load: PL^3/(192EI)", () => {
    // AISC Manual Table 3-23, beam fixed at both ends - concentrated load at center (from memory)
    const extreme = getExtreme(createMember(createSpans([L]), createSupports("fixed", "fixed"), [{ kind: "point", loadCase: "A", atMm: L / 2, pN: P }]));
    expectRelative(extreme.deflectionMm, (P * L ** 3) / (192 * EI));
  });

  it("propped cantilever, uniform load: maximum at x = L(1 + sqrt33)/16 from the pinned end (about 0.4215L, wL^4/185EI)", () => {
    // AISC Manual Table 3-23, beam fixed at one end, supported at other - uniform load (from
    // memory): delta_x = w x (L^3 - 3 L x^2 + 2 x^3) / (48 E I), x from the simple support.
    // d/dx = 0: 8x^3 - 9 L x^2 + L^3 = (x - L)(8x^2 - L x - L^2) = 0, so x = L (1 + sqrt 33) / 16.
    const getDeflection = (x: number): number => (w * x * (L ** 3 - 3 * L * x * x + 2 * x ** 3)) / (48 * EI);
    const xMax = (L * (1 + Math.sqrt(33))) / 16;
    const pinnedLeft = getExtreme(createMember(createSpans([L]), createSupports("pinned", "fixed"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]));
    expectRelative(pinnedLeft.deflectionMm, getDeflection(xMax));
    expect(Math.abs(pinnedLeft.atMm - xMax)).toBeLessThanOrEqual(1e-6 * L);
    expectRelative(pinnedLeft.deflectionMm, (w * L ** 4) / (185 * EI), 5e-3); // the table's rounded 185
    expect(Math.abs(xMax / L - 0.4215)).toBeLessThan(1e-4);
    const pinnedRight = getExtreme(createMember(createSpans([L]), createSupports("fixed", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]));
    expectRelative(pinnedRight.deflectionMm, getDeflection(xMax));
    expect(Math.abs(pinnedRight.atMm - (L - xMax))).toBeLessThanOrEqual(1e-6 * L);
  });
});

describe("continuous and overhanging members", () => {
  it("two equal spans, uniform load on both: each span deflects like a propped cantilever", () => {
    // AISC Manual Table 3-23, continuous beam - two equal spans - uniform load on both spans
    // (from memory): zero slope over the middle support, so each span is the propped case above.
    const getDeflection = (x: number): number => (w * x * (L ** 3 - 3 * L * x * x + 2 * x ** 3)) / (48 * EI);
    const xMax = (L * (1 + Math.sqrt(33))) / 16;
    const member = createMember(createSpans([L, L]), createSupports("pinned", "roller", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]);
    const { solution, factors } = solveCase(member);
    const left = findSpanExtreme(solution, factors, 0);
    const right = findSpanExtreme(solution, factors, 1);
    expectRelative(left.deflectionMm, getDeflection(xMax));
    expectRelative(right.deflectionMm, getDeflection(xMax));
    expect(Math.abs(left.atMm - xMax)).toBeLessThanOrEqual(1e-6 * L);
    expect(Math.abs(right.atMm - (2 * L - xMax))).toBeLessThanOrEqual(1e-6 * L);
    expect(Math.abs(rotationAt(solution, factors, L))).toBeLessThanOrEqual(1e-12 * ((w * L ** 3) / EI));
    expectRelative(deflectionAt(solution, factors, 0.3 * L), getDeflection(0.3 * L));
  });

  it("two equal spans, uniform load on one span: maximum 0.0092 wL^4/EI", () => {
    // AISC Manual Table 3-23, continuous beam - two equal spans - uniform load on one span (from
    // memory): delta_max = 0.0092 w L^4 / (E I) at 0.472 L from the outer support. Exact by
    // superposition (Gere & Goodno, Appendix, from memory): middle moment M = w L^2 / 16 hogging,
    // getDeflection(x) = w x (L^3 - 2 L x^2 + x^3)/(24EI) - M x (L^2 - x^2)/(6 E I L).
    const member = createMember(createSpans([L, L]), createSupports("pinned", "roller", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: w, startMm: 0, endMm: L }]);
    const { solution, factors } = solveCase(member);
    const M = (w * L * L) / 16;
    const getDeflection = (x: number): number => (w * x * (L ** 3 - 2 * L * x * x + x ** 3)) / (24 * EI) - (M * x * (L * L - x * x)) / (6 * EI * L);
    for (const x of [0.2 * L, 0.5 * L, 0.8 * L]) expectRelative(deflectionAt(solution, factors, x), getDeflection(x));
    const extreme = findSpanExtreme(solution, factors, 0);
    expectRelative(extreme.deflectionMm, getDeflection(extreme.atMm));
    expectRelative(extreme.deflectionMm, (0.0092 * w * L ** 4) / EI, 1e-2); // the table prints 2 figures
    expect(Math.abs(extreme.atMm / L - 0.472)).toBeLessThan(1e-3);
  });

  const l = 5000; // back span
  const a = 1500; // overhang

  it("overhang, uniform load on the overhang: tip w a^3 (4l + 3a)/(24EI)", () => {
    // AISC Manual Table 3-23, beam overhanging one support - uniform load on overhang (from memory)
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "A", wNPerMm: w, startMm: l, endMm: l + a }]);
    const { solution, factors } = solveCase(member);
    const tip = findSpanExtreme(solution, factors, 1);
    expectRelative(tip.deflectionMm, (w * a ** 3 * (4 * l + 3 * a)) / (24 * EI));
    expect(Math.abs(tip.atMm - (l + a))).toBeLessThanOrEqual(1e-6 * a);
    // back span lifts: end moment M = w a^2/2 on a simple span, v = -M x (l^2 - x^2)/(6 E I l)
    // (Gere & Goodno, Appendix, couple at the support, from memory), max at x = l/sqrt3
    const back = findSpanExtreme(solution, factors, 0);
    expectRelative(back.deflectionMm, -((w * a * a) / 2) * (l * l) / (9 * Math.sqrt(3) * EI));
    expect(Math.abs(back.atMm - l / Math.sqrt(3))).toBeLessThanOrEqual(1e-6 * l);
  });

  it("overhang, point load at the tip: tip P a^2 (l + a)/(3EI), back span 0.06415 P a l^2/EI upward at l/sqrt3", () => {
    // AISC Manual Table 3-23, beam overhanging one support - concentrated load at end of
    // overhang (from memory)
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "point", loadCase: "A", atMm: l + a, pN: P }]);
    const { solution, factors } = solveCase(member);
    expectRelative(findSpanExtreme(solution, factors, 1).deflectionMm, (P * a * a * (l + a)) / (3 * EI));
    const back = findSpanExtreme(solution, factors, 0);
    expectRelative(back.deflectionMm, -(P * a * l * l) / (9 * Math.sqrt(3) * EI));
    expectRelative(-back.deflectionMm, (0.06415 * P * a * l * l) / EI, 1e-4);
    expect(Math.abs(back.atMm - l / Math.sqrt(3))).toBeLessThanOrEqual(1e-6 * l);
  });

  it("overhang, uniform load over the whole length: tip w a (4a^2 l - l^3 + 3a^3)/(24EI)", () => {
    // AISC Manual Table 3-23, beam overhanging one support - uniformly distributed load (from memory)
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "A", wNPerMm: w }]);
    const { solution, factors } = solveCase(member);
    expectRelative(deflectionAt(solution, factors, l + a), (w * a * (4 * a * a * l - l ** 3 + 3 * a ** 3)) / (24 * EI));
  });
});
