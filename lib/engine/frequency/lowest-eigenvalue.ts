import { factorBandedLdl, HALF_BANDWIDTH, solveBandedLdl } from "../solver/banded-ldl";

// read once: an imported binding read or called inside a loop costs a getter call under some loaders
const BAND = HALF_BANDWIDTH;
const ROW = BAND + 1;
const factorBand = factorBandedLdl;
const solveBand = solveBandedLdl;

/** The certificate: K - rho (1 - VERIFY_GAP) M must be positive definite. */
const VERIFY_GAP = 1e-7;
/** Bisection on the eigenvalue (fallback) stops when hi / lo is below 1 + BISECTION_RATIO. */
const BISECTION_RATIO = 1e-10;
const MAX_ITERATIONS = 400;
const MAX_BISECTIONS = 200;

/** y = A x for a symmetric band (upper rows of 4). */
function multiplyBand(band: Float64Array, size: number, x: Float64Array, y: Float64Array): void {
  for (let i = 0; i < size; i++) y[i] = 0;
  for (let i = 0; i < size; i++) {
    const xi = x[i] as number;
    let sum = (band[i * ROW] as number) * xi;
    const kEnd = i + BAND < size - 1 ? BAND : size - 1 - i;
    for (let k = 1; k <= kEnd; k++) {
      const a = band[i * ROW + k] as number;
      sum += a * (x[i + k] as number);
      y[i + k] = (y[i + k] as number) + a * xi;
    }
    y[i] = (y[i] as number) + sum;
  }
}

function dot(a: Float64Array, b: Float64Array, size: number): number {
  let sum = 0;
  for (let i = 0; i < size; i++) sum += (a[i] as number) * (b[i] as number);
  return sum;
}

/** out = LDL^T factor of K - sigma M; true when it is positive definite (no eigenvalue below sigma). */
function factorShifted(stiffness: Float64Array, mass: Float64Array, size: number, sigma: number, out: Float64Array): boolean {
  for (let i = 0; i < size * ROW; i++) out[i] = (stiffness[i] as number) - sigma * (mass[i] as number);
  return factorBand(out, size, 0) < 0;
}

interface Workspace {
  factor: Float64Array;
  trial: Float64Array;
  mx: Float64Array;
  y: Float64Array;
  my: Float64Array;
}

const workspace: Workspace = { factor: new Float64Array(64), trial: new Float64Array(64), mx: new Float64Array(16), y: new Float64Array(16), my: new Float64Array(16) };

/** The shared scratch, grown when a member needs more (the engine runs one member at a time). */
function getWorkspace(size: number): Workspace {
  if (workspace.mx.length < size) {
    workspace.factor = new Float64Array(2 * size * ROW);
    workspace.trial = new Float64Array(2 * size * ROW);
    workspace.mx = new Float64Array(2 * size);
    workspace.y = new Float64Array(2 * size);
    workspace.my = new Float64Array(2 * size);
  }
  return workspace;
}

/**
 * Inverse iteration with a shift sigma kept below the lowest eigenvalue (each shift is accepted
 * only when K - sigma M is positive definite), from x; x becomes the M-normalised iterate.
 * Returns the last Rayleigh quotient, an upper bound of the lowest eigenvalue, or NaN when the
 * start vector carries no mass.
 */
function iterate(stiffness: Float64Array, mass: Float64Array, size: number, x: Float64Array, work: Workspace, startSigma: number, tolerance: number): number {
  let sigma = startSigma;
  let rho = Number.POSITIVE_INFINITY;
  let failedGap = 0;
  multiplyBand(mass, size, x, work.mx);
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    for (let i = 0; i < size; i++) work.y[i] = work.mx[i] as number;
    solveBand(work.factor, size, work.y);
    multiplyBand(mass, size, work.y, work.my);
    const yMy = dot(work.y, work.my, size);
    if (!(yMy > 0)) return Number.NaN;
    // (K - sigma M) y = M x, so y^T K y / y^T M y = sigma + y^T M x / y^T M y
    const next = sigma + dot(work.y, work.mx, size) / yMy;
    const scale = 1 / Math.sqrt(yMy);
    // the next M x is M y scaled: no second product
    for (let i = 0; i < size; i++) {
      x[i] = (work.y[i] as number) * scale;
      work.mx[i] = (work.my[i] as number) * scale;
    }
    const change = Math.abs(rho - next) / next;
    rho = next;
    if (change <= tolerance) break;
    if (change < 0.02) {
      // a shift just below rho speeds convergence; a refused shift shows rho is still further off
      const gap = Math.min(0.5, Math.max(1e-4, 10 * change, 3 * failedGap));
      const trialSigma = rho * (1 - gap);
      if (rho - sigma > 3 * (rho - trialSigma)) {
        if (factorShifted(stiffness, mass, size, trialSigma, work.trial)) {
          const previous = work.factor;
          work.factor = work.trial;
          work.trial = previous;
          sigma = trialSigma;
          failedGap = 0;
        } else {
          failedGap = gap;
        }
      }
    }
  }
  return rho;
}

