import { STANDARD_GRAVITY_M_PER_S2, type FrequencyResult, type Load, type LimitProfile, type Member } from "./model";
import { deflectionAt } from "./solver/deflection-field";
import { EngineInputError } from "./solver/engine-input-error";
import { findSpanAt, getSelfWeightNPerMm, solveValidatedMember } from "./solver/solve-member";
import { POSITION_TOLERANCE_RATIO } from "./solver/validate-member";
import { getSpanJudgements, type SpanJudgement } from "./checks/span-groups";

/**
 * First-mode eigenvalues beta*L of a uniform Euler-Bernoulli beam (from memory, Roark's Formulas
 * Table 16.1 / any vibration text): roots of sin = 0, cos*cosh = -1, cos*cosh = 1, tan = tanh.
 * tests/unit/lib/engine/frequency.test.ts checks each against its characteristic equation.
 */
export const FIRST_MODE_BETA_L = {
  pinnedPinned: Math.PI,
  fixedFree: 1.8751040687119611,
  fixedFixed: 4.730040744862704,
  fixedPinned: 3.926602312047919,
} as const;

/** A mass-carrying distributed segment, member coordinates (mm), gravity intensity N/mm. */
interface MassSegment {
  startMm: number;
  endMm: number;
  wStartNPerMm: number;
  wEndNPerMm: number;
}

interface MassPoint {
  atMm: number;
  pN: number;
}

interface MassModel {
  segments: MassSegment[];
  points: MassPoint[];
  totalN: number;
}

function collectMassModel(member: Member, massFactors: Record<string, number>): MassModel {
  const segments: MassSegment[] = [];
  const points: MassPoint[] = [];
  const issues: { path: string; message: string }[] = [];
  let totalMm = 0;
  for (const span of member.spans) totalMm += span.lengthMm;
  member.loads.forEach((load: Load, index) => {
    const factor = massFactors[load.loadCase] ?? 0;
    if (factor === 0 || load.kind === "moment") return;
    const negative = { path: `loads[${index}]`, message: `load case "${load.loadCase}" counts as vibrating mass (frequency.massFactors) but this load is not downward` };
    if (load.kind === "uniform") {
      if (load.wNPerMm * factor < 0) issues.push(negative);
      segments.push({ startMm: load.startMm ?? 0, endMm: load.endMm ?? totalMm, wStartNPerMm: load.wNPerMm * factor, wEndNPerMm: load.wNPerMm * factor });
    } else if (load.kind === "linear") {
      if (load.wStartNPerMm * factor < 0 || load.wEndNPerMm * factor < 0) issues.push(negative);
      segments.push({ startMm: load.startMm, endMm: load.endMm, wStartNPerMm: load.wStartNPerMm * factor, wEndNPerMm: load.wEndNPerMm * factor });
    } else {
      if (load.pN * factor < 0) issues.push(negative);
      points.push({ atMm: load.atMm, pN: load.pN * factor });
    }
  });
  if (member.selfWeightCase !== undefined) {
    let x0 = 0;
    for (const span of member.spans) {
      const w = getSelfWeightNPerMm(span);
      segments.push({ startMm: x0, endMm: x0 + span.lengthMm, wStartNPerMm: w, wEndNPerMm: w });
      x0 += span.lengthMm;
    }
  }
  if (issues.length > 0) throw new EngineInputError(issues);
  let totalN = 0;
  for (const s of segments) totalN += ((s.wStartNPerMm + s.wEndNPerMm) / 2) * (s.endMm - s.startMm);
  for (const p of points) totalN += p.pN;
  if (!(totalN > 0)) {
    throw new EngineInputError([{ path: "frequency.massFactors", message: "the frequency check has no mass: the mass factors select no downward load and the member has no self-weight" }]);
  }
  return { segments, points, totalN };
}

