import { findMaterial, getCreepFactor, getCreepMethodsForFamily, type CreepSpec, type Material } from "../materials";
import {
  childPath,
  createFieldSpec,
  readEnum,
  readInteger,
  readNumber,
  readObject,
  readQuantity,
  readString,
  type FieldPath,
  type ReadContext,
} from "./read-values";

const CUSTOM_MATERIAL_SPEC = createFieldSpec(["name", "E", "G", "density", "creepFactor"], ["E"]);
const CREEP_SPEC_FIELDS = createFieldSpec(["method", "serviceClass", "condition", "durationMonths", "compressionRatio", "factor"], ["method"]);

/** A library id (string) or a custom material `{ name?, E, G?, density?, creepFactor? }`. */
export function readMaterial(ctx: ReadContext, value: unknown, path: FieldPath): Material | null {
  if (typeof value === "string") {
    const found = findMaterial(value);
    if (!found.ok) {
      ctx.issues.add(path, found.message);
      return null;
    }
    return found.material;
  }
  const block = readObject(ctx, value, path, CUSTOM_MATERIAL_SPEC);
  if (!block) return null;
  const name = block.name === undefined ? "custom material" : readString(ctx, block.name, childPath(path, "name"), 100);
  const eMpa = readQuantity(ctx, block.E, childPath(path, "E"), "modulus", "positive");
  const gMpa = block.G === undefined ? null : readQuantity(ctx, block.G, childPath(path, "G"), "modulus", "positive");
  const density = block.density === undefined ? null : readQuantity(ctx, block.density, childPath(path, "density"), "density", "positive");
  const creepFactor = block.creepFactor === undefined ? undefined : readNumber(ctx, block.creepFactor, childPath(path, "creepFactor"), "nonNegative");
  if (name === null || eMpa === null || (block.G !== undefined && gMpa === null) || (block.density !== undefined && density === null) || creepFactor === null) {
    return null;
  }
  return {
    id: "custom",
    label: name,
    family: "custom",
    eMpa,
    gMpa,
    densityKgPerM3: density,
    ...(creepFactor === undefined ? {} : { creepFactor }),
    source: "given in the schedule",
  };
}

const CREEP_METHODS = ["en1995", "nds", "aci", "factor"] as const;
const CREEP_FIELDS_BY_METHOD: Record<CreepSpec["method"], readonly string[]> = {
  en1995: ["serviceClass"],
  nds: ["condition"],
  aci: ["durationMonths", "compressionRatio"],
  factor: ["factor"],
};

/** Reads a member's `creep`: `{ method: "en1995" | "nds" | "aci" | "factor", ... }`. */
function readCreepSpec(ctx: ReadContext, value: unknown, path: FieldPath): CreepSpec | null {
  const block = readObject(ctx, value, path, CREEP_SPEC_FIELDS);
  if (!block) return null;
  const method = readEnum(ctx, block.method, childPath(path, "method"), CREEP_METHODS);
  if (method === null) return null;
  for (const key of Object.keys(block)) {
    if (key !== "method" && !CREEP_FIELDS_BY_METHOD[method].includes(key)) ctx.issues.add(childPath(path, key), `does not apply to method ${method}`);
  }
  switch (method) {
    case "en1995": {
      const serviceClass = readInteger(ctx, block.serviceClass, childPath(path, "serviceClass"), 1, 3);
      return serviceClass === null ? null : { method, serviceClass: serviceClass as 1 | 2 | 3 };
    }
    case "nds": {
      const condition = readEnum(ctx, block.condition, childPath(path, "condition"), ["seasoned_dry", "unseasoned_or_wet"] as const);
      return condition === null ? null : { method, condition };
    }
    case "aci": {
      const months = block.durationMonths;
      const durationMonths = months === 3 || months === 6 || months === 12 || months === 60 ? months : null;
      if (durationMonths === null) ctx.issues.add(childPath(path, "durationMonths"), "must be 3, 6, 12 or 60 (60 = five years or more)");
      const compressionRatio = readNumber(ctx, block.compressionRatio, childPath(path, "compressionRatio"), "nonNegative");
      if (compressionRatio !== null && compressionRatio > 0.1) ctx.issues.add(childPath(path, "compressionRatio"), "must be a ratio such as 0.005, not a percentage");
      return durationMonths === null || compressionRatio === null || compressionRatio > 0.1 ? null : { method, durationMonths, compressionRatio };
    }
    case "factor": {
      const factor = readNumber(ctx, block.factor, childPath(path, "factor"), "nonNegative");
      return factor === null ? null : { method, factor };
    }
  }
}

/**
 * The member's creep factor: from its `creep` spec, else a custom material's creepFactor, else 0
 * for metals (they do not creep at ambient temperature, common practice). Timber, concrete and
 * custom materials without either are an issue when the profile has long-term combinations,
 * because there is no safe value to assume.
 */
export function resolveCreepFactor(
  ctx: ReadContext,
  material: Material,
  creepValue: unknown,
  path: FieldPath,
  profileUsesCreep: boolean,
): number | undefined | null {
  if (creepValue !== undefined) {
    const creepPath = childPath(path, "creep");
    const spec = readCreepSpec(ctx, creepValue, creepPath);
    if (spec === null) return null;
    if (!getCreepMethodsForFamily(material.family).includes(spec.method)) {
      ctx.issues.add(childPath(creepPath, "method"), `${spec.method} creep does not apply to ${material.family} (${material.label})`);
      return null;
    }
    if (material.creepFactor !== undefined) {
      ctx.issues.add(creepPath, "give either material.creepFactor or creep, not both");
      return null;
    }
    return getCreepFactor(spec);
  }
  if (material.creepFactor !== undefined) return material.creepFactor;
  if (material.family === "steel" || material.family === "aluminium") return 0;
  if (!profileUsesCreep) return undefined;
  const hint =
    material.family === "timber"
      ? '{"method": "en1995", "serviceClass": 1}, {"method": "nds", "condition": "seasoned_dry"} or {"method": "factor", "factor": 0.6}'
      : material.family === "concrete"
        ? '{"method": "aci", "durationMonths": 60, "compressionRatio": 0} (or give the reinforcement: rho\' then comes from it)'
        : 'material.creepFactor or {"method": "factor", "factor": ...}';
  ctx.issues.add(childPath(path, "creep"), `is required: the limit profile has long-term (creep) combinations and ${material.label} creeps; give ${hint}`);
  return null;
}
