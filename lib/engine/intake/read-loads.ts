import type { Load } from "../model";
import { POSITION_TOLERANCE_RATIO } from "../solver/validate-member";
import { CASE_NAME_PATTERN } from "./read-profile";
import {
  childPath,
  createFieldSpec,
  describeType,
  isJsonObject,
  readBoolean,
  readEnum,
  readObject,
  readQuantity,
  readString,
  type FieldPath,
  type FieldSpec,
  type ReadContext,
} from "./read-values";

export const MAX_LOADS_PER_MEMBER = 1000;

const LOAD_KINDS: readonly Load["kind"][] = ["uniform", "linear", "point", "moment"];

const LOAD_SPECS: Record<Load["kind"], FieldSpec> = {
  uniform: createFieldSpec(["type", "case", "w", "pressure", "tributaryWidth", "start", "end", "fixed"], ["case"]),
  linear: createFieldSpec(["type", "case", "start", "end", "wStart", "wEnd", "fixed"], ["case", "start", "end", "wStart", "wEnd"]),
  point: createFieldSpec(["type", "case", "at", "P", "fixed"], ["case", "at", "P"]),
  moment: createFieldSpec(["type", "case", "at", "M", "fixed"], ["case", "at", "M"]),
};

type UniformLoad = Extract<Load, { kind: "uniform" }>;

/** Positions within this many mm of an end count as at the end (unit round-off). */
function getPositionToleranceMm(totalMm: number): number {
  return totalMm * POSITION_TOLERANCE_RATIO;
}

function readPosition(ctx: ReadContext, value: unknown, path: FieldPath, totalMm: number): number | null {
  const mm = readQuantity(ctx, value, path, "length", "any");
  if (mm === null) return null;
  const tolerance = getPositionToleranceMm(totalMm);
  if (mm < -tolerance) {
    ctx.issues.add(path, "must not be negative (positions are measured from the member's left end, overhang included)");
    return null;
  }
  if (mm > totalMm + tolerance) {
    ctx.issues.add(path, `beyond the end of the member (total length ${Math.round(totalMm * 1000) / 1000} mm, overhangs included)`);
    return null;
  }
  return Math.min(Math.max(mm, 0), totalMm);
}

function readUniformIntensity(ctx: ReadContext, block: Record<string, unknown>, path: FieldPath): number | null {
  const hasW = block.w !== undefined;
  const hasPressure = block.pressure !== undefined || block.tributaryWidth !== undefined;
  if (hasW === hasPressure) {
    ctx.issues.add(path, "a uniform load needs either w, or pressure with tributaryWidth");
    return null;
  }
  if (hasW) return readQuantity(ctx, block.w, childPath(path, "w"), "distributedLoad", "any");
  const pressure = block.pressure === undefined ? null : readQuantity(ctx, block.pressure, childPath(path, "pressure"), "pressure", "any");
  if (block.pressure === undefined) ctx.issues.add(childPath(path, "pressure"), "is required with tributaryWidth");
  const width = block.tributaryWidth === undefined ? null : readQuantity(ctx, block.tributaryWidth, childPath(path, "tributaryWidth"), "length", "positive");
  if (block.tributaryWidth === undefined) ctx.issues.add(childPath(path, "tributaryWidth"), "is required with pressure");
  // N/mm^2 x mm = N/mm.
  return pressure === null || width === null ? null : pressure * width;
}

/** A load's case: a valid name that the limit profile uses (else the load would be ignored). */
function readLoadCase(ctx: ReadContext, value: unknown, loadPath: FieldPath, usedCases: Set<string> | null, profileId: string): string | null {
  if (value === undefined) return null;
  const casePath = childPath(loadPath, "case");
  const loadCase = readString(ctx, value, casePath, 40);
  if (loadCase === null) return null;
  if (!CASE_NAME_PATTERN.test(loadCase)) {
    ctx.issues.add(casePath, "load case names are lowercase letters, digits and _ (starting with a letter)");
    return null;
  }
  if (usedCases && !usedCases.has(loadCase)) {
    ctx.issues.add(casePath, `"${loadCase}" is not used by limit profile ${profileId} (its cases: ${[...usedCases].join(", ")}); the load would be ignored`);
    return null;
  }
  return loadCase;
}