/** The exact first-mode beta*L for a single uniform span with standard supports, else null. */
function getStandardBetaL(member: Member): number | null {
  if (member.spans.length !== 1 || member.includeShearDeformation === true) return null;
  const kinds = member.supports.map((s) => (s.kind === "roller" ? "pinned" : s.kind)).sort().join("-");
  switch (kinds) {
    case "pinned-pinned":
      return FIRST_MODE_BETA_L.pinnedPinned;
    case "fixed-free":
      return FIRST_MODE_BETA_L.fixedFree;
    case "fixed-fixed":
      return FIRST_MODE_BETA_L.fixedFixed;
    case "fixed-pinned":
      return FIRST_MODE_BETA_L.fixedPinned;
    default:
      return null;
  }
}

/** Uniform mass over the whole single span (kg/mm), or null when the mass is not uniform. */
function getUniformMassKgPerMm(model: MassModel, lengthMm: number): number | null {
  if (model.points.length > 0) return null;
  const tol = lengthMm * POSITION_TOLERANCE_RATIO;
  let w = 0;
  for (const s of model.segments) {
    if (s.startMm > tol || s.endMm < lengthMm - tol || s.wStartNPerMm !== s.wEndNPerMm) return null;
    w += s.wStartNPerMm;
  }
  return w / STANDARD_GRAVITY_M_PER_S2;
}

const GAUSS_NODES = [-0.9324695142031521, -0.6612093864662645, -0.2386191860831969, 0.2386191860831969, 0.6612093864662645, 0.9324695142031521];
const GAUSS_WEIGHTS = [0.1713244923791704, 0.3607615730481386, 0.467913934550852, 0.467913934550852, 0.3607615730481386, 0.1713244923791704];

function getMassIntensity(model: MassModel, xMm: number): number {
  let w = 0;
  for (const s of model.segments) {
    if (xMm >= s.startMm && xMm <= s.endMm) w += s.wStartNPerMm + ((s.wEndNPerMm - s.wStartNPerMm) * (xMm - s.startMm)) / (s.endMm - s.startMm);
  }
  return w;
}

/**
 * omega^2 (1/s^2) of the Rayleigh quotient for the static shape y under the signed mass loads:
 * omega^2 = integral(q_signed y) / integral(m y^2), m = |q| / g. With q in N/mm, m in kg/mm and
 * y in mm the ratio is in N/(kg mm) = 1000 / s^2. 6-point Gauss-Legendre per load-continuous
 * piece is exact for these polynomial integrands (degree <= 11).
 */
function getRayleighOmegaSquared(model: MassModel, member: Member, judgements: SpanJudgement[], groupSigns: number[] | null): number {
  const getSpanSign = (span: number): number => (groupSigns === null ? 1 : (groupSigns[judgements[span]!.groupIndex % 2] as number));
  const loads: Load[] = [];
  // node positions as solveValidatedMember builds them, so findSpanAt agrees with the solution
  const nodeXMm: number[] = [0];
  for (let e = 0; e < member.spans.length; e++) nodeXMm.push((nodeXMm[e] as number) + member.spans[e]!.lengthMm);
  for (let e = 0; e < member.spans.length; e++) {
    const a = nodeXMm[e] as number;
    const b = a + member.spans[e]!.lengthMm;
    const sign = getSpanSign(e);
    for (const s of model.segments) {
      const lo = Math.max(a, s.startMm);
      const hi = Math.min(b, s.endMm);
      if (!(hi > lo)) continue;
      const slope = (s.wEndNPerMm - s.wStartNPerMm) / (s.endMm - s.startMm);
      loads.push({ kind: "linear", loadCase: "mass", startMm: lo, endMm: hi, wStartNPerMm: sign * (s.wStartNPerMm + slope * (lo - s.startMm)), wEndNPerMm: sign * (s.wStartNPerMm + slope * (hi - s.startMm)) });
    }
  }
  const pointSigns: number[] = [];
  for (const p of model.points) {
    const span = findSpanAt(nodeXMm, p.atMm);
    pointSigns.push(getSpanSign(span));
    loads.push({ kind: "point", loadCase: "mass", atMm: p.atMm, pN: getSpanSign(span) * p.pN });
  }
  // still valid: the mass loads lie inside the validated member's loads and spans
  const solution = solveValidatedMember({ ...member, loads, selfWeightCase: undefined });
  const factors = solution.caseNames.map(() => 1);
  let work = 0;
  let inertia = 0;
  for (let e = 0; e < solution.spanCount; e++) {
    const xStart = solution.nodeXMm[e] as number;
    const sign = getSpanSign(e);
    const cuts = [0, ...(solution.breakpointsMm[e] as number[]), solution.lengthMm[e] as number];
    for (let piece = 0; piece + 1 < cuts.length; piece++) {
      const lo = xStart + (cuts[piece] as number);
      const hi = xStart + (cuts[piece + 1] as number);
      const half = (hi - lo) / 2;
      for (let g = 0; g < GAUSS_NODES.length; g++) {
        // keep the sample inside this span so the span's sign and field apply
        const x = lo + half * (1 + (GAUSS_NODES[g] as number));
        const q = getMassIntensity(model, x);
        if (q === 0) continue;
        const y = deflectionAt(solution, factors, x);
        work += (GAUSS_WEIGHTS[g] as number) * half * sign * q * y;
        inertia += (GAUSS_WEIGHTS[g] as number) * half * (q / STANDARD_GRAVITY_M_PER_S2) * y * y;
      }
    }
  }
  model.points.forEach((p, index) => {
    const y = deflectionAt(solution, factors, p.atMm);
    work += (pointSigns[index] as number) * p.pN * y;
    inertia += (p.pN / STANDARD_GRAVITY_M_PER_S2) * y * y;
  });
  return (1000 * work) / inertia;
}

