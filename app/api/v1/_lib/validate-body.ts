import Ajv2020, { type ErrorObject, type ValidateFunction } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";

import { DomainError, type FieldError } from "@/lib/server/errors";
import { listErrorsBounded } from "@/lib/server/http/bounded-validation";

/** Default cap for small JSON bodies (keys, webhook endpoints); schedules pass their own. */
export const JSON_BODY_MAX_BYTES = 64 * 1024;
/** At most this many {pointer, message} entries in one 422; `errorCount` gives the full number. */
export const MAX_FIELD_ERRORS = 100;

const ajv = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true });
addFormats(ajv);
// The same schemas stopping at the first error: validity is decided by these (see bounded-validation.ts).
const ajvFirstError = new Ajv2020({ allErrors: false, strict: true, allowUnionTypes: true });
addFormats(ajvFirstError);
const firstErrorValidators = new WeakMap<ValidateFunction, ValidateFunction>();

/** Compiles a JSON Schema (2020-12) once per $id in the shared instances. */
export function compileSchema<T>(schema: { $id?: string } & Record<string, unknown>): ValidateFunction<T> {
  const existing = schema.$id ? ajv.getSchema<T>(schema.$id) : undefined;
  if (existing) return existing;
  const validate = ajv.compile<T>(schema);
  firstErrorValidators.set(validate, ajvFirstError.compile(schema));
  return validate;
}

function joinPointer(base: string, property: unknown): string {
  const escaped = String(property).replaceAll("~", "~0").replaceAll("/", "~1");
  return `${base}/${escaped}`;
}

function describeError(error: ErrorObject): FieldError {
  const params = error.params as Record<string, unknown>;
  switch (error.keyword) {
    case "required":
      return { pointer: joinPointer(error.instancePath, params.missingProperty), message: "is required." };
    case "additionalProperties":
      return { pointer: joinPointer(error.instancePath, params.additionalProperty), message: "is not a known field." };
    case "enum":
      return { pointer: error.instancePath, message: `must be one of: ${(params.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(", ")}.` };
    case "const":
      return { pointer: error.instancePath, message: `must be ${JSON.stringify(params.allowedValue)}.` };
    case "type":
      return { pointer: error.instancePath, message: `must be ${String(params.type).replace(",", " or ")}.` };
    case "uniqueItems":
      return { pointer: error.instancePath, message: `must not repeat an item (items ${String(params.j)} and ${String(params.i)} are the same).` };
    default:
      return { pointer: error.instancePath, message: `${error.message ?? "is invalid"}.` };
  }
}

/** ajv's errors as the API's {pointer, message} list (RFC 6901 pointers), duplicates removed. */
export function toFieldErrors(errors: readonly ErrorObject[] | null | undefined): FieldError[] {
  const seen = new Set<string>();
  const out: FieldError[] = [];
  for (const error of errors ?? []) {
    // An anyOf/oneOf failure repeats its branches' errors; the branch messages say more.
    if (error.keyword === "anyOf" || error.keyword === "oneOf" || error.keyword === "if") continue;
    const field = describeError(error);
    const id = `${field.pointer} ${field.message}`;
    if (seen.has(id)) continue;
    seen.add(id);
    out.push(field);
  }
  return out;
}

/** Throws 415 unless the media type (parameters aside) is one of `allowed`. */
export function assertContentType(request: Request, allowed: readonly string[]): string {
  const mediaType = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (!allowed.includes(mediaType)) {
    throw new DomainError("unsupported_media_type", `Send the body as ${allowed.join(" or ")}${mediaType ? ` (this request said ${mediaType.slice(0, 80)})` : " with a Content-Type header"}.`);
  }
  return mediaType;
}

function tooLarge(maxBytes: number): DomainError {
  return new DomainError("too_large", `The request body is over the limit of ${maxBytes} bytes.`);
}

/** The body as UTF-8 text, refusing (413) anything over maxBytes, declared or actual, without buffering past the cap. */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  const declared = Number(request.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  const decoder = new TextDecoder("utf-8", { fatal: true });
  try {
    return decoder.decode(Buffer.concat(chunks));
  } catch {
    throw new DomainError("bad_request", "The request body is not valid UTF-8.");
  }
}

/** Parses JSON text; a syntax error is a 400 that says where, never a stack trace. */
export function parseJsonText(text: string): unknown {
  if (!text.trim()) throw new DomainError("bad_request", "The request body is empty; send a JSON document.");
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    const where = error instanceof SyntaxError ? ` (${error.message.slice(0, 120)})` : "";
    throw new DomainError("bad_request", `The request body is not valid JSON${where}.`);
  }
}

/** Throws 422 with every {pointer, message} (capped at MAX_FIELD_ERRORS) unless value matches the schema. */
export function assertValid<T>(validate: ValidateFunction<T>, value: unknown): T {
  const firstError = firstErrorValidators.get(validate) ?? validate;
  const found = listErrorsBounded({ firstError, allErrors: validate }, value);
  if (found === null) return value as T;
  const errors = toFieldErrors(found);
  const extensions = errors.length > MAX_FIELD_ERRORS ? { errorCount: errors.length } : {};
  throw new DomainError("invalid_input", "The request body does not match the schema; see errors.", errors.slice(0, MAX_FIELD_ERRORS), undefined, extensions);
}

/**
 * The JSON body of a request checked against a compiled schema: 415 wrong content type, 413 over
 * maxBytes, 400 bad JSON, 422 schema errors.
 */
export async function readJsonBody<T>(request: Request, validate: ValidateFunction<T>, options: { maxBytes?: number } = {}): Promise<T> {
  assertContentType(request, ["application/json"]);
  const text = await readBodyText(request, options.maxBytes ?? JSON_BODY_MAX_BYTES);
  return assertValid(validate, parseJsonText(text));
}
