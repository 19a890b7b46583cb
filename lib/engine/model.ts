/**
 * The engine's internal model: every quantity already converted to one system.
 *
 * Internal units (never mixed): length mm, force N, distributed load N/mm, moment N*mm,
 * modulus and stress MPa (N/mm^2), second moment mm^4, area mm^2, density kg/m^3,
 * frequency Hz, rotation rad. Intake (lib/engine/intake) converts public schedules into this
 * model once; the solver and the checks read nothing else.
 *
 * Sign convention: x runs from the member's left end; loads and deflections are positive
 * downward (gravity); an applied moment is positive clockwise with x to the right.
 */

/** Standard gravity, m/s^2 (NIST SP 330, the defined value of g_n). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

export type MemberCategory =
  | "floor_beam"
  | "roof_beam"
  | "lintel"
  | "purlin_girt"
  | "wall_stud"
  | "cantilever"
  | "other";

export type SupportKind = "pinned" | "roller" | "fixed" | "free" | "spring";

/** A support at a node (the ends of each span). `spring` carries a vertical stiffness. */
export interface Support {
  kind: SupportKind;
  /** Vertical spring stiffness, N/mm; only for kind "spring". */
  springNPerMm?: number;
}

/** Stiffness and mass of one span (segment between two nodes). */
export interface SpanSegment {
  lengthMm: number;
  eMpa: number;
  iMm4: number;
  /** Cross-section area, for self-weight and frequency mass. */
  areaMm2?: number;
  /** Shear area (k*A) and shear modulus, only when shear deformation is requested. */
  shearAreaMm2?: number;
  gMpa?: number;
  /** Material density, for self-weight. */
  densityKgPerM3?: number;
  /**
   * Reinforced concrete: the span deflects with I_e (ACI 318-19 24.2.3.5) instead of iMm4, which
   * is then the gross concrete I_g of the outline below. Absent for every other material.
   */
  reinforcedConcrete?: ReinforcedConcreteSection;
}

/**
 * Outline and reinforcement of a reinforced concrete span, internal units (mm, mm^2, MPa). One
 * layout per span: the section at the span's critical moment, depths measured from the
 * compression face (bottom steel of a simple span, top steel of a cantilever). A flange, when
 * given, is on the face in compression under sagging moment.
 */
export interface ReinforcedConcreteSection {
  /** Web width b_w (the whole width of a rectangle) and overall depth h, mm. */
  webWidthMm: number;
  depthMm: number;
  /** Flange width b_f and thickness h_f of a flanged (T) section, mm; both or neither. */
  flangeWidthMm?: number;
  flangeThicknessMm?: number;
  /** Tension steel A_s (mm^2) at effective depth d (mm). */
  tensionSteelMm2: number;
  effectiveDepthMm: number;
  /** Compression steel A's (mm^2) at depth d' (mm); both or neither. */
  compressionSteelMm2?: number;
  compressionDepthMm?: number;
  /**
   * Top steel: the steel in tension under hogging (negative) moment, A_s,top (mm^2) at effective
   * depth d_top measured from the bottom face (the compression face under hogging), mm; both or
   * neither. When given, negative-moment regions use it (with the bottom tension steel as
   * compression steel). Absent: see cracked-section.ts HoggingLayout.
   */
  topSteelMm2?: number;
  topEffectiveDepthMm?: number;
  /** Steel modulus E_s, MPa (ACI 318-19 20.2.2.2: 200,000). */
  steelEMpa: number;
  /** Modulus of rupture f_r, MPa (ACI 318-19 19.2.3.1: 0.62 lambda sqrt(f'c)). */
  ruptureMpa: number;
}

/**
 * Loads are positioned along the whole member, in mm from its left end. `fixed`: the load is
 * always present in full with its case (a tank or plant at fixed positions), so it is never
 * patterned span by span even when its case is variable (see LimitProfile.patternLoads).
 */