/**
 * First natural frequency (Hz) of the member carrying the profile's vibrating mass: the mass
 * factors times the member's loads (moments carry no mass) divided by g, plus self-weight when
 * member.selfWeightCase is set (always counted in full). Exact for one uniform span with standard
 * supports and uniform mass: f = (beta L)^2 / (2 pi L^2) sqrt(EI/m) (Roark's Formulas Table 16.1,
 * from memory); otherwise the Rayleigh quotient of the static deflected shape under the mass's
 * weight (an upper bound), taking the lower of all spans loaded downward and adjacent spans
 * loaded in alternate directions. Returns null when the profile has no frequency limit.
 * Takes a member already validated (assertMemberValid or assertMemberAndProfileValid): it does
 * not check the member again.
 */
export function computeFrequency(member: Member, profile: LimitProfile): FrequencyResult | null {
  const limit = profile.frequency;
  if (limit === undefined) return null;
  const model = collectMassModel(member, limit.massFactors);
  const betaL = getStandardBetaL(member);
  const span = member.spans[0]!;
  const uniformMass = betaL === null ? null : getUniformMassKgPerMm(model, span.lengthMm);
  let hz: number;
  let method: FrequencyResult["method"];
  if (betaL !== null && uniformMass !== null) {
    // EI/m in N*mm^2/(kg/mm) = 1000 mm^4/s^2
    hz = ((betaL * betaL) / (2 * Math.PI * span.lengthMm * span.lengthMm)) * Math.sqrt((1000 * span.eMpa * span.iMm4) / uniformMass);
    method = "exact";
  } else {
    const judgements = getSpanJudgements(member);
    let omegaSquared = getRayleighOmegaSquared(model, member, judgements, null);
    const groupCount = new Set(judgements.map((j) => j.groupIndex)).size;
    if (groupCount > 1) omegaSquared = Math.min(omegaSquared, getRayleighOmegaSquared(model, member, judgements, [1, -1]));
    hz = Math.sqrt(omegaSquared) / (2 * Math.PI);
    method = "rayleigh";
  }
  if (!Number.isFinite(hz) || !(hz > 0)) {
    throw new EngineInputError([{ path: "frequency", message: "the natural frequency could not be computed from the given mass and stiffness" }]);
  }
  return { hz, minHz: limit.minHz, pass: hz >= limit.minHz, method };
}
