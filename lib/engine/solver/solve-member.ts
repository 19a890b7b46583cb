import { STANDARD_GRAVITY_M_PER_S2, type Load, type Member, type SpanSegment } from "../model";
import { factorBandedLdl, HALF_BANDWIDTH, solveBandedLdl } from "./banded-ldl";
import { EngineInputError } from "./engine-input-error";
import {
  addCoupleTerm,
  addDistributedTerms,
  addPointTerm,
  createElementTerms,
  getEndIntegrals,
  type ElementTerms,
  type EndIntegrals,
} from "./element-terms";
import { assertMemberValid, POSITION_TOLERANCE_RATIO } from "./validate-member";

/** Name of the internal load case that carries self-weight (combined with `selfWeightCase`). */
export const SELF_WEIGHT_CASE_KEY = "\u0000self-weight";

/**
 * The solved member: nodal displacements and element start forces for every load case, enough to
 * evaluate the exact deflection anywhere (see element-terms.ts for the field equations).
 * Units: mm, N, N*mm, rad; v positive downward, rotation positive clockwise.
 */
export interface MemberSolution {
  spanCount: number;
  /** Node positions from the left end, mm (spanCount + 1). */
  nodeXMm: number[];
  lengthMm: number[];
  /** EI per span, N*mm^2. */
  eiNmm2: number[];
  /** 1/(k G A) per span, 1/N; 0 without shear deformation. */
  inverseShearStiffness: number[];
  /**
   * Load case name of each solved case; SELF_WEIGHT_CASE_KEY names the internal self-weight case.
   * A patterned case appears once per pattern group that carries its loads (see casePatternGroup).
   */
  caseNames: string[];
  /**
   * Per solved case: the pattern group whose loads it holds (a part of a variable case, split at
   * the supports), or -1 for a case solved whole.
   */
  casePatternGroup: number[];
  /** Index of the internal self-weight case, -1 when none. */
  selfWeightCaseIndex: number;
  /** Case index of the member's named self-weight case (gets the same factor), -1 when none. */
  selfWeightNamedCaseIndex: number;
  /**
   * Per case, `caseStride` numbers from case * caseStride: the nodal DOFs [v0, theta0, v1, ...]
   * (mm, rad), then each span's sagging moment just right of its left node (N*mm), then each
   * span's shear there (dM/ds, N).
   */
  caseStates: number[];
  caseStride: number;
  terms: ElementTerms[];
  /** Sorted load discontinuities strictly inside each element, local mm. */
  breakpointsMm: number[][];
}

/**
 * Which loads the solver splits into per-span parts for pattern loading: the loads of the named
 * cases that are not marked fixed, each part holding what lies in one pattern group (a clear span
 * between supports, or an overhang). A load that straddles supports is split at them; a
 * concentrated load at a node belongs to the span on its right (the last span at the right end).
 */
export interface PatternSplit {
  cases: ReadonlySet<string>;
  /** Pattern group of each span (element), non-decreasing, 0-based. */
  groupOfSpan: readonly number[];
}

/** Index of a load case in the solution, -1 when the member has no load in it. */
export function getCaseIndexOf(solution: MemberSolution, name: string): number {
  return solution.caseNames.indexOf(name);
}

function addAt(values: Float64Array, index: number, amount: number): void {
  values[index] = (values[index] as number) + amount;
}

function getCaseIndex(names: string[], groups: number[], name: string, group: number): number {
  for (let i = 0; i < names.length; i++) if (names[i] === name && groups[i] === group) return i;
  names.push(name);
  groups.push(group);
  return names.length - 1;
}

/**
 * Index of the span holding x (mm from the left end), given the node positions (spanCount + 1
 * entries, ascending): x at an interior node belongs to the span on its right, x beyond the
 * ends is clamped to the end spans.
 */
export function findSpanAt(nodeXMm: readonly number[], xMm: number): number {
  const last = nodeXMm.length - 2;
  for (let e = 0; e < last; e++) if (xMm < (nodeXMm[e + 1] as number)) return e;
  return last;
}

/**
 * Self-weight of a span as a uniform load, N/mm: A (mm^2) * rho (kg/m^3) * 1e-9 (m^3/mm^3) * g
 * (m/s^2). The span must carry areaMm2 and densityKgPerM3 (a validated member with a
 * selfWeightCase does).
 */
export function getSelfWeightNPerMm(span: SpanSegment): number {
  return span.areaMm2! * span.densityKgPerM3! * 1e-9 * STANDARD_GRAVITY_M_PER_S2;
}

