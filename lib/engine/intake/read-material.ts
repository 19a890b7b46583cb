import { ACI_TIME_FACTORS, findMaterial, getCreepFactor, getCreepMethodsForFamily, type CreepSpec, type Material } from "../materials";
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

/** An organization material's id or a library id (string), or a custom material `{ name?, E, G?, density?, creepFactor? }`. */
export function readMaterial(ctx: ReadContext, value: unknown, path: FieldPath): Material | null {
  if (typeof value === "string") {
    const own = ctx.organizationMaterials?.get(value.trim());
    if (own !== undefined) return own;
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

/** What the profile needs from a member's creep behaviour. */
export interface CreepNeeds {
  /** A combination with creep "material" (EN 1995 k_def, NDS K_cr - 1, ACI lambda). */
  material: boolean;
  /** A combination with creep "ibc_creep_component" (IBC 2021 Table 1604.3 D + L row). */
  ibc: boolean;
}

/** A member's creep factors and the assumptions intake made for them. */
export interface MemberCreep {
  materialCreepFactor: number | undefined;
  ibcCreepComponentFactor: number | undefined;
  notes: string[];
}

const MOISTURE_CONDITIONS = ["seasoned_dry", "unseasoned_or_wet"] as const;
type MoistureCondition = (typeof MOISTURE_CONDITIONS)[number];

/**
 * IBC 2021 Table 1604.3 footnote (from memory): the creep component of wood dry at installation
 * and used in dry conditions may be estimated as the immediate deflection of 0.5 D; of wood at
 * other moisture conditions, of D.
 */
export const IBC_WOOD_CREEP_COMPONENT: Record<MoistureCondition, number> = { seasoned_dry: 0.5, unseasoned_or_wet: 1.0 };

/** The largest ACI 318-19 lambda: xi = 2.0 (five years or more) with rho' = 0 (24.2.4.1, from memory). */
const ACI_LARGEST_LAMBDA = ACI_TIME_FACTORS[60];

const WOOD_CONSERVATIVE_NOTE =
  "IBC 2021 Table 1604.3 D + L row: the schedule does not say whether the wood is seasoned and in dry use, so the creep component is taken as 1.0 x dead (the conservative side); give moistureCondition \"seasoned_dry\" for 0.5 x dead";
const CONCRETE_CONSERVATIVE_NOTE =
  "IBC 2021 Table 1604.3 D + L row: no ACI creep given, so the creep component is taken as lambda = 2.0 x dead (ACI 318-19 24.2.4.1 with xi = 2.0 and rho' = 0, the largest); give creep {\"method\": \"aci\", ...} for the member's own lambda";
export const CONCRETE_DEAD_ONLY_NOTE =
  "IBC 2021 Table 1604.3 D + L row on concrete: the creep component covers dead load only; the ACI 318-19 presets also add the creep of the sustained part of live load";

/**
 * K of the IBC creep component K x D: steel and aluminium 0 (the footnote permits zero for steel;
 * aluminium, which does not creep at ambient temperature, likewise, common practice) unless a creep
 * factor is given; wood 0.5 (seasoned, dry use) or 1.0 (other), 1.0 when the schedule does not say;
 * concrete lambda per ACI 318-19 24.2.4.1 (IBC 2021 1604.3.2 defers to ACI 318), 2.0 when not given;
 * custom materials from their moisture condition, creep or creepFactor, and an issue without any.
 */
function resolveIbcCreepComponent(ctx: ReadContext, material: Material, spec: CreepSpec | undefined, moisture: MoistureCondition | undefined, path: FieldPath, notes: string[]): number | null {
  const woodCondition = moisture ?? (spec?.method === "nds" ? spec.condition : undefined);
  switch (material.family) {
    case "steel":
    case "aluminium":
      return spec?.method === "factor" ? spec.factor : 0;
    case "timber":
      if (woodCondition === undefined) notes.push(WOOD_CONSERVATIVE_NOTE);
      return IBC_WOOD_CREEP_COMPONENT[woodCondition ?? "unseasoned_or_wet"];
    case "concrete":
      notes.push(CONCRETE_DEAD_ONLY_NOTE);
      if (spec === undefined) notes.push(CONCRETE_CONSERVATIVE_NOTE);
      return spec === undefined ? ACI_LARGEST_LAMBDA : getCreepFactor(spec);
    case "custom":
      if (woodCondition !== undefined) return IBC_WOOD_CREEP_COMPONENT[woodCondition];
      if (spec !== undefined && spec.method !== "en1995") return getCreepFactor(spec);
      if (spec === undefined && material.creepFactor !== undefined) return material.creepFactor;
      ctx.issues.add(
        childPath(path, spec === undefined ? "creep" : "moistureCondition"),
        `is required: the limit profile's IBC D + L row needs the creep component, and the creep of ${material.label} is unknown; give moistureCondition (wood), creep {"method": "aci", ...} (concrete), {"method": "factor", "factor": 0} (metal) or material.creepFactor`,
      );
      return null;
  }
}

/**
 * The member's creep factors. materialCreepFactor: from its `creep` spec, else a custom
 * material's creepFactor, else 0 for metals (they do not creep at ambient temperature, common
 * practice); timber, concrete and custom materials without either are an issue when the profile
 * has "material" creep combinations, because there is no safe value to assume.
 * ibcCreepComponentFactor: only when the profile has an IBC D + L row (resolveIbcCreepComponent).
 */
export function resolveMemberCreep(
  ctx: ReadContext,
  material: Material,
  creepValue: unknown,
  moistureValue: unknown,
  path: FieldPath,
  needs: CreepNeeds,
): MemberCreep | null {
  let spec: CreepSpec | undefined;
  if (creepValue !== undefined) {
    const creepPath = childPath(path, "creep");
    const read = readCreepSpec(ctx, creepValue, creepPath);
    if (read === null) return null;
    if (!getCreepMethodsForFamily(material.family).includes(read.method)) {
      ctx.issues.add(childPath(creepPath, "method"), `${read.method} creep does not apply to ${material.family} (${material.label})`);
      return null;
    }
    if (material.creepFactor !== undefined) {
      ctx.issues.add(creepPath, "give either material.creepFactor or creep, not both");
      return null;
    }
    spec = read;
  }
  let moisture: MoistureCondition | undefined;
  if (moistureValue !== undefined) {
    const moisturePath = childPath(path, "moistureCondition");
    const read = readEnum(ctx, moistureValue, moisturePath, MOISTURE_CONDITIONS);
    if (read === null) return null;
    if (material.family !== "timber" && material.family !== "custom") {
      ctx.issues.add(moisturePath, `applies to wood only, not ${material.family} (${material.label})`);
      return null;
    }
    if (spec?.method === "nds" && spec.condition !== read) {
      ctx.issues.add(moisturePath, `contradicts creep.condition "${spec.condition}"`);
      return null;
    }
    // service class 3 is wet service (EN 1995-1-1 2.3.1.3, from memory): not the dry use that the IBC 0.5 D presumes
    if (spec?.method === "en1995" && spec.serviceClass === 3 && read === "seasoned_dry") {
      ctx.issues.add(moisturePath, 'contradicts creep.serviceClass 3 (wet service): give "unseasoned_or_wet"');
      return null;
    }
    moisture = read;
  }
  const notes: string[] = [];
  const materialCreepFactor = resolveMaterialCreepFactor(ctx, material, spec, path, needs.material);
  if (materialCreepFactor === null) return null;
  const ibcCreepComponentFactor = needs.ibc ? resolveIbcCreepComponent(ctx, material, spec, moisture, path, notes) : undefined;
  if (ibcCreepComponentFactor === null) return null;
  return { materialCreepFactor, ibcCreepComponentFactor, notes };
}

function resolveMaterialCreepFactor(ctx: ReadContext, material: Material, spec: CreepSpec | undefined, path: FieldPath, profileUsesCreep: boolean): number | undefined | null {
  if (spec !== undefined) return getCreepFactor(spec);
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
