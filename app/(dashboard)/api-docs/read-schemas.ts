/**
 * Reads schemas out of the OpenAPI document for the reference page: the fields of a schema as a
 * flat list, an example value built from it, and a runnable curl line. Generic over the document,
 * so an endpoint another part of the product adds is rendered without changes here. Bounded:
 * depth and field counts are capped, and $ref cycles stop at the depth cap.
 */
type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type Schema = { [key: string]: Json };

const MAX_DEPTH = 4;
const MAX_FIELDS = 60;

export type SchemaField = { path: string; type: string; required: boolean; description: string };

function isSchema(value: unknown): value is Schema {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

/** Follows a `#/...` JSON pointer from the document root (RFC 6901 escapes). */
function resolvePointer(document: unknown, ref: string): unknown {
  if (!ref.startsWith("#/")) return undefined;
  let node: unknown = document;
  for (const raw of ref.slice(2).split("/")) {
    const key = raw.replaceAll("~1", "/").replaceAll("~0", "~");
    if (!isSchema(node)) return undefined;
    node = node[key];
  }
  return node;
}

/** The schema itself, or what its $ref points at (a few hops at most). */
export function resolveSchema(document: unknown, schema: unknown): Schema | null {
  let node = schema;
  for (let hop = 0; hop < 8 && isSchema(node) && typeof node.$ref === "string"; hop++) node = resolvePointer(document, node.$ref);
  return isSchema(node) ? node : null;
}

function alternativesOf(schema: Schema): Json[] | null {
  const list = schema.oneOf ?? schema.anyOf;
  return Array.isArray(list) ? list : null;
}

/** "string", "integer | null", "one of 3", "array of object", "\"completed\"". */
function describeType(document: unknown, schema: Schema): string {
  if (schema.const !== undefined) return JSON.stringify(schema.const);
  if (Array.isArray(schema.enum)) return schema.enum.map((v) => JSON.stringify(v)).join(" | ");
  const alternatives = alternativesOf(schema);
  if (alternatives) return alternatives.map((a) => describeType(document, resolveSchema(document, a) ?? {})).join(" | ");
  if (Array.isArray(schema.type)) return schema.type.join(" | ");
  if (schema.type === "array") return `array of ${describeType(document, resolveSchema(document, schema.items) ?? {})}`;
  return typeof schema.type === "string" ? schema.type : isSchema(schema.properties) ? "object" : "any";
}

/** The schema's fields, depth first: `counts.pass`, `rows[].status`. */
export function listSchemaFields(document: unknown, root: unknown): SchemaField[] {
  const fields: SchemaField[] = [];
  function walk(schema: Schema | null, prefix: string, depth: number) {
    if (!schema || depth > MAX_DEPTH) return;
    const target = schema.type === "array" ? resolveSchema(document, schema.items) : schema;
    const alternatives = target ? alternativesOf(target) : null;
    const objectSchema = alternatives ? resolveSchema(document, alternatives[0]) : target;
    if (!objectSchema || !isSchema(objectSchema.properties)) return;
    const required = new Set(Array.isArray(objectSchema.required) ? objectSchema.required.map(String) : []);
    for (const [name, raw] of Object.entries(objectSchema.properties)) {
      if (fields.length >= MAX_FIELDS) return;
      const property = resolveSchema(document, raw);
      if (!property) continue;
      const path = `${prefix}${name}`;
      fields.push({ path, type: describeType(document, property), required: required.has(name), description: typeof property.description === "string" ? property.description : "" });
      walk(property, property.type === "array" ? `${path}[].` : `${path}.`, depth + 1);
    }
  }
  walk(resolveSchema(document, root), "", 0);
  return fields;
}

function exampleString(schema: Schema): string {
  if (schema.format === "date-time") return "2026-12-01T10:00:00Z";
  if (schema.format === "uri") return "https://partner.example/hooks/sagline";
  const pattern = typeof schema.pattern === "string" ? /^\^([a-z]{2,4}_)/.exec(schema.pattern) : null;
  if (pattern) return `${pattern[1]}...`;
  return "text";
}

/** An example value: the schema's own example, const, default or first enum value, else one built from its type. */
export function buildExample(document: unknown, root: unknown, depth = 0): Json {
  const schema = resolveSchema(document, root);
  if (!schema || depth > MAX_DEPTH) return null;
  if (schema.example !== undefined) return schema.example;
  if (Array.isArray(schema.examples) && schema.examples.length > 0) return schema.examples[0] ?? null;
  if (schema.const !== undefined) return schema.const;
  if (schema.default !== undefined) return schema.default;
  if (Array.isArray(schema.enum)) return schema.enum[0] ?? null;
  const alternatives = alternativesOf(schema);
  if (alternatives) return buildExample(document, alternatives[0], depth + 1);
  const type = Array.isArray(schema.type) ? schema.type.find((t) => t !== "null") : schema.type;
  if (type === "array") return [buildExample(document, schema.items, depth + 1)];
  if (type === "string") return exampleString(schema);
  if (type === "integer" || type === "number") return typeof schema.minimum === "number" ? schema.minimum : 1;
  if (type === "boolean") return true;
  if (type === "null") return null;
  if (isSchema(schema.properties)) {
    const out: { [key: string]: Json } = {};
    const required = Array.isArray(schema.required) ? schema.required.map(String) : Object.keys(schema.properties);
    for (const name of required) if (schema.properties[name] !== undefined) out[name] = buildExample(document, schema.properties[name], depth + 1);
    return out;
  }
  return {};
}

const PATH_EXAMPLES: Record<string, string> = { scheduleId: "sch_...", endpointId: "wh_...", keyId: "key_...", mark: "B1", token: "TOKEN_FROM_THE_WEBHOOK" };

/**
 * A curl line that runs against this server as written, once the placeholders ($KEY, ids) are
 * filled: the method, the address, the key header unless the route needs none, and the example
 * body for JSON requests.
 */
export function buildCurl(input: { method: string; path: string; serverUrl: string; needsKey: boolean; jsonBody: Json | undefined; otherBodyType: string | null }): string {
  const path = input.path.replace(/\{([^}]+)\}/g, (_, name: string) => PATH_EXAMPLES[name] ?? `${name.toUpperCase()}`);
  const parts = [`curl -sS${input.method === "GET" ? "" : ` -X ${input.method}`} "${input.serverUrl.replace(/\/$/, "")}${path}"`];
  if (input.needsKey) parts.push('-H "authorization: Bearer $KEY"');
  if (input.jsonBody !== undefined) {
    parts.push('-H "content-type: application/json"');
    // Shell single quotes: a ' inside the JSON is closed, escaped and reopened.
    parts.push(`--data '${JSON.stringify(input.jsonBody).replaceAll("'", "'\\''")}'`);
  } else if (input.otherBodyType) {
    parts.push(`-H "content-type: ${input.otherBodyType}" --data-binary @FILE`);
  }
  return parts.join(" \\\n  ");
}