function findNode(nodeXMm: number[], xMm: number, tolMm: number): number {
  for (let j = 0; j < nodeXMm.length; j++) if (Math.abs(xMm - (nodeXMm[j] as number)) <= tolMm) return j;
  return -1;
}

interface LoadContext {
  nodeXMm: number[];
  lengthMm: number[];
  spanCount: number;
  tolMm: number;
  terms: ElementTerms[];
  /** Nodal loads per case, grown as cases appear. */
  nodalLoads: Float64Array[];
  dofCount: number;
}

function getNodalLoads(context: LoadContext, caseIndex: number): Float64Array {
  while (context.nodalLoads.length <= caseIndex) context.nodalLoads.push(new Float64Array(context.dofCount));
  return context.nodalLoads[caseIndex] as Float64Array;
}

/** Case index of a load's part in element e: its own case, or its pattern part for that span. */
function getPartCase(caseIndex: number, partCases: readonly number[] | null, e: number): number {
  return partCases === null ? caseIndex : (partCases[e] as number);
}

function addDistributedLoad(context: LoadContext, startMm: number, endMm: number, wStart: number, wEnd: number, caseIndex: number, partCases: readonly number[] | null): void {
  const slope = (wEnd - wStart) / (endMm - startMm);
  for (let e = 0; e < context.spanCount; e++) {
    const x0 = context.nodeXMm[e] as number;
    const length = context.lengthMm[e] as number;
    const lo = startMm > x0 ? startMm : x0;
    const hi = endMm < x0 + length ? endMm : x0 + length;
    if (!(hi - lo > context.tolMm)) continue;
    const localStart = lo - x0 <= context.tolMm ? 0 : lo - x0;
    const localEnd = x0 + length - hi <= context.tolMm ? length : hi - x0;
    addDistributedTerms(context.terms[e] as ElementTerms, length, localStart, localEnd, wStart + slope * (lo - startMm), wStart + slope * (hi - startMm), getPartCase(caseIndex, partCases, e));
  }
}

function addConcentratedLoad(context: LoadContext, xMm: number, value: number, isCouple: boolean, caseIndex: number, partCases: readonly number[] | null): void {
  const node = findNode(context.nodeXMm, xMm, context.tolMm);
  if (node >= 0) {
    const owner = getPartCase(caseIndex, partCases, findSpanAt(context.nodeXMm, context.nodeXMm[node] as number));
    const nodal = getNodalLoads(context, owner);
    addAt(nodal, 2 * node + (isCouple ? 1 : 0), value);
    return;
  }
  const e = findSpanAt(context.nodeXMm, xMm);
  const local = xMm - (context.nodeXMm[e] as number);
  const owner = getPartCase(caseIndex, partCases, e);
  if (isCouple) addCoupleTerm(context.terms[e] as ElementTerms, local, value, owner);
  else addPointTerm(context.terms[e] as ElementTerms, local, value, owner);
}

function addLoad(context: LoadContext, load: Load, totalMm: number, caseIndex: number, partCases: readonly number[] | null): void {
  switch (load.kind) {
    case "uniform":
      addDistributedLoad(context, load.startMm ?? 0, load.endMm ?? totalMm, load.wNPerMm, load.wNPerMm, caseIndex, partCases);
      return;
    case "linear":
      addDistributedLoad(context, load.startMm, load.endMm, load.wStartNPerMm, load.wEndNPerMm, caseIndex, partCases);
      return;
    case "point":
      addConcentratedLoad(context, load.atMm, load.pN, false, caseIndex, partCases);
      return;
    case "moment":
      addConcentratedLoad(context, load.atMm, load.mNmm, true, caseIndex, partCases);
      return;
  }
}

/** The element that holds a concentrated load at x: the span on the right of a node it sits on. */
function getConcentratedOwner(context: LoadContext, xMm: number): number {
  const node = findNode(context.nodeXMm, xMm, context.tolMm);
  return findSpanAt(context.nodeXMm, node >= 0 ? (context.nodeXMm[node] as number) : xMm);
}

/** Whether the load puts anything on element e (the same overlap rule as addDistributedLoad). */
function isLoadOnElement(context: LoadContext, load: Load, totalMm: number, e: number): boolean {
  if (load.kind === "point" || load.kind === "moment") return getConcentratedOwner(context, load.atMm) === e;
  const startMm = load.startMm ?? 0;
  const endMm = load.endMm ?? totalMm;
  const x0 = context.nodeXMm[e] as number;
  const x1 = x0 + (context.lengthMm[e] as number);
  return (endMm < x1 ? endMm : x1) - (startMm > x0 ? startMm : x0) > context.tolMm;
}

