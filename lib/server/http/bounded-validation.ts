import type { ErrorObject, ValidateFunction } from "ajv";

/**
 * ajv's allErrors mode copies the error list it has so far each time a `$ref`'d subschema fails,
 * so listing every error of a value with many failing parts costs the square of their number.
 * These helpers keep the listing pass small: the first-error validator (linear, stops early)
 * decides validity, and the listing validator only ever sees one small value at a time.
 */

/** Values with more nodes than this get the first-error validator's single error, not a full list. */
export const MAX_LISTED_NODES = 5_000;

/** Counts the objects, arrays and scalars in a JSON value, stopping once past `limit`. */
export function countJsonNodes(value: unknown, limit: number): number {
  let count = 0;
  const stack: unknown[] = [value];
  while (stack.length > 0 && count <= limit) {
    const next = stack.pop();
    count += 1;
    const children = Array.isArray(next) ? next : typeof next === "object" && next !== null ? Object.values(next) : [];
    for (const child of children) {
      if (count + stack.length > limit) break;
      stack.push(child);
    }
  }
  return count;
}

export interface ValidatorPair {
  /** Compiled without allErrors: cheap, stops at the first error. */
  firstError: ValidateFunction;
  /** The same schema compiled with allErrors. */
  allErrors: ValidateFunction;
}

/**
 * The errors of one value, or null when it is valid. The full list only for a value small enough
 * that listing is cheap (at most MAX_LISTED_NODES nodes); a larger one reports its first error.
 */
export function listErrorsBounded(pair: ValidatorPair, value: unknown): ErrorObject[] | null {
  if (pair.firstError(value)) return null;
  const first = [...(pair.firstError.errors ?? [])];
  if (countJsonNodes(value, MAX_LISTED_NODES) > MAX_LISTED_NODES) return first;
  pair.allErrors(value);
  return pair.allErrors.errors?.length ? [...pair.allErrors.errors] : first;
}