export type Load =
  | { kind: "uniform"; loadCase: string; wNPerMm: number; startMm?: number; endMm?: number; fixed?: boolean }
  | {
      kind: "linear";
      loadCase: string;
      startMm: number;
      endMm: number;
      wStartNPerMm: number;
      wEndNPerMm: number;
      fixed?: boolean;
    }
  | { kind: "point"; loadCase: string; atMm: number; pN: number; fixed?: boolean }
  | { kind: "moment"; loadCase: string; atMm: number; mNmm: number; fixed?: boolean };

/**
 * One serviceability combination. Deflection of the combination =
 * sum over cases of factors[case] * deflection(case)
 *   + creepFactor * sum over cases of sustainedFactors[case] * deflection(case).
 * creepFactor is the member material's when `creep` is "material" (k_def, K_cr - 1, lambda),
 * the member's IBC 2021 Table 1604.3 creep-component factor when `creep` is
 * "ibc_creep_component" (Member.ibcCreepComponentFactor), a fixed number otherwise, and 0 when
 * absent.
 */
export interface Combination {
  id: string;
  label: string;
  factors: Record<string, number>;
  sustainedFactors?: Record<string, number>;
  creep?: "material" | "ibc_creep_component" | number;
  /** Allowed deflection = effective span / limitRatio, capped by capMm when given. */
  limitRatio: number;
  capMm?: number;
  /**
   * When given, a cantilever is judged on its own length (no multiplier) against this ratio: for
   * codes with their own cantilever limits (EN 1995-1-1 Table 7.2). Absent: the profile's
   * cantileverSpanMultiplier and limitRatio apply.
   */
  cantileverLimitRatio?: number;
}

export interface LimitProfile {
  id: string;
  label: string;
  /** The published source the preset follows, e.g. "IBC 2021 Table 1604.3". */
  source: string;
  combinations: Combination[];
  /** A cantilever is judged on this multiple of its length (IBC 2021 Table 1604.3 note: 2). */
  cantileverSpanMultiplier: number;
  /** Optional minimum first natural frequency; mass from the named load cases' factors. */
  frequency?: { minHz: number; massFactors: Record<string, number> };
  /**
   * Pattern (partial) loading of variable cases, span by span, in the worst arrangement for each
   * check. On unless this is false (false: every load is present everywhere at once, for loads
   * that cannot be partial). Variable cases: live, roof_live, snow, plus variableCases.
   */
  patternLoads?: boolean;
  /** User load cases that are variable (patterned) besides live, roof_live and snow. */
  variableCases?: string[];
}

export interface Member {
  mark: string;
  category: MemberCategory;
  quantity: number;
  /** spans.length + 1 supports, one per node, left to right. */
  supports: Support[];
  spans: SpanSegment[];
  loads: Load[];
  /** Add self-weight from each span's area and density to this load case (usually "dead"). */
  selfWeightCase?: string;
  /** Creep factor of the material for combinations whose creep is "material". */
  materialCreepFactor?: number;
  /**
   * K in the creep component K x D of IBC 2021 Table 1604.3's D + L row, for combinations whose
   * creep is "ibc_creep_component": 0 steel and aluminium, 0.5 seasoned wood in dry use, 1.0
   * other wood, lambda (ACI 318-19 24.2.4.1) for concrete.
   */
  ibcCreepComponentFactor?: number;
  /** Assumptions intake made for this member (e.g. a conservative default), shown with its result. */
  intakeNotes?: string[];
  includeShearDeformation?: boolean;
  /**
   * A concrete member given without reinforcement and without an explicit effective I: checked
   * with I_g, and every view says "gross section: cracking not included".
   */
  concreteGrossSection?: boolean;
  /** Where the member came from, for messages and catalogue re-sizing. */
  sectionName?: string;
  materialName?: string;
}

/** A catalogue entry: a named section with its properties, for the lightest-section search. */
export interface CatalogueSection {
  name: string;
  iMm4: number;
  areaMm2: number;
  /** Mass per metre, kg/m; the search orders by it ("lightest"). */
  massKgPerM: number;
  shearAreaMm2?: number;
}

