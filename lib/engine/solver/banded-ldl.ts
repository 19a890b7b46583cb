/**
 * Symmetric banded LDL^T factorisation for the member stiffness matrix.
 *
 * The continuous-beam stiffness matrix with DOFs ordered (v0, theta0, v1, theta1, ...) couples
 * each DOF to at most the next three, so it is stored as rows of 4: band[i*4 + k] = A[i][i+k].
 * After factorisation band[i*4] holds d_i and band[j*4 + (i-j)] holds L[i][j] (i > j).
 */
export const HALF_BANDWIDTH = 3;
const ROW = HALF_BANDWIDTH + 1;

/**
 * Pivot floor relative to the DOF's own diagonal: for a symmetric positive definite matrix every
 * ratio d_i / A_ii lies in (0, 1]; a mechanism drives one to round-off level.
 */
export const SINGULAR_PIVOT_RATIO = 1e-10;

/**
 * Factorises the band in place. Returns -1 on success or the index of the first DOF whose pivot
 * is not positive beyond round-off (the matrix is singular or not positive definite).
 * minPivotRatio (default SINGULAR_PIVOT_RATIO) is the pivot floor relative to the diagonal; the
 * frequency search passes 0 to ask only whether K - sigma M is positive definite (Sylvester's law
 * of inertia: a negative pivot means an eigenvalue below sigma).
 */
export function factorBandedLdl(band: Float64Array, size: number, minPivotRatio = SINGULAR_PIVOT_RATIO): number {
  for (let j = 0; j < size; j++) {
    const diagonal = band[j * ROW] as number;
    let pivot = diagonal;
    const kStart = j - HALF_BANDWIDTH > 0 ? j - HALF_BANDWIDTH : 0;
    for (let k = kStart; k < j; k++) {
      const ljk = band[k * ROW + (j - k)] as number;
      pivot -= ljk * ljk * (band[k * ROW] as number);
    }
    if (!(pivot > minPivotRatio * diagonal) || !(diagonal > 0)) return j;
    band[j * ROW] = pivot;
    const iEnd = j + HALF_BANDWIDTH < size - 1 ? j + HALF_BANDWIDTH : size - 1;
    for (let i = j + 1; i <= iEnd; i++) {
      let value = band[j * ROW + (i - j)] as number;
      const kFrom = i - HALF_BANDWIDTH > 0 ? i - HALF_BANDWIDTH : 0;
      for (let k = kFrom; k < j; k++) {
        value -= (band[k * ROW + (i - k)] as number) * (band[k * ROW + (j - k)] as number) * (band[k * ROW] as number);
      }
      band[j * ROW + (i - j)] = value / pivot;
    }
  }
  return -1;
}

/** Solves A x = rhs in place (rhs becomes x) with a band factorised by factorBandedLdl. */
export function solveBandedLdl(band: Float64Array, size: number, rhs: Float64Array): void {
  for (let i = 0; i < size; i++) {
    let value = rhs[i] as number;
    const kFrom = i - HALF_BANDWIDTH > 0 ? i - HALF_BANDWIDTH : 0;
    for (let k = kFrom; k < i; k++) value -= (band[k * ROW + (i - k)] as number) * (rhs[k] as number);
    rhs[i] = value;
  }
  for (let i = 0; i < size; i++) rhs[i] = (rhs[i] as number) / (band[i * ROW] as number);
  for (let i = size - 1; i >= 0; i--) {
    let value = rhs[i] as number;
    const kEnd = i + HALF_BANDWIDTH < size - 1 ? i + HALF_BANDWIDTH : size - 1;
    for (let k = i + 1; k <= kEnd; k++) value -= (band[i * ROW + (k - i)] as number) * (rhs[k] as number);
    rhs[i] = value;
  }
}