/** Largest sigma (to BISECTION_RATIO) below hi at which K - sigma M is still positive definite. */
function bisectLowest(stiffness: Float64Array, mass: Float64Array, size: number, hi: number, work: Workspace): number {
  let upper = hi;
  let lower = hi / 2;
  let steps = 0;
  while (!factorShifted(stiffness, mass, size, lower, work.trial) && steps < MAX_BISECTIONS) {
    upper = lower;
    lower /= 2;
    steps += 1;
  }
  while (upper / lower > 1 + BISECTION_RATIO && steps < MAX_BISECTIONS) {
    const middle = Math.sqrt(lower * upper);
    if (factorShifted(stiffness, mass, size, middle, work.trial)) lower = middle;
    else upper = middle;
    steps += 1;
  }
  return lower;
}

/** How findLowestEigenvalue is asked. */
export interface EigenvalueOptions {
  /** Relative change of the Rayleigh quotient between iterations at which the iteration stops. */
  tolerance: number;
  /** Prove that no eigenvalue lies below the result (one more factorisation; bisect if one does). */
  certify: boolean;
  /** A first shift to try, believed to lie below lambda_1 (tested; 0 when it does not). */
  trialShift: number;
}

/**
 * Lowest eigenvalue lambda_1 of K x = lambda M x, K symmetric positive definite and M symmetric
 * positive semi-definite, both banded (banded-ldl layout). Inverse iteration with shifts (Bathe,
 * Finite Element Procedures, inverse and shifted inverse iteration, from memory); every shift is
 * accepted only when K - sigma M is positive definite, so it stays below lambda_1. With
 * options.certify, a certificate by Sylvester's law of inertia: K - rho (1 - 1e-7) M positive
 * definite means no eigenvalue lies below, so lambda_1 is within 1e-7 below rho. When the
 * certificate fails (the iterate found a higher mode) lambda_1 is bisected with the same
 * positive-definiteness test and that lower bound is returned (the iteration is repeated from
 * just below it for the mode). x: start vector in (constrained DOFs zero), the M-normalised mode
 * out. Returns NaN when K is not positive definite or x carries no mass. Without certify the
 * result is the Rayleigh quotient of the converged iterate (lambda_1 unless x missed the mode).
 */
export function findLowestEigenvalue(stiffness: Float64Array, mass: Float64Array, size: number, x: Float64Array, options: EigenvalueOptions): number {
  const work = getWorkspace(size);
  let sigma = options.trialShift;
  if (!(sigma > 0) || !factorShifted(stiffness, mass, size, sigma, work.factor)) {
    sigma = 0;
    if (!factorShifted(stiffness, mass, size, 0, work.factor)) return Number.NaN;
  }
  const rho = iterate(stiffness, mass, size, x, work, sigma, options.tolerance);
  if (!Number.isFinite(rho)) return Number.NaN;
  if (!options.certify || factorShifted(stiffness, mass, size, rho * (1 - VERIFY_GAP), work.trial)) return rho;
  const lower = bisectLowest(stiffness, mass, size, rho * (1 - VERIFY_GAP), work);
  const below = lower * (1 - 1e-6);
  if (!factorShifted(stiffness, mass, size, below, work.factor)) return lower;
  // a fresh, generic start: the old iterate leaned to the higher mode
  for (let i = 0; i < size; i++) x[i] = (x[i] as number) + 0.5 * Math.sin(2.399963 * i + 0.5) * ((mass[i * ROW] as number) > 0 ? 1 : 0);
  iterate(stiffness, mass, size, x, work, below, options.tolerance);
  return lower;
}