/** An input problem: a path like `members[12].spans[1].length` and a reason. */
export interface InputIssue {
  path: string;
  message: string;
}

export interface CheckResult {
  combinationId: string;
  spanIndex: number;
  /** "cantilever" for a span with one free end; its effective span is multiplied. */
  spanKind: "span" | "cantilever";
  spanMm: number;
  effectiveSpanMm: number;
  /** Largest absolute deflection within the span, mm (signed: + downward). */
  deflectionMm: number;
  /** Position of that deflection, mm from the member's left end. */
  atMm: number;
  allowedMm: number;
  utilization: number;
  /** allowed / actual; Infinity is never returned: a zero deflection gives null. */
  factorOfSafety: number | null;
  pass: boolean;
  /**
   * Pattern loading: per variable case of the combination, the spans (indices) whose variable
   * loads were present in the worst arrangement for this check; a case with [] was left off
   * everywhere. Absent when no pattern applied (one clear span, patterns off, no variable load).
   */
  loadedSpans?: Record<string, number[]>;
  /**
   * Only for members on spring supports (rigid supports do not move, so the two are equal): the
   * span's extreme measured from the chord between its supports (for an overhang, from its
   * support), the extreme of the total deflection (settlement included), both mm, + down, and
   * the settlement of those supports (left to right, one for an overhang) under the arrangement
   * judged. deflectionMm is the larger in magnitude of the two extremes (the conservative
   * choice where a limit can be read either way).
   */
  chordDeflectionMm?: number;
  totalDeflectionMm?: number;
  supportSettlementMm?: number[];
  /** Which extreme deflectionMm is: "total" (settlement included) or "chord". */
  deflectionBasis?: "total" | "chord";
  /** The limit as l/N: the N the check used (the cantilever ratio for a cantilever when the combination has one). */
  limitRatio?: number;
  /** The achieved l/N: effectiveSpanMm / |deflectionMm|; null for zero deflection. */
  achievedRatio?: number | null;
}

/**
 * The check that governs a member, deflection or frequency: the highest utilization, where a
 * frequency's utilization is minHz / hz (and its factor of safety hz / minHz).
 */
export interface GoverningCheck {
  kind: "deflection" | "frequency";
  /** `${combinationId}@${spanIndex}` for a deflection check, "frequency" for the frequency. */
  key: string;
  utilization: number;
  factorOfSafety: number | null;
  pass: boolean;
}

export interface RotationResult {
  combinationId: string;
  nodeIndex: number;
  atMm: number;
  rotationRad: number;
}

export interface FrequencyResult {
  hz: number;
  minHz: number;
  pass: boolean;
  /**
   * "exact": closed form for one uniform span; "finite_element": converged consistent-mass
   * eigenvalue (lib/engine/frequency.ts). "rayleigh" is no longer produced; it stays readable
   * for results stored before the change.
   */
  method: "exact" | "finite_element" | "rayleigh";
}

export interface ShapeSample {
  xMm: number;
  /** Deflection per combination id, mm, + downward. */
  deflectionMm: Record<string, number>;
}

export interface MemberResult {
  mark: string;
  category: MemberCategory;
  checks: CheckResult[];
  /** The deflection check with the highest utilization (frequency not included: see governingCheck). */
  governing: CheckResult | null;
  /** What governs the member overall, frequency included; checkMember always sets it. */
  governingCheck?: GoverningCheck | null;
  rotations: RotationResult[];
  frequency: FrequencyResult | null;
  pass: boolean;
  /**
   * Only for a failing member. minIMm4 is null when no uniform I passes (a note says why);
   * the suggestion is null when neither a minimum I nor a passing catalogue section exists.
   */
  suggestion: { minIMm4: number | null; sectionName: string | null } | null;
  /** The sampled deflected shape, only when checkMember was asked for it. */
  shape?: ShapeSample[];
  /**
   * Optional plain-language remarks from the engine, e.g. why a failing member has no
   * suggestion (added by the solver/checks work; optional, so older results stay valid).
   */
  notes?: string[];
}