/**
 * Case index of each span's part of a patterned load (-1 where the load puts nothing): one solved
 * case per (case, group), created only for groups the load reaches.
 */
function getPartCases(context: LoadContext, names: string[], groups: number[], load: Load, totalMm: number, groupOfSpan: readonly number[]): number[] {
  const parts: number[] = [];
  for (let e = 0; e < context.spanCount; e++) {
    parts.push(isLoadOnElement(context, load, totalMm, e) ? getCaseIndex(names, groups, load.loadCase, groupOfSpan[e] as number) : -1);
  }
  return parts;
}

const NO_BREAKPOINTS: number[] = [];

function getBreakpoints(terms: ElementTerms, lengthMm: number): number[] {
  let points: number[] | null = null;
  for (const c of terms.atMm) {
    if (!(c > 0 && c < lengthMm)) continue;
    if (points === null) points = [c];
    else if (!points.includes(c)) points.push(c);
  }
  return points === null ? NO_BREAKPOINTS : points.sort((a, b) => a - b);
}

/** Element stiffness coefficients (Timoshenko when phi > 0, Euler-Bernoulli when phi = 0). */
interface ElementStiffness {
  k11: number; // 12 a
  k12: number; // 6 L a
  k22: number; // (4 + phi) L^2 a
  k24: number; // (2 - phi) L^2 a
}

function getElementStiffness(length: number, ei: number, inverseShear: number, out: ElementStiffness): ElementStiffness {
  const phi = (12 * ei * inverseShear) / (length * length);
  const a = ei / ((1 + phi) * length * length * length);
  out.k11 = 12 * a;
  out.k12 = 6 * length * a;
  out.k22 = (4 + phi) * length * length * a;
  out.k24 = (2 - phi) * length * length * a;
  return out;
}

const stiffnessScratch: ElementStiffness = { k11: 0, k12: 0, k22: 0, k24: 0 };
const integralsScratch: EndIntegrals = { firstIntegral: 0, secondIntegral: 0, momentAtEnd: 0, shearMomentAtEnd: 0, totalLoadN: 0 };

/**
 * Solves a continuous member by the direct stiffness method: one element per span, two DOFs per
 * node (v down, theta clockwise), exact fixed-end forces from the load terms, Timoshenko element
 * stiffness (phi = 12EI/(kGA L^2)) when member.includeShearDeformation. Each load case is solved
 * once with one banded LDL^T factorisation; with `pattern`, each variable case is solved once per
 * pattern group instead (their sum is the whole case: superposition). Throws EngineInputError for
 * invalid input or a mechanism; never returns NaN.
 */
export function solveMember(member: Member, pattern?: PatternSplit): MemberSolution {
  assertMemberValid(member);
  return solveValidatedMember(member, pattern);
}

// read once: a module binding read inside loops costs a call under some loaders
const BAND = HALF_BANDWIDTH;
const BAND_ROW = BAND + 1;
let bandScratch = new Float64Array(64);
let constrainedScratch = new Uint8Array(16);
let fixedEndScratch = new Float64Array(32);
let rhsScratch = new Float64Array(16);
let shearScratch = new Float64Array(8);
// k11, k12, k22, k24 per element, computed once and reused by every load case
let stiffnessByElementScratch = new Float64Array(32);

