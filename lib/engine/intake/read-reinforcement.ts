/**
 * Reads a concrete member's `reinforcement` and turns it, with the span's section outline and
 * concrete, into the engine's ReinforcedConcreteSection (ACI 318-19 24.2.3, from memory).
 */
import { getCompressionSteelRatio } from "../concrete/cracked-section";
import { findReinforcementProblems } from "../concrete/validate-reinforcement";
import { ACI_TIME_FACTORS, type Material } from "../materials";
import type { ReinforcedConcreteSection } from "../model";
import type { ResolvedSection } from "./read-section";
import { childPath, createFieldSpec, readNumber, readObject, readQuantity, readEnum, type FieldPath, type ReadContext } from "./read-values";

/** ACI 318-19 20.2.2.2: E_s = 200,000 MPa for nonprestressed bars (from memory). */
export const DEFAULT_STEEL_E_MPA = 200_000;
/** ACI 318-19 19.2.3.1: f_r = 0.62 lambda sqrt(f'c) MPa; lambda = 1 for the library's normal-weight concrete (19.2.4, from memory). */
export const RUPTURE_COEFFICIENT_SQRT_MPA = 0.62;
/** Sustained-load duration when a reinforced member gives none: five years or more (xi = 2.0, the largest, conservative). */
export const DEFAULT_DURATION_MONTHS = 60;

const REINFORCEMENT_SPEC = createFieldSpec(["tensionSteel", "effectiveDepth", "compressionSteel", "compressionDepth", "topSteel", "topDepth", "steelE"], ["tensionSteel", "effectiveDepth"]);
const CREEP_SPEC = createFieldSpec(["method", "durationMonths", "compressionRatio", "factor"], ["method"]);

/** The schedule's name of each engine field of the reinforcement block, for messages from the solver too. */
export const REINFORCEMENT_PUBLIC_FIELDS: Partial<Record<keyof ReinforcedConcreteSection, string>> = {
  tensionSteelMm2: "tensionSteel",
  effectiveDepthMm: "effectiveDepth",
  compressionSteelMm2: "compressionSteel",
  compressionDepthMm: "compressionDepth",
  topSteelMm2: "topSteel",
  topEffectiveDepthMm: "topDepth",
  steelEMpa: "steelE",
};

/** The reinforcement as read, internal units, with its public path for later messages. */
export interface ReinforcementInput {
  path: FieldPath;
  tensionSteelMm2: number;
  effectiveDepthMm: number;
  compressionSteelMm2?: number;
  compressionDepthMm?: number;
  topSteelMm2?: number;
  topEffectiveDepthMm?: number;
  steelEMpa: number;
}

/**
 * `{ tensionSteel, effectiveDepth, compressionSteel?, compressionDepth?, topSteel?, topDepth?, steelE? }`:
 * areas in area units, depths (from the compression face; topDepth from the bottom face, the
 * compression face under hogging) in section-dimension units, steelE in modulus units (default
 * 200,000 MPa). Compression steel and top steel each need both their area and their depth.
 */
export function readReinforcement(ctx: ReadContext, value: unknown, path: FieldPath): ReinforcementInput | null {
  const block = readObject(ctx, value, path, REINFORCEMENT_SPEC);
  if (!block) return null;
  const before = ctx.issues.count;
  const tension = readQuantity(ctx, block.tensionSteel, childPath(path, "tensionSteel"), "area", "positive");
  const depth = readQuantity(ctx, block.effectiveDepth, childPath(path, "effectiveDepth"), "sectionDimension", "positive");
  const compression = block.compressionSteel === undefined ? undefined : readQuantity(ctx, block.compressionSteel, childPath(path, "compressionSteel"), "area", "positive");
  const compressionDepth = block.compressionDepth === undefined ? undefined : readQuantity(ctx, block.compressionDepth, childPath(path, "compressionDepth"), "sectionDimension", "positive");
  const top = block.topSteel === undefined ? undefined : readQuantity(ctx, block.topSteel, childPath(path, "topSteel"), "area", "positive");
  const topDepth = block.topDepth === undefined ? undefined : readQuantity(ctx, block.topDepth, childPath(path, "topDepth"), "sectionDimension", "positive");
  if ((block.topSteel === undefined) !== (block.topDepth === undefined)) {
    ctx.issues.add(childPath(path, block.topSteel === undefined ? "topSteel" : "topDepth"), "top steel needs both topSteel (area) and topDepth (d_top, from the bottom face)");
  }
  const steelE = block.steelE === undefined ? DEFAULT_STEEL_E_MPA : readQuantity(ctx, block.steelE, childPath(path, "steelE"), "modulus", "positive");
  if ((block.compressionSteel === undefined) !== (block.compressionDepth === undefined)) {
    ctx.issues.add(childPath(path, block.compressionSteel === undefined ? "compressionSteel" : "compressionDepth"), "compression steel needs both compressionSteel (area) and compressionDepth (d', from the compression face)");
  }
  if (ctx.issues.count > before || tension === null || depth === null || compression === null || compressionDepth === null || top === null || topDepth === null || steelE === null) return null;
  const input: ReinforcementInput = { path, tensionSteelMm2: tension, effectiveDepthMm: depth, steelEMpa: steelE };
  if (compression !== undefined && compressionDepth !== undefined) {
    input.compressionSteelMm2 = compression;
    input.compressionDepthMm = compressionDepth;
  }
  if (top !== undefined && topDepth !== undefined) {
    input.topSteelMm2 = top;
    input.topEffectiveDepthMm = topDepth;
  }
  return input;
}

