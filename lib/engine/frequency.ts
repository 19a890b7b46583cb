import type { FrequencyResult, LimitProfile, Member } from "./model";
import { assembleBeamMesh, createMeshLayout, refineMeshLayout, type BeamMesh, type MeshLayout } from "./frequency/beam-mesh";
import { findLowestEigenvalue, type EigenvalueOptions } from "./frequency/lowest-eigenvalue";
import { collectMassModel, getUniformMassKgPerMm, type MassModel } from "./frequency/mass-model";
import { EngineInputError } from "./solver/engine-input-error";

/**
 * First-mode eigenvalues beta*L of a uniform Euler-Bernoulli beam (from memory, Blevins,
 * Formulas for Natural Frequency and Mode Shape, Table 8-1; Roark's Formulas Table 16.1): roots
 * of sin = 0, cos*cosh = -1, cos*cosh = 1, tan = tanh.
 * tests/unit/lib/engine/frequency.test.ts checks each against its characteristic equation.
 */
export const FIRST_MODE_BETA_L = {
  pinnedPinned: Math.PI,
  fixedFree: 1.8751040687119611,
  fixedFixed: 4.730040744862704,
  fixedPinned: 3.926602312047919,
} as const;

/** Elements per span of the first mesh; each refinement doubles it. */
const START_ELEMENTS_PER_SPAN = 4;
const MAX_ELEMENTS_PER_SPAN = 256;
/** Refinement stops when the first frequency changes by less than this fraction. */
export const FREQUENCY_CONVERGENCE = 1e-3;

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

/** f = sqrt(omega^2) / (2 pi) with omega^2 = 1000 lambda (lambda in N/(mm kg), see BeamMesh). */
function getHz(lambda: number): number {
  return Math.sqrt(1000 * lambda) / (2 * Math.PI);
}

/** A generic start vector: every free translation nonzero, not symmetric, rotations zero. */
function createStartVector(mesh: BeamMesh): Float64Array {
  const x = new Float64Array(mesh.dofCount);
  for (let node = 0; 2 * node < mesh.dofCount; node++) {
    if (mesh.constrained[2 * node] !== 1) x[2 * node] = 1 + 0.7 * Math.sin(2.399963 * node + 0.5);
  }
  return x;
}

/**
 * The coarse mode on the refined layout (every element halved): nodes carried over, each new
 * midpoint from the element's Hermite cubic (v and dv/dx at xi = 1/2). A warm start.
 */
function refineVector(coarse: Float64Array, layout: MeshLayout, fine: BeamMesh): Float64Array {
  const x = new Float64Array(fine.dofCount);
  for (let element = 0; element < layout.elementSpan.length; element++) {
    const h = (layout.nodeXMm[element + 1] as number) - (layout.nodeXMm[element] as number);
    const v0 = coarse[2 * element] as number;
    const t0 = coarse[2 * element + 1] as number;
    const v1 = coarse[2 * element + 2] as number;
    const t1 = coarse[2 * element + 3] as number;
    x[4 * element] = v0;
    x[4 * element + 1] = t0;
    x[4 * element + 2] = (v0 + v1) / 2 + (h * (t0 - t1)) / 8;
    x[4 * element + 3] = (1.5 * (v1 - v0)) / h - (t0 + t1) / 4;
    x[4 * element + 4] = v1;
    x[4 * element + 5] = t1;
  }
  for (let i = 0; i < fine.dofCount; i++) if (fine.constrained[i] === 1) x[i] = 0;
  return x;
}

function solveMesh(mesh: BeamMesh, x: Float64Array, options: EigenvalueOptions): number {
  const lambda = findLowestEigenvalue(mesh.stiffness, mesh.mass, mesh.dofCount, x, options);
  if (!(lambda > 0) || !Number.isFinite(lambda)) {
    throw new EngineInputError([{ path: "frequency", message: "the natural frequency could not be computed from the given mass and stiffness" }]);
  }
  return getHz(lambda);
}

/** From hz back to lambda (N/(mm kg)), for the refined mesh's first shift. */
function getLambda(hz: number): number {
  return (2 * Math.PI * hz) ** 2 / 1000;
}

// The first mesh only measures the change: it needs no certificate (a wrong mode there would only
// show as a large change and one more refinement). Every finer mesh is certified.
const COARSE_OPTIONS: EigenvalueOptions = { tolerance: 1e-8, certify: false, trialShift: 0 };
const FINE_TOLERANCE = 1e-10;
/** The refined mesh's eigenvalue is below the coarse one, and within discretisation error of it. */
const REFINED_SHIFT = 0.995;

/**
 * First frequency (Hz) by consistent-mass beam finite elements: START_ELEMENTS_PER_SPAN equal
 * elements per span with a node under every point mass (createMeshLayout), every element halved
 * until the frequency changes by less than FREQUENCY_CONVERGENCE.
 * Consistent mass is a Rayleigh-Ritz model, so each mesh's frequency is an upper bound that falls
 * with every refinement; the value returned is the finest one less the last change, which stays
 * on the low (safe) side of the exact value while the error at least halves per refinement
 * (cubic elements with nodes at the point masses: about 1/16 per halving).
 */
function computeFiniteElementHz(member: Member, model: MassModel): number {
  let layout = createMeshLayout(member, model, START_ELEMENTS_PER_SPAN);
  let slot: 0 | 1 = 0;
  const first = assembleBeamMesh(member, model, layout, slot);
  let x = createStartVector(first);
  let previousHz = solveMesh(first, x, COARSE_OPTIONS);
  for (let perSpan = 2 * START_ELEMENTS_PER_SPAN; ; perSpan *= 2) {
    slot = slot === 0 ? 1 : 0;
    const finerLayout = refineMeshLayout(layout);
    const finer = assembleBeamMesh(member, model, finerLayout, slot);
    const warm = refineVector(x, layout, finer);
    const hz = solveMesh(finer, warm, { tolerance: FINE_TOLERANCE, certify: true, trialShift: REFINED_SHIFT * getLambda(previousHz) });
    const change = Math.abs(previousHz - hz);
    if (change < FREQUENCY_CONVERGENCE * hz || perSpan >= MAX_ELEMENTS_PER_SPAN) return hz - change;
    previousHz = hz;
    layout = finerLayout;
    x = warm;
  }
}

/**
 * First natural frequency (Hz) of the member carrying the profile's vibrating mass: the mass
 * factors times the member's loads (moments carry no mass) divided by g, plus self-weight when
 * member.selfWeightCase is set (always counted in full). One uniform span with standard supports
 * and uniform mass takes the closed form f = (beta L)^2 / (2 pi L^2) sqrt(EI/m) (Blevins, Formulas
 * for Natural Frequency and Mode Shape, Table 8-1, from memory): method "exact". Anything else
 * (continuous, overhanging, springs, partial or point masses, shear deformation) takes the
 * converged finite-element eigenvalue of computeFiniteElementHz: method "finite_element".
 * The model is a beam in bending with translational mass; with shear deformation the stiffness
 * is Timoshenko's and the rotary inertia of the member's own section is included. Returns null
 * when the profile has no frequency limit. Takes a member already validated
 * (assertMemberAndProfileValid): it does not check the member again.
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
    hz = computeFiniteElementHz(member, model);
    method = "finite_element";
  }
  if (!Number.isFinite(hz) || !(hz > 0)) {
    throw new EngineInputError([{ path: "frequency", message: "the natural frequency could not be computed from the given mass and stiffness" }]);
  }
  return { hz, minHz: limit.minHz, pass: hz >= limit.minHz, method };
}
