// The public JSON Schemas in api-schemas/v1, compiled for tests. Each call gets its own Ajv
// (draft 2020-12, formats on, every error reported), so callers choose strictness independently.
import { readFileSync } from "node:fs";

import Ajv2020, { type ErrorObject, type ValidateFunction } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";

export interface ApiSchemaOptions {
  strict: boolean;
  allowUnionTypes?: boolean;
  /** Other schemas (same naming) the compiled one refers to by $id, e.g. "api-key". */
  references?: readonly string[];
}

/** api-schemas/v1/<name>.schema.json parsed; name may include a folder, e.g. "events/webhook.test". */
export function readApiSchema(name: string): object {
  return JSON.parse(readFileSync(`api-schemas/v1/${name}.schema.json`, "utf8")) as object;
}

export function compileApiSchema(name: string, { strict, allowUnionTypes, references = [] }: ApiSchemaOptions): ValidateFunction {
  const ajv = new Ajv2020({ allErrors: true, strict, ...(allowUnionTypes === undefined ? {} : { allowUnionTypes }) });
  addFormats(ajv);
  for (const reference of references) ajv.addSchema(readApiSchema(reference));
  return ajv.compile(readApiSchema(name));
}

const formatter = new Ajv2020();

/** Ajv's one-line summary of a validator's last errors, for assertion messages. */
export function describeSchemaErrors(errors: ErrorObject[] | null | undefined): string {
  return formatter.errorsText(errors);
}
