import type { OpenApiDocument } from "@/lib/server/openapi/build-openapi";

import type { Endpoint } from "./_components/endpoint-list";

type OperationShape = {
  tags?: string[];
  summary?: string;
  description?: string;
  "x-sagline-scope"?: string;
  parameters?: { name: string; in: string; description?: string; required?: boolean }[];
  requestBody?: { content?: Record<string, unknown> };
  responses?: Record<string, unknown>;
};

/** The document's operations grouped by tag, in the document's tag order, for the docs page. */
export function readEndpointsByTag(document: OpenApiDocument): [string, Endpoint[]][] {
  const groups = new Map<string, Endpoint[]>(document.tags.map((t) => [t.name, []]));
  for (const [path, methods] of Object.entries(document.paths)) {
    for (const [method, raw] of Object.entries(methods)) {
      const operation = raw as OperationShape;
      const tag = operation.tags?.[0] ?? "Other";
      const scope = operation["x-sagline-scope"] ?? "public";
      const endpoint: Endpoint = {
        method: method.toUpperCase(),
        path,
        summary: operation.summary ?? "",
        // The scope line is shown beside the path; the rest of the description stays.
        description: (operation.description ?? "").replace(/\n\nScope: `[^`]+`\.$/, "").replace(/^Scope: `[^`]+`\.$/, ""),
        scope,
        parameters: (operation.parameters ?? []).map((p) => ({ name: p.name, in: p.in, description: p.description ?? "", required: p.required ?? false })),
        requestTypes: Object.keys(operation.requestBody?.content ?? {}),
        statuses: Object.keys(operation.responses ?? {}).sort(),
      };
      if (!groups.has(tag)) groups.set(tag, []);
      groups.get(tag)!.push(endpoint);
    }
  }
  return [...groups.entries()].filter(([, list]) => list.length > 0);
}
