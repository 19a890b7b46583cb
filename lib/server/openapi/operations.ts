import { apiRouteScopes, type ApiRouteKey } from "@/lib/server/auth/api-access-table";

/** An OpenAPI operation as this project writes them (a plain object; the document is JSON). */
export type Operation = Record<string, unknown>;

const problemContent = { "application/problem+json": { schema: { $ref: "#/components/schemas/Problem" } } };

export function problemResponse(description: string): Record<string, unknown> {
  return { description, content: problemContent };
}

export function jsonResponse(description: string, schemaRef: string, headers?: Record<string, unknown>): Record<string, unknown> {
  return { description, content: { "application/json": { schema: { $ref: `#/components/schemas/${schemaRef}` } } }, ...(headers ? { headers } : {}) };
}

export const linkHeader = { Link: { description: 'RFC 8288 `<url>; rel="next"` while more pages follow.', schema: { type: "string" } } };

export const pathParameter = (name: string, description: string, pattern?: string) => ({
  name,
  in: "path",
  required: true,
  description,
  schema: { type: "string", ...(pattern ? { pattern } : {}) },
});

export const queryParameter = (name: string, description: string, schema: Record<string, unknown>) => ({ name, in: "query", required: false, description, schema });

export const pageParameters = (maxLimit: number, defaultLimit: number) => [
  queryParameter("limit", `Page size, 1 to ${maxLimit}.`, { type: "integer", minimum: 1, maximum: maxLimit, default: defaultLimit }),
  queryParameter("cursor", 'Opaque position from the previous page (take the Link rel="next" address).', { type: "string" }),
];

/** `GET /api/v1/a/[b]` -> the OpenAPI path `/api/v1/a/{b}` and the lower-case method. */
export function splitRouteKey(key: ApiRouteKey): { method: string; path: string } {
  const [method = "", path = ""] = key.split(" ");
  return { method: method.toLowerCase(), path: path.replace(/\[([^\]]+)\]/g, "{$1}") };
}

/**
 * Adds what every operation shares: its scope from the one access table (so the docs cannot name
 * another scope than the route checks), the security requirement, and the auth and limit problems.
 */
export function describeOperation(key: ApiRouteKey, operation: Operation): Operation {
  const scope = apiRouteScopes[key];
  const responses = (operation.responses ?? {}) as Record<string, unknown>;
  if (scope === "public") return { ...operation, security: [], "x-sagline-scope": "public", responses };
  if (scope === "signed-link") {
    return {
      ...operation,
      security: [],
      "x-sagline-scope": "signed-link",
      responses: {
        ...responses,
        "403": problemResponse("The link was altered or is not a result-download link (download-link-invalid)."),
        "410": problemResponse("The link is past its expiry (download-link-expired)."),
        "500": problemResponse("Internal error; the body carries a requestId."),
      },
    };
  }
  return {
    ...operation,
    description: `${operation.description ? `${String(operation.description)}\n\n` : ""}Scope: \`${scope}\`.`,
    security: [{ apiKey: [scope] }],
    "x-sagline-scope": scope,
    responses: {
      ...responses,
      "400": responses["400"] ?? problemResponse("Malformed request, or an API key in the URL (api-key-in-url)."),
      "401": problemResponse("No key (api-key-required), or a malformed, unknown, revoked or expired key (invalid-api-key)."),
      "403": problemResponse(`The key lacks the \`${scope}\` scope (insufficient-scope).`),
      "429": { ...problemResponse("Over the per-key or per-organization rate limit."), headers: { "Retry-After": { description: "Seconds until the window resets.", schema: { type: "integer" } } } },
      "500": problemResponse("Internal error; the body carries a requestId."),
    },
  };
}
