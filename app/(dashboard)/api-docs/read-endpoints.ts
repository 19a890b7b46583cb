import type { OpenApiDocument } from "@/lib/server/openapi/build-openapi";

import type { Endpoint, EndpointResponse } from "./_components/endpoint-list";
import { buildCurl, buildExample, listSchemaFields } from "./read-schemas";

type MediaType = { schema?: unknown; example?: unknown };
type OperationShape = {
  tags?: string[];
  summary?: string;
  description?: string;
  "x-sagline-scope"?: string;
  parameters?: { name: string; in: string; description?: string; required?: boolean }[];
  requestBody?: { content?: Record<string, MediaType> };
  responses?: Record<string, { description?: string; content?: Record<string, MediaType> }>;
};

const KEYLESS_SCOPES = new Set(["public", "signed-link"]);

function pretty(value: unknown): string {
  return JSON.stringify(value, null, 2);
}

function readResponses(document: OpenApiDocument, operation: OperationShape): EndpointResponse[] {
  return Object.entries(operation.responses ?? {})
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([status, response]) => {
      const json = response.content?.["application/json"] ?? response.content?.["application/problem+json"];
      return {
        status,
        description: response.description ?? "",
        contentTypes: Object.keys(response.content ?? {}),
        fields: json?.schema ? listSchemaFields(document, json.schema) : [],
        // Examples for success answers only: every problem has the one shape listed below the endpoints.
        example: json?.schema && status.startsWith("2") ? pretty(json.example ?? buildExample(document, json.schema)) : null,
      };
    });
}

/** The document's operations grouped by tag, in the document's tag order, for the docs page. */
export function readEndpointsByTag(document: OpenApiDocument): [string, Endpoint[]][] {
  const serverUrl = document.servers[0]?.url ?? "";
  const groups = new Map<string, Endpoint[]>(document.tags.map((t) => [t.name, []]));
  for (const [path, methods] of Object.entries(document.paths)) {
    for (const [method, raw] of Object.entries(methods)) {
      const operation = raw as OperationShape;
      const tag = operation.tags?.[0] ?? "Other";
      const scope = operation["x-sagline-scope"] ?? "public";
      const content = operation.requestBody?.content ?? {};
      const jsonBody = content["application/json"];
      const requestExample = jsonBody ? (jsonBody.example ?? buildExample(document, jsonBody.schema)) : undefined;
      const endpoint: Endpoint = {
        method: method.toUpperCase(),
        path,
        summary: operation.summary ?? "",
        // The scope line is shown beside the path; the rest of the description stays.
        description: (operation.description ?? "").replace(/\n\nScope: `[^`]+`\.$/, "").replace(/^Scope: `[^`]+`\.$/, ""),
        scope,
        parameters: (operation.parameters ?? []).map((p) => ({ name: p.name, in: p.in, description: p.description ?? "", required: p.required ?? false })),
        requestTypes: Object.keys(content),
        requestFields: jsonBody?.schema ? listSchemaFields(document, jsonBody.schema) : [],
        requestExample: requestExample === undefined ? null : pretty(requestExample),
        responses: readResponses(document, operation),
        statuses: Object.keys(operation.responses ?? {}).sort(),
        curl: buildCurl({
          method: method.toUpperCase(),
          path,
          serverUrl,
          needsKey: !KEYLESS_SCOPES.has(scope),
          jsonBody: requestExample as never,
          otherBodyType: jsonBody ? null : (Object.keys(content)[0] ?? null),
        }),
      };
      if (!groups.has(tag)) groups.set(tag, []);
      groups.get(tag)!.push(endpoint);
    }
  }
  return [...groups.entries()].filter(([, list]) => list.length > 0);
}