/**
 * The engine's section for one span: the reinforcement on the span's outline (rectangle or tee)
 * with f_r = 0.62 sqrt(f'c) of the span's library concrete. Records an issue (at the
 * reinforcement's path, naming the span when it is not the member's own) and returns null for a
 * non-concrete material, a section without an outline, or d >= h and the like.
 */
export function createReinforcedSection(ctx: ReadContext, input: ReinforcementInput, section: ResolvedSection, material: Material, spanOrigin: string): ReinforcedConcreteSection | null {
  const where = ` (${spanOrigin})`;
  if (material.family !== "concrete" || material.fcMpa === undefined) {
    ctx.issues.add(input.path, `reinforcement needs a library concrete material (concrete-fc<f'c in MPa>), not ${material.label}${where}`);
    return null;
  }
  if (section.outline === undefined) {
    ctx.issues.add(input.path, `reinforcement needs a rectangle or tee section (the concrete outline), not ${section.name}${where}`);
    return null;
  }
  const built: ReinforcedConcreteSection = {
    ...section.outline,
    tensionSteelMm2: input.tensionSteelMm2,
    effectiveDepthMm: input.effectiveDepthMm,
    steelEMpa: input.steelEMpa,
    ruptureMpa: RUPTURE_COEFFICIENT_SQRT_MPA * Math.sqrt(material.fcMpa),
  };
  if (input.compressionSteelMm2 !== undefined) {
    built.compressionSteelMm2 = input.compressionSteelMm2;
    built.compressionDepthMm = input.compressionDepthMm;
  }
  if (input.topSteelMm2 !== undefined) {
    built.topSteelMm2 = input.topSteelMm2;
    built.topEffectiveDepthMm = input.topEffectiveDepthMm;
  }
  const problems = findReinforcementProblems(built);
  for (const problem of problems) ctx.issues.add(childPath(input.path, REINFORCEMENT_PUBLIC_FIELDS[problem.field] ?? problem.field), `${problem.message}${where}`);
  return problems.length > 0 ? null : built;
}

/**
 * lambda_Delta = xi / (1 + 50 rho') of a reinforced member (ACI 318-19 24.2.4.1.1 and Table
 * 24.2.4.1.3, from memory), rho' = A's / (b d) of each span, the smallest (largest lambda) over
 * the spans (0 where a span has none). `creep` may give `{ "method": "aci", "durationMonths": 3 | 6 | 12 | 60 }` (rho' comes
 * from the reinforcement, so compressionRatio is refused) or `{ "method": "factor", "factor" }`;
 * without it the duration is five years or more (xi = 2.0, conservative).
 */
export function resolveReinforcedCreepFactor(ctx: ReadContext, creepValue: unknown, memberPath: FieldPath, sections: readonly (ReinforcedConcreteSection | null)[]): number | null {
  let rhoPrime = Infinity;
  // a span without reinforcement has no known compression steel: rho' = 0 there
  if (sections.includes(null)) rhoPrime = 0;
  for (const section of sections) if (section !== null) rhoPrime = Math.min(rhoPrime, getCompressionSteelRatio(section));
  if (creepValue === undefined) return ACI_TIME_FACTORS[DEFAULT_DURATION_MONTHS] / (1 + 50 * rhoPrime);
  const path = childPath(memberPath, "creep");
  const block = readObject(ctx, creepValue, path, CREEP_SPEC);
  if (!block) return null;
  const method = readEnum(ctx, block.method, childPath(path, "method"), ["aci", "factor"] as const);
  if (method === null) return null;
  if (method === "factor") {
    for (const key of ["durationMonths", "compressionRatio"]) if (block[key] !== undefined) ctx.issues.add(childPath(path, key), "does not apply to method factor");
    return readNumber(ctx, block.factor, childPath(path, "factor"), "nonNegative");
  }
  if (block.factor !== undefined) ctx.issues.add(childPath(path, "factor"), "does not apply to method aci");
  if (block.compressionRatio !== undefined) ctx.issues.add(childPath(path, "compressionRatio"), "is derived from the reinforcement (rho' = A's / (b d)); leave it out");
  const months = block.durationMonths;
  if (months !== 3 && months !== 6 && months !== 12 && months !== 60) {
    ctx.issues.add(childPath(path, "durationMonths"), "must be 3, 6, 12 or 60 (60 = five years or more)");
    return null;
  }
  if (block.factor !== undefined || block.compressionRatio !== undefined) return null;
  return ACI_TIME_FACTORS[months] / (1 + 50 * rhoPrime);
}