/**
 * Reads one load. Positions are in length units from the member's left end, left overhang
 * included; intensities are positive downward. `fixed: true` keeps the load whole when its case
 * is patterned (a tank or plant at fixed positions).
 */
export function readLoad(ctx: ReadContext, value: unknown, path: FieldPath, totalMm: number, usedCases: Set<string> | null, profileId: string): Load | null {
  const load = readLoadBody(ctx, value, path, totalMm, usedCases, profileId);
  if (load === null || !isJsonObject(value) || value.fixed === undefined) return load;
  const fixed = readBoolean(ctx, value.fixed, childPath(path, "fixed"));
  if (fixed === null) return null;
  if (fixed) load.fixed = true;
  return load;
}

function readLoadBody(ctx: ReadContext, value: unknown, path: FieldPath, totalMm: number, usedCases: Set<string> | null, profileId: string): Load | null {
  if (!isJsonObject(value)) {
    ctx.issues.add(path, `must be an object, got ${describeType(value)}`);
    return null;
  }
  const kind = readEnum(ctx, value.type, childPath(path, "type"), LOAD_KINDS);
  if (kind === null) return null;
  const block = readObject(ctx, value, path, LOAD_SPECS[kind]);
  if (!block) return null;
  const loadCase = readLoadCase(ctx, block.case, path, usedCases, profileId);
  switch (kind) {
    case "uniform": {
      const w = readUniformIntensity(ctx, block, path);
      const startMm = block.start === undefined ? undefined : readPosition(ctx, block.start, childPath(path, "start"), totalMm);
      const endMm = block.end === undefined ? undefined : readPosition(ctx, block.end, childPath(path, "end"), totalMm);
      if (w === null || loadCase === null || startMm === null || endMm === null) return null;
      if ((endMm ?? totalMm) <= (startMm ?? 0)) {
        ctx.issues.add(childPath(path, "end"), "must be beyond start");
        return null;
      }
      // Assigned one by one rather than spread: this runs for every load of every member.
      const load: UniformLoad = { kind, loadCase, wNPerMm: w };
      if (startMm !== undefined) load.startMm = startMm;
      if (endMm !== undefined) load.endMm = endMm;
      return load;
    }
    case "linear": {
      const startMm = readPosition(ctx, block.start, childPath(path, "start"), totalMm);
      const endMm = readPosition(ctx, block.end, childPath(path, "end"), totalMm);
      const wStart = readQuantity(ctx, block.wStart, childPath(path, "wStart"), "distributedLoad", "any");
      const wEnd = readQuantity(ctx, block.wEnd, childPath(path, "wEnd"), "distributedLoad", "any");
      if (startMm === null || endMm === null || wStart === null || wEnd === null || loadCase === null) return null;
      if (endMm <= startMm) {
        ctx.issues.add(childPath(path, "end"), "must be beyond start");
        return null;
      }
      return { kind, loadCase, startMm, endMm, wStartNPerMm: wStart, wEndNPerMm: wEnd };
    }
    case "point": {
      const atMm = readPosition(ctx, block.at, childPath(path, "at"), totalMm);
      const pN = readQuantity(ctx, block.P, childPath(path, "P"), "force", "any");
      return atMm === null || pN === null || loadCase === null ? null : { kind, loadCase, atMm, pN };
    }
    case "moment": {
      const atMm = readPosition(ctx, block.at, childPath(path, "at"), totalMm);
      const mNmm = readQuantity(ctx, block.M, childPath(path, "M"), "moment", "any");
      return atMm === null || mNmm === null || loadCase === null ? null : { kind, loadCase, atMm, mNmm };
    }
  }
}
