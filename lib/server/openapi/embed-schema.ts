type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/**
 * A standalone JSON Schema (2020-12) made fit for components.schemas: `$schema` and `$id` go, and
 * every `$ref` becomes a pointer from the document root, so the OpenAPI document resolves on its
 * own: `#/...` inside the schema points under its component, and another schema's `$id` points at
 * that schema's component.
 */
export function embedSchema(schema: Record<string, unknown>, componentName: string, componentOfId: ReadonlyMap<string, string>): Record<string, unknown> {
  const base = `#/components/schemas/${componentName}`;
  function rewriteRef(ref: string): string {
    if (ref === "#") return base;
    if (ref.startsWith("#/")) return base + ref.slice(1);
    const [id, fragment = ""] = ref.split("#");
    const target = componentOfId.get(id ?? "");
    if (!target) throw new Error(`${componentName}: $ref ${ref} names no known schema`);
    return `#/components/schemas/${target}${fragment}`;
  }
  function visit(node: Json): Json {
    if (Array.isArray(node)) return node.map(visit);
    if (node === null || typeof node !== "object") return node;
    const out: { [key: string]: Json } = {};
    for (const [key, value] of Object.entries(node)) {
      if (key === "$ref" && typeof value === "string") out[key] = rewriteRef(value);
      else out[key] = visit(value);
    }
    return out;
  }
  const { $schema: _schema, $id: _id, ...rest } = schema;
  return visit(rest as Json) as Record<string, unknown>;
}
