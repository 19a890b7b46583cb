/**
 * Largest |p(t)| of a real polynomial of degree <= 5 on [0, len], by isolating the real roots of
 * p' with the derivative sequence: the roots of p^(k+1) split [0, len] into intervals on which
 * p^(k) is monotone, so each holds at most one root, found by safeguarded Newton iteration.
 * Exact up to round-off, no sampling, no allocation (module scratch buffers).
 */
const MAX_DEGREE = 5;
const derivativeBuffers: Float64Array[] = [];
const rootBuffers: Float64Array[] = [];
for (let level = 0; level <= MAX_DEGREE + 1; level++) {
  derivativeBuffers.push(new Float64Array(MAX_DEGREE + 1));
  rootBuffers.push(new Float64Array(MAX_DEGREE + 1));
}

/** p(t) by Horner's rule, ascending coefficients. */
export function evaluatePolynomial(coef: Float64Array, degree: number, t: number): number {
  let value = coef[degree] as number;
  for (let k = degree - 1; k >= 0; k--) value = value * t + (coef[k] as number);
  return value;
}

function evaluateDerivative(coef: Float64Array, degree: number, t: number): number {
  let value = degree * (coef[degree] as number);
  for (let k = degree - 1; k >= 1; k--) value = value * t + k * (coef[k] as number);
  return value;
}

/**
 * The single root of a polynomial monotone on [a, b] with f(a), f(b) of opposite signs:
 * Newton steps kept inside the shrinking bracket, bisection when a step leaves it. Stops at a
 * step below 1e-13 of the interval scale, far finer than any position the checks report.
 */
function findBracketedRoot(coef: Float64Array, degree: number, a: number, b: number, fa: number, fb: number, scale: number): number {
  let lo = a;
  let hi = b;
  // regula falsi start: close to the root when the polynomial is nearly linear here
  let x = a - (fa * (b - a)) / (fb - fa);
  if (!(x > lo && x < hi)) x = 0.5 * (a + b);
  const tolerance = 1e-13 * scale;
  for (let iteration = 0; iteration < 100; iteration++) {
    const fx = evaluatePolynomial(coef, degree, x);
    if (fx === 0) return x;
    if ((fx < 0) === (fa < 0)) lo = x;
    else hi = x;
    const slope = evaluateDerivative(coef, degree, x);
    let next = slope !== 0 ? x - fx / slope : Number.NaN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= tolerance || hi - lo <= tolerance) return next;
    x = next;
  }
  return x;
}

/** Real roots of c0 + c1 t + c2 t^2 strictly inside (lo, hi), ascending, stable formula. */
function findQuadraticRoots(c0: number, c1: number, c2: number, lo: number, hi: number, roots: Float64Array): number {
  const discriminant = c1 * c1 - 4 * c2 * c0;
  if (discriminant < 0) return 0;
  const q = -0.5 * (c1 + (c1 >= 0 ? 1 : -1) * Math.sqrt(discriminant));
  let r1 = q / c2;
  let r2 = q !== 0 ? c0 / q : r1;
  if (r1 > r2) {
    const swap = r1;
    r1 = r2;
    r2 = swap;
  }
  let count = 0;
  if (r1 > lo && r1 < hi) roots[count++] = r1;
  if (r2 > lo && r2 < hi && r2 !== r1) roots[count++] = r2;
  return count;
}

/** Writes the roots of the polynomial strictly inside (lo, hi) to rootBuffers[level], ascending. */
function findRootsAtLevel(coef: Float64Array, degreeIn: number, lo: number, hi: number, level: number): number {
  let degree = degreeIn;
  while (degree > 0 && coef[degree] === 0) degree--;
  const roots = rootBuffers[level] as Float64Array;
  if (degree === 0) return 0;
  if (degree === 1) {
    const root = -(coef[0] as number) / (coef[1] as number);
    if (root > lo && root < hi) {
      roots[0] = root;
      return 1;
    }
    return 0;
  }
  if (degree === 2) return findQuadraticRoots(coef[0] as number, coef[1] as number, coef[2] as number, lo, hi, roots);
  const derivative = derivativeBuffers[level + 1] as Float64Array;
  for (let k = 1; k <= degree; k++) derivative[k - 1] = k * (coef[k] as number);
  const criticalCount = findRootsAtLevel(derivative, degree - 1, lo, hi, level + 1);
  const critical = rootBuffers[level + 1] as Float64Array;
  let count = 0;
  let a = lo;
  let fa = evaluatePolynomial(coef, degree, a);
  for (let i = 0; i <= criticalCount; i++) {
    const b = i < criticalCount ? (critical[i] as number) : hi;
    const fb = evaluatePolynomial(coef, degree, b);
    if (fb === 0 && b < hi) roots[count++] = b;
    else if (fa !== 0 && fb !== 0 && (fa < 0) !== (fb < 0)) roots[count++] = findBracketedRoot(coef, degree, a, b, fa, fb, hi - lo);
    a = b;
    fa = fb;
  }
  return count;
}

