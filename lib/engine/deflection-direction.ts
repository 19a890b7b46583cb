/**
 * Which way a signed deflection goes, for people reading results. The engine's deflections are
 * positive downward (model.ts sign convention); a check limits the magnitude, so an uplift of
 * 5 mm and a sag of 5 mm use the same allowance, but a report must say which one it is.
 */
export type DeflectionDirection = "down" | "up" | "none";

/** "down" for a positive (gravity-direction) deflection, "up" for a negative one, "none" for 0 or non-finite. */
export function getDeflectionDirection(deflectionMm: number): DeflectionDirection {
  if (!Number.isFinite(deflectionMm) || deflectionMm === 0) return "none";
  return deflectionMm > 0 ? "down" : "up";
}