/** solveMember without the input validation, for callers that already validated the member. */
export function solveValidatedMember(member: Member, pattern?: PatternSplit): MemberSolution {
  const spanCount = member.spans.length;
  const dofCount = 2 * (spanCount + 1);
  const nodeXMm: number[] = [0];
  const lengthMm: number[] = [];
  const eiNmm2: number[] = [];
  const inverseShearStiffness: number[] = [];
  const withShear = member.includeShearDeformation === true;
  for (let e = 0; e < spanCount; e++) {
    const span = member.spans[e]!;
    lengthMm.push(span.lengthMm);
    nodeXMm.push((nodeXMm[e] as number) + span.lengthMm);
    eiNmm2.push(span.eMpa * span.iMm4);
    inverseShearStiffness.push(withShear ? 1 / (span.gMpa! * span.shearAreaMm2!) : 0);
  }
  const totalMm = nodeXMm[spanCount] as number;
  const caseNames: string[] = [];
  const casePatternGroup: number[] = [];
  const terms: ElementTerms[] = [];
  for (let e = 0; e < spanCount; e++) terms.push(createElementTerms());
  const context: LoadContext = { nodeXMm, lengthMm, spanCount, tolMm: totalMm * POSITION_TOLERANCE_RATIO, terms, nodalLoads: [], dofCount };
  for (const load of member.loads) {
    if (pattern !== undefined && load.fixed !== true && pattern.cases.has(load.loadCase)) {
      addLoad(context, load, totalMm, -1, getPartCases(context, caseNames, casePatternGroup, load, totalMm, pattern.groupOfSpan));
    } else {
      addLoad(context, load, totalMm, getCaseIndex(caseNames, casePatternGroup, load.loadCase, -1), null);
    }
  }
  let selfWeightCaseIndex = -1;
  let selfWeightNamedCaseIndex = -1;
  if (member.selfWeightCase !== undefined) {
    selfWeightNamedCaseIndex = getCaseIndex(caseNames, casePatternGroup, member.selfWeightCase, -1);
    selfWeightCaseIndex = getCaseIndex(caseNames, casePatternGroup, SELF_WEIGHT_CASE_KEY, -1);
    for (let e = 0; e < spanCount; e++) {
      const wNPerMm = getSelfWeightNPerMm(member.spans[e]!);
      addDistributedTerms(terms[e] as ElementTerms, lengthMm[e] as number, 0, lengthMm[e] as number, wNPerMm, wNPerMm, selfWeightCaseIndex);
    }
  }
  const caseCount = caseNames.length;

  if (bandScratch.length < dofCount * BAND_ROW) bandScratch = new Float64Array(dofCount * BAND_ROW * 2);
  if (constrainedScratch.length < dofCount) constrainedScratch = new Uint8Array(dofCount * 2);
  if (fixedEndScratch.length < 2 * caseCount * spanCount) fixedEndScratch = new Float64Array(4 * caseCount * spanCount);
  if (rhsScratch.length < dofCount) rhsScratch = new Float64Array(dofCount * 2);
  if (shearScratch.length < spanCount) shearScratch = new Float64Array(spanCount * 2);
  if (stiffnessByElementScratch.length < 4 * spanCount) stiffnessByElementScratch = new Float64Array(8 * spanCount);
  const stiffnessByElement = stiffnessByElementScratch;
  const band = bandScratch;
  const constrained = constrainedScratch;
  // plain loops: a fill() call per member costs more than clearing a few entries
  for (let i = 0; i < dofCount * BAND_ROW; i++) band[i] = 0;
  for (let i = 0; i < dofCount; i++) constrained[i] = 0;
  for (let e = 0; e < spanCount; e++) {
    const k = getElementStiffness(lengthMm[e] as number, eiNmm2[e] as number, inverseShearStiffness[e] as number, stiffnessScratch);
    stiffnessByElement[4 * e] = k.k11;
    stiffnessByElement[4 * e + 1] = k.k12;
    stiffnessByElement[4 * e + 2] = k.k22;
    stiffnessByElement[4 * e + 3] = k.k24;
    const base = 2 * e * 4;
    // rows v_e, theta_e, v_e+1, theta_e+1 of the symmetric element matrix, upper band only
    addAt(band, base, k.k11);
    addAt(band, base + 1, k.k12);
    addAt(band, base + 2, -k.k11);
    addAt(band, base + 3, k.k12);
    addAt(band, base + 4, k.k22);
    addAt(band, base + 5, -k.k12);
    addAt(band, base + 6, k.k24);
    addAt(band, base + 8, k.k11);
    addAt(band, base + 9, -k.k12);
    addAt(band, base + 12, k.k22);
  }
  for (let j = 0; j <= spanCount; j++) {
    const support = member.supports[j]!;
    if (support.kind === "pinned" || support.kind === "roller" || support.kind === "fixed") constrained[2 * j] = 1;
    if (support.kind === "fixed") constrained[2 * j + 1] = 1;
    if (support.kind === "spring") addAt(band, 2 * j * 4, support.springNPerMm!);
  }
  for (let i = 0; i < dofCount; i++) {
    if (constrained[i] !== 1) continue;
    for (let k = 1; k <= BAND; k++) {
      if (i + k < dofCount) band[i * 4 + k] = 0;
      if (i - k >= 0) band[(i - k) * 4 + k] = 0;
    }
    band[i * 4] = 1;
  }
  const singularDof = factorBandedLdl(band, dofCount);
  if (singularDof >= 0) {
    throw new EngineInputError([{
      path: `supports[${singularDof >> 1}]`,
      message: "the stiffness matrix is singular near this node: the supports and stiffnesses do not hold the member (mechanism or stiffness ratios beyond numerical precision)",
    }]);
  }

  const caseStride = dofCount + 2 * spanCount;
  // a plain array built by push: a typed array this size needs an off-heap buffer, costly once per member
  const caseStates: number[] = [];
  let allFinite = true;
  // fixed-end results per case per element: left shear V0f and moment M0f
  const fixedEnd = fixedEndScratch;
  for (let c = 0; c < caseCount; c++) {
    const rhs = rhsScratch;
    const nodal = context.nodalLoads[c];
    for (let i = 0; i < dofCount; i++) rhs[i] = nodal === undefined ? 0 : (nodal[i] as number);
    for (let e = 0; e < spanCount; e++) {
      const length = lengthMm[e] as number;
      const integrals = getEndIntegrals(terms[e] as ElementTerms, length, c, integralsScratch);
      const beta = (eiNmm2[e] as number) * (inverseShearStiffness[e] as number);
      // Fixed-fixed: psi(L) = 0 and v(L) = 0 solved for the left-end shear and moment.
      const v0f = (integrals.secondIntegral - beta * integrals.shearMomentAtEnd - (integrals.firstIntegral * length) / 2) / ((length * length * length) / 12 + beta * length);
      const m0f = (-integrals.firstIntegral - (v0f * length * length) / 2) / length;
      fixedEnd[2 * (c * spanCount + e)] = v0f;
      fixedEnd[2 * (c * spanCount + e) + 1] = m0f;
      const forceLeft = -v0f;
      const forceRight = v0f - integrals.totalLoadN;
      const momentRight = -(m0f + v0f * length + integrals.momentAtEnd);
      // equivalent nodal loads are the negated fixed-end reactions
      addAt(rhs, 2 * e, -forceLeft);
      addAt(rhs, 2 * e + 1, -m0f);
      addAt(rhs, 2 * e + 2, -forceRight);
      addAt(rhs, 2 * e + 3, -momentRight);
    }
    for (let i = 0; i < dofCount; i++) if (constrained[i] === 1) rhs[i] = 0;
    solveBandedLdl(band, dofCount, rhs);
    for (let i = 0; i < dofCount; i++) caseStates.push(rhs[i] as number);
    for (let e = 0; e < spanCount; e++) {
      const k11 = stiffnessByElement[4 * e] as number;
      const k12 = stiffnessByElement[4 * e + 1] as number;
      const k22 = stiffnessByElement[4 * e + 2] as number;
      const k24 = stiffnessByElement[4 * e + 3] as number;
      const v0 = rhs[2 * e] as number;
      const t0 = rhs[2 * e + 1] as number;
      const v1 = rhs[2 * e + 2] as number;
      const t1 = rhs[2 * e + 3] as number;
      const forceLeft = k11 * v0 + k12 * t0 - k11 * v1 + k12 * t1;
      const momentLeft = k12 * v0 + k22 * t0 - k12 * v1 + k24 * t1;
      caseStates.push(momentLeft + (fixedEnd[2 * (c * spanCount + e) + 1] as number));
      shearScratch[e] = -forceLeft + (fixedEnd[2 * (c * spanCount + e)] as number);
    }
    for (let e = 0; e < spanCount; e++) caseStates.push(shearScratch[e] as number);
    for (let i = c * caseStride; i < caseStates.length; i++) allFinite = allFinite && Number.isFinite(caseStates[i] as number);
    if (!allFinite) {
      throw new EngineInputError([{ path: "loads", message: `load case "${caseNames[c] ?? ""}" gives results beyond the range of double precision: check the load and stiffness magnitudes and units` }]);
    }
  }
  const breakpointsMm: number[][] = [];
  for (let e = 0; e < spanCount; e++) breakpointsMm.push(getBreakpoints(terms[e] as ElementTerms, lengthMm[e] as number));
  return {
    spanCount,
    nodeXMm,
    lengthMm,
    eiNmm2,
    inverseShearStiffness,
    caseNames,
    casePatternGroup,
    selfWeightCaseIndex,
    selfWeightNamedCaseIndex,
    caseStates,
    caseStride,
    terms,
    breakpointsMm,
  };
}
