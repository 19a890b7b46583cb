/**
 * Effective second moment of a cracked reinforced concrete member, ACI 318-19 Table 24.2.3.5
 * (from memory; the form due to Bischoff):
 *   M_a <= (2/3) M_cr:  I_e = I_g
 *   M_a >  (2/3) M_cr:  I_e = I_cr / (1 - ((2/3) M_cr / M_a)^2 (1 - I_cr / I_g))
 * M_a is the largest service moment of the load considered (magnitude), M_cr = f_r I_g / y_t.
 */

/** The share of M_cr below which the section is taken as uncracked (Table 24.2.3.5: 2/3). */
export const UNCRACKED_MOMENT_SHARE = 2 / 3;

/**
 * I_e, mm^4, from I_g and I_cr (mm^4), M_cr and the service moment M_a (N*mm, sign ignored).
 * Assumes 0 < I_cr <= I_g and M_cr > 0. The result lies in (I_cr, I_g]: it equals I_g up to
 * (2/3) M_cr and falls towards I_cr as M_a grows.
 */
export function getEffectiveInertiaMm4(iGMm4: number, iCrMm4: number, mCrNmm: number, mANmm: number): number {
  const demand = Math.abs(mANmm);
  const threshold = UNCRACKED_MOMENT_SHARE * mCrNmm;
  if (!(demand > threshold) || iCrMm4 >= iGMm4) return iGMm4;
  const ratio = threshold / demand;
  return iCrMm4 / (1 - ratio * ratio * (1 - iCrMm4 / iGMm4));
}
