/** The exact extremum search on polynomials, against roots known by construction. */
import { describe, expect, it } from "vitest";
import { findPolynomialAbsMax, findPolynomialRoots, findPolynomialSignedMax } from "../../../../../lib/engine/solver/poly-extrema";
import { factorBandedLdl, solveBandedLdl } from "../../../../../lib/engine/solver/banded-ldl";

/** Ascending coefficients of scale * product (t - r_i) (expansion by hand in the loop). */
function fromRoots(roots: number[], scale: number): Float64Array {
  let coef = [scale];
  for (const r of roots) {
    const next = new Array(coef.length + 1).fill(0);
    coef.forEach((c, k) => {
      next[k + 1] += c;
      next[k] -= r * c;
    });
    coef = next;
  }
  const out = new Float64Array(6);
  coef.forEach((c, k) => (out[k] = c));
  return out;
}

describe("findPolynomialAbsMax", () => {
  it("finds the interior maximum of a quartic whose derivative has three roots", () => {
    // p' = 4 (t-1)(t-2)(t-3.5): p = t^4 - (26/3) t^3 + 24.5 t^2 - 28 t; extremes at 1, 2, 3.5
    const coef = new Float64Array([0, -28, 24.5, -26 / 3, 1, 0]);
    const out = findPolynomialAbsMax(coef, 5, 3.6, { t: 0, value: 0 });
    const p = (t: number): number => t ** 4 - (26 / 3) * t ** 3 + 24.5 * t * t - 28 * t;
    const best = [0, 1, 2, 3.5, 3.6].reduce((a, b) => (Math.abs(p(b)) > Math.abs(p(a)) ? b : a));
    expect(out.t).toBeCloseTo(best, 12);
    expect(out.value).toBeCloseTo(p(best), 12);
  });

  it("handles close double roots of the derivative and end maxima", () => {
    const coef = fromRoots([0.5, 0.5000001, 2], -1); // cubic with a near-double root
    const out = findPolynomialAbsMax(coef, 5, 3, { t: 0, value: 0 });
    expect(out.t).toBe(3);
  });

  it("returns the constant for a constant polynomial", () => {
    const out = findPolynomialAbsMax(new Float64Array([2.5, 0, 0, 0, 0, 0]), 5, 10, { t: 0, value: 0 });
    expect(out).toEqual({ t: 0, value: 2.5 });
  });
});

describe("banded LDL^T", () => {
  it("solves a symmetric positive definite band system and flags a singular one", () => {
    // tridiagonal [2 -1; -1 2 -1; -1 2] x = [1 0 1] has x = [1 1 1]
    const band = new Float64Array([2, -1, 0, 0, 2, -1, 0, 0, 2, 0, 0, 0]);
    expect(factorBandedLdl(band, 3)).toBe(-1);
    const rhs = new Float64Array([1, 0, 1]);
    solveBandedLdl(band, 3, rhs);
    rhs.forEach((x) => expect(x).toBeCloseTo(1, 14));
    const singular = new Float64Array([1, -1, 0, 0, 1, 0, 0, 0]);
    expect(factorBandedLdl(singular, 2)).toBe(1);
  });
});

describe("findPolynomialRoots and findPolynomialSignedMax (pattern envelope)", () => {
  it("finds every root of a quintic inside the interval, ascending, and none outside", () => {
    const roots = [0.3, 1.1, 1.7, 2.9, 4.2];
    const out = new Float64Array(5);
    const count = findPolynomialRoots(fromRoots(roots, -2.5), 5, 3.5, out, 0);
    expect(count).toBe(4);
    roots.slice(0, 4).forEach((r, i) => expect(out[i]).toBeCloseTo(r, 11));
  });

  it("has no roots for a polynomial that only touches zero at an end", () => {
    // p = t (4 - t): zero at 0 and 4, positive between
    expect(findPolynomialRoots(new Float64Array([0, 4, -1, 0, 0, 0]), 5, 4, new Float64Array(5), 0)).toBe(0);
  });

  it("finds the largest and the smallest value separately", () => {
    // p = (t-1)(t-2)(t-3) on [0, 3.2]: minimum -6 at t = 0, local max at 2 - 1/sqrt(3)
    const coef = fromRoots([1, 2, 3], 1);
    const p = (t: number): number => (t - 1) * (t - 2) * (t - 3);
    const up = findPolynomialSignedMax(coef, 5, 3.2, 1, { t: 0, value: 0 });
    const tMax = 2 - 1 / Math.sqrt(3);
    expect(Math.max(p(tMax), p(3.2))).toBeCloseTo(up.value, 12);
    const down = findPolynomialSignedMax(coef, 5, 3.2, -1, { t: 0, value: 0 });
    expect(down.t).toBe(0);
    expect(down.value).toBeCloseTo(-6, 12);
  });
});
