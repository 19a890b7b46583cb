import { STANDARD_GRAVITY_M_PER_S2, type Load, type Member } from "../model";
import { EngineInputError } from "../solver/engine-input-error";
import { getSelfWeightNPerMm } from "../solver/solve-member";
import { POSITION_TOLERANCE_RATIO } from "../solver/validate-member";

/** A mass-carrying distributed segment, member coordinates (mm), mass intensity kg/mm. */
export interface MassSegment {
  startMm: number;
  endMm: number;
  startKgPerMm: number;
  endKgPerMm: number;
}

/** A concentrated mass (kg) at a position along the member (mm from its left end). */
export interface MassPoint {
  atMm: number;
  kg: number;
}

/**
 * The vibrating mass of a member: distributed segments and concentrated masses, each the weight
 * of a load times its case's mass factor divided by g (N/mm / (m/s^2) = kg/mm), plus self-weight.
 */
export interface MassModel {
  segments: MassSegment[];
  points: MassPoint[];
  totalKg: number;
}

/**
 * Collects the vibrating mass: each load times the mass factor of its case (moments carry no
 * mass), divided by standard gravity, plus the self-weight of every span (A rho) when
 * member.selfWeightCase is set, always counted in full. Throws EngineInputError naming the load
 * when a load counted as mass is not downward, and naming frequency.massFactors when there is no
 * mass at all.
 */
export function collectMassModel(member: Member, massFactors: Record<string, number>): MassModel {
  const segments: MassSegment[] = [];
  const points: MassPoint[] = [];
  const issues: { path: string; message: string }[] = [];
  const g = STANDARD_GRAVITY_M_PER_S2;
  let totalMm = 0;
  for (const span of member.spans) totalMm += span.lengthMm;
  member.loads.forEach((load: Load, index) => {
    const factor = massFactors[load.loadCase] ?? 0;
    if (factor === 0 || load.kind === "moment") return;
    const negative = { path: `loads[${index}]`, message: `load case "${load.loadCase}" counts as vibrating mass (frequency.massFactors) but this load is not downward` };
    if (load.kind === "uniform") {
      if (load.wNPerMm * factor < 0) issues.push(negative);
      const kgPerMm = (load.wNPerMm * factor) / g;
      segments.push({ startMm: load.startMm ?? 0, endMm: load.endMm ?? totalMm, startKgPerMm: kgPerMm, endKgPerMm: kgPerMm });
    } else if (load.kind === "linear") {
      if (load.wStartNPerMm * factor < 0 || load.wEndNPerMm * factor < 0) issues.push(negative);
      segments.push({ startMm: load.startMm, endMm: load.endMm, startKgPerMm: (load.wStartNPerMm * factor) / g, endKgPerMm: (load.wEndNPerMm * factor) / g });
    } else {
      if (load.pN * factor < 0) issues.push(negative);
      points.push({ atMm: load.atMm, kg: (load.pN * factor) / g });
    }
  });
  if (member.selfWeightCase !== undefined) {
    let x0 = 0;
    for (const span of member.spans) {
      const kgPerMm = getSelfWeightNPerMm(span) / g;
      segments.push({ startMm: x0, endMm: x0 + span.lengthMm, startKgPerMm: kgPerMm, endKgPerMm: kgPerMm });
      x0 += span.lengthMm;
    }
  }
  if (issues.length > 0) throw new EngineInputError(issues);
  let totalKg = 0;
  for (const s of segments) totalKg += ((s.startKgPerMm + s.endKgPerMm) / 2) * (s.endMm - s.startMm);
  for (const p of points) totalKg += p.kg;
  if (!(totalKg > 0)) {
    throw new EngineInputError([{ path: "frequency.massFactors", message: "the frequency check has no mass: the mass factors select no downward load and the member has no self-weight" }]);
  }
  return { segments, points, totalKg };
}

/** Uniform mass over the whole single span (kg/mm), or null when the mass is not uniform. */
export function getUniformMassKgPerMm(model: MassModel, lengthMm: number): number | null {
  if (model.points.length > 0) return null;
  const tol = lengthMm * POSITION_TOLERANCE_RATIO;
  let kgPerMm = 0;
  for (const s of model.segments) {
    if (s.startMm > tol || s.endMm < lengthMm - tol || s.startKgPerMm !== s.endKgPerMm) return null;
    kgPerMm += s.startKgPerMm;
  }
  return kgPerMm;
}
