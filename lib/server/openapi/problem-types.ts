import { domainErrorCodes, type DomainErrorCode } from "@/lib/server/errors";
import { problemTypeUri } from "@/lib/server/http/problem";

export interface ProblemType {
  code: DomainErrorCode | "internal";
  type: string;
  title: string;
  status: number;
  description: string;
}

// When it happens, for the docs; a code missing here still gets listed with its title.
const descriptions: Partial<Record<DomainErrorCode | "internal", string>> = {
  unauthenticated: "The console route needs a signed-in session.",
  forbidden: "Authenticated, but this role or caller may not do this.",
  not_found: "No such resource in your organization. Another organization's ids answer exactly like missing ones.",
  conflict: "The request conflicts with the current state, e.g. the same Idempotency-Key while the first request is still in flight.",
  invalid_input: "The body or file did not validate; errors[] lists each problem with a JSON pointer (or CSV row, line and column).",
  too_large: "The body is over the route's size limit.",
  rate_limited: "Over the per-key or per-organization request rate; wait the Retry-After seconds.",
  bad_origin: "A cookie-authenticated write from another site (console only).",
  unavailable: "A dependency is down; retry later.",
  bad_request: "Malformed request: the body is not JSON or UTF-8, or a query parameter (named in detail) is wrong.",
  unsupported_media_type: "The Content-Type is not one the route accepts.",
  api_key_in_url: "An API key appeared in the query string. Send it in the Authorization header, and revoke the exposed key.",
  api_key_required: 'No "Authorization: Bearer <key>" header.',
  invalid_api_key: "The key is malformed (checksum), unknown, revoked or expired; detail says which.",
  insufficient_scope: "The key is valid but lacks the scope this route needs.",
  schedule_format_retired: 'The schedule names a format Sagline no longer reads (e.g. "sagline.schedule/v1"); detail says what changed and which format to send.',
  download_link_invalid: "The result-download link was altered, is not a download link, or names another format; ask for a fresh one (the schedule.completed webhook carries it).",
  download_link_expired: "The result-download link is past its expiry; read the results with an API key, or resend the webhook for a fresh link.",
  internal: "Our fault. The body carries a requestId to quote; no internals are ever included.",
};

/** Every problem type the API can answer with, derived from the one code table (plus `internal`). */
export function listProblemTypes(): ProblemType[] {
  const known = (Object.keys(domainErrorCodes) as DomainErrorCode[]).map((code) => {
    const { status, title } = domainErrorCodes[code];
    return { code, type: problemTypeUri(code), title, status, description: descriptions[code] ?? title };
  });
  const internal: ProblemType = { code: "internal", type: problemTypeUri("internal"), title: "Internal error", status: 500, description: descriptions.internal ?? "" };
  return [...known, internal].sort((a, b) => a.status - b.status || a.type.localeCompare(b.type));
}

/**
 * The JSON Schema of a problem body, whose `oneOf` pins each type to its status and title. The file
 * api-schemas/v1/problem.schema.json must equal this (a unit test compares them); regenerate it with
 * `npx tsx lib/server/openapi/print-problem-schema.ts > api-schemas/v1/problem.schema.json`.
 */
export function buildProblemSchema() {
  return {
    $schema: "https://json-schema.org/draft/2020-12/schema",
    $id: "https://sagline.example/api-schemas/v1/problem.schema.json",
    title: "Sagline problem details (RFC 9457 application/problem+json)",
    description:
      "Every error from /api/v1 has this shape. `type` is stable: branch on it, not on `detail`. `errors` lists each invalid field as a JSON pointer (or, for CSV, row/line/column) with a message.",
    type: "object",
    required: ["type", "title", "status", "detail"],
    properties: {
      type: { type: "string", format: "uri", description: "Stable identifier of the kind of problem." },
      title: { type: "string", description: "Short summary of the type; the same for every occurrence." },
      status: { type: "integer", minimum: 400, maximum: 599, description: "The HTTP status code." },
      detail: { type: "string", description: "What went wrong this time, for people." },
      instance: { type: "string", description: "The request path." },
      requestId: { type: "string", description: "Present on internal errors; quote it to support." },
      errorCount: { type: "integer", minimum: 0, description: "The total number of errors when `errors` is cut at its cap." },
      errors: {
        type: "array",
        items: {
          type: "object",
          required: ["message"],
          properties: {
            pointer: { type: "string", description: "RFC 6901 JSON pointer into the request body." },
            message: { type: "string" },
            row: { type: "integer", description: "CSV: spreadsheet row (header = 1)." },
            line: { type: "integer", description: "CSV: physical line in the file." },
            column: { type: "string", description: "CSV: column header." },
            code: { type: "string", description: "Machine-readable reason." },
          },
        },
      },
    },
    oneOf: listProblemTypes().map((p) => ({
      description: p.description,
      properties: { type: { const: p.type }, title: { const: p.title }, status: { const: p.status } },
    })),
  };
}