export interface AbsMaxResult {
  t: number;
  value: number;
}

/**
 * Sets `out` to the point of [0, len] where |p| is largest (first one on ties) and p there.
 * `coef` holds ascending coefficients of degree `degree` <= 5.
 */
export function findPolynomialAbsMax(coef: Float64Array, degreeIn: number, len: number, out: AbsMaxResult): AbsMaxResult {
  let degree = degreeIn;
  while (degree > 0 && coef[degree] === 0) degree--;
  let bestT = 0;
  let bestValue = coef[0] as number;
  const derivative = derivativeBuffers[0] as Float64Array;
  for (let k = 1; k <= degree; k++) derivative[k - 1] = k * (coef[k] as number);
  const count = degree >= 1 ? findRootsAtLevel(derivative, degree - 1, 0, len, 0) : 0;
  const roots = rootBuffers[0] as Float64Array;
  for (let i = 0; i < count; i++) {
    const t = roots[i] as number;
    const value = evaluatePolynomial(coef, degree, t);
    if (Math.abs(value) > Math.abs(bestValue)) {
      bestT = t;
      bestValue = value;
    }
  }
  const endValue = evaluatePolynomial(coef, degree, len);
  if (Math.abs(endValue) > Math.abs(bestValue)) {
    bestT = len;
    bestValue = endValue;
  }
  out.t = bestT;
  out.value = bestValue;
  return out;
}

/**
 * Writes the real roots of p strictly inside (0, len), ascending, to out[outOffset...] and returns
 * how many (at most the degree, <= 5). Same isolation as findPolynomialAbsMax: exact up to
 * round-off, no sampling. A polynomial that is identically zero has no roots here.
 */
export function findPolynomialRoots(coef: Float64Array, degree: number, len: number, out: Float64Array, outOffset: number): number {
  const count = findRootsAtLevel(coef, degree, 0, len, 0);
  const roots = rootBuffers[0] as Float64Array;
  for (let i = 0; i < count; i++) out[outOffset + i] = roots[i] as number;
  return count;
}

/**
 * Sets `out` to the point of [0, len] where sign * p is largest (first one on ties; sign is +1
 * or -1) and p there: the ends and the real roots of p' are the only candidates.
 */
export function findPolynomialSignedMax(coef: Float64Array, degreeIn: number, len: number, sign: number, out: AbsMaxResult): AbsMaxResult {
  let degree = degreeIn;
  while (degree > 0 && coef[degree] === 0) degree--;
  let bestT = 0;
  let bestValue = coef[0] as number;
  const derivative = derivativeBuffers[0] as Float64Array;
  for (let k = 1; k <= degree; k++) derivative[k - 1] = k * (coef[k] as number);
  const count = degree >= 1 ? findRootsAtLevel(derivative, degree - 1, 0, len, 0) : 0;
  const roots = rootBuffers[0] as Float64Array;
  for (let i = 0; i < count; i++) {
    const t = roots[i] as number;
    const value = evaluatePolynomial(coef, degree, t);
    if (sign * value > sign * bestValue) {
      bestT = t;
      bestValue = value;
    }
  }
  const endValue = evaluatePolynomial(coef, degree, len);
  if (sign * endValue > sign * bestValue) {
    bestT = len;
    bestValue = endValue;
  }
  out.t = bestT;
  out.value = bestValue;
  return out;
}
