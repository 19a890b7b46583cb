import { findUnit, QUANTITY_KINDS, SYSTEM_DEFAULT_UNITS, type QuantityKind, type UnitSystem } from "../units";
import { childPath, createFieldSpec, readEnum, readObject, type FieldPath, type ReadContext, type UnitDefaults } from "./read-values";

const UNITS_SPEC = createFieldSpec(["system", ...QUANTITY_KINDS]);

/**
 * Reads `units`: `system` ("SI" or "US") gives a default unit for every kind, and any kind may
 * be set on its own (it wins over the system). Kinds left without a default make bare numbers
 * of that kind an issue.
 */
export function readUnits(ctx: ReadContext, value: unknown, path: FieldPath): UnitDefaults {
  const defaults: UnitDefaults = { system: null, byKind: {} };
  const block = readObject(ctx, value, path, UNITS_SPEC);
  if (!block) return defaults;
  if (block.system !== undefined) {
    const system = readEnum<UnitSystem>(ctx, block.system, childPath(path, "system"), ["SI", "US"]);
    if (system) {
      defaults.system = system;
      defaults.byKind = { ...SYSTEM_DEFAULT_UNITS[system] };
    }
  }
  for (const kind of QUANTITY_KINDS) {
    const text = block[kind];
    if (text === undefined) continue;
    const kindPath = childPath(path, kind);
    if (typeof text !== "string") {
      ctx.issues.add(kindPath, "must be a unit string");
      continue;
    }
    const found = findUnit(kind, text);
    if (found.ok) defaults.byKind[kind as QuantityKind] = text;
    else {
      ctx.issues.add(kindPath, found.message);
      // A wrong declared default must not let bare numbers fall back to the system's unit.
      delete defaults.byKind[kind];
    }
  }
  return defaults;
}
