import { MAX_MEMBERS } from "@/lib/engine/intake";
import { SAFETY_CAUTION } from "@/lib/safety";
import { API_KEY_SCAN_PATTERN } from "@/lib/server/api-keys/key-format";
import { apiKeyScopes, scopeDescriptions } from "@/lib/server/api-keys/scopes";
import type { ApiRouteKey } from "@/lib/server/auth/api-access-table";
import { IDEMPOTENCY_TTL_HOURS } from "@/lib/server/http/idempotency";
import { MAX_SCHEDULE_BODY_BYTES } from "@/lib/server/schedules/submit-from-request";

import { buildComponentSchemas, webhookEvents } from "./components";
import { describeOperation, jsonResponse, splitRouteKey, type Operation } from "./operations";
import { apiKeyOperations } from "./paths-api-keys";
import { criteriaOperations } from "./paths-criteria";
import { reviewOperations } from "./paths-review";
import { buildScheduleOperations } from "./paths-schedules";
import { webhookOperations } from "./paths-webhooks";
import { listProblemTypes } from "./problem-types";

/** The limits the document states; the same constants the routes enforce. */
export function getApiLimits(rateLimits: { perKeyPerMinute: number; perOrganizationPerMinute: number }) {
  return {
    maxMembers: MAX_MEMBERS,
    maxBodyBytes: MAX_SCHEDULE_BODY_BYTES,
    idempotencyHours: IDEMPOTENCY_TTL_HOURS,
    ...rateLimits,
  };
}

export type ApiLimits = ReturnType<typeof getApiLimits>;

const openApiOperation: Operation = {
  operationId: "getOpenApiDocument",
  tags: ["Reference"],
  summary: "This document",
  responses: { "200": { description: "OpenAPI 3.1 document.", content: { "application/json": { schema: { type: "object" } } } } },
};

/** Every route of apiRouteScopes with its operation; a route without one fails the build (tsc). */
function buildOperations(limits: ApiLimits): Record<ApiRouteKey, Operation> {
  return {
    "GET /api/v1/openapi.json": openApiOperation,
    ...apiKeyOperations,
    ...buildScheduleOperations(limits),
    ...reviewOperations,
    ...webhookOperations,
    ...criteriaOperations,
  };
}

function describeApi(limits: ApiLimits): string {
  const scopes = apiKeyScopes.map((s) => `- \`${s}\`: ${scopeDescriptions[s]}`).join("\n");
  const bodyMb = Math.round(limits.maxBodyBytes / (1024 * 1024));
  return [
    `**Caution.** ${SAFETY_CAUTION}`,
    "",
    "Submit whole member schedules, read each member's serviceability result, and receive signed webhooks when a schedule completes.",
    "",
    "## Authentication",
    `Send \`Authorization: Bearer <key>\`. Keys look like \`${API_KEY_SCAN_PATTERN}\` (a fixed prefix and a checksum, so secret scanners can find leaked ones). Keys in the URL are refused (400) and cookies are ignored. Integrators and administrators create and revoke keys in the console (Integrations, API keys); engineers make and revoke keys of their own there, with the scopes their role may grant; a revocation applies to the next request.`,
    "",
    "Scopes:",
    scopes,
    "",
    "## Limits",
    `- At most ${limits.maxMembers.toLocaleString("en-US")} members per schedule and ${bodyMb} MB per request body.`,
    `- Idempotency keys expire after ${limits.idempotencyHours} hours.`,
    `- Rate limits: ${limits.perKeyPerMinute} requests a minute per API key and ${limits.perOrganizationPerMinute} a minute per organization (fixed one-minute windows); over the limit answers 429 with Retry-After. If the rate-limit store is unavailable, requests are let through rather than refused.`,
    "",
    "## Errors",
    "Every error is RFC 9457 `application/problem+json` (components.schemas.Problem). Branch on `type`:",
    ...listProblemTypes().map((p) => `- \`${p.type}\` (${p.status} ${p.title}): ${p.description}`),
  ].join("\n");
}

// What Sagline POSTs to registered endpoints, signed per Standard Webhooks v1.
function buildWebhooks(): Record<string, Record<string, Operation>> {
  return Object.fromEntries(
    webhookEvents.map(([type, component]) => [
      type,
      {
        post: {
          operationId: `event_${type.replaceAll(".", "_")}`,
          tags: ["Webhooks"],
          summary: `${type} event`,
          description: "Headers webhook-id (the same on every retry), webhook-timestamp (Unix seconds) and webhook-signature (`v1,<base64 HMAC-SHA256 of id.timestamp.body>`). Answer 2xx within the timeout; anything else is retried.",
          requestBody: { required: true, content: { "application/json": { schema: { $ref: `#/components/schemas/${component}` } } } },
          responses: { "200": { description: "Received." } },
        },
      },
    ]),
  );
}

/** The OpenAPI 3.1 document of /api/v1, built from api-schemas/v1 and the route table. */
export function buildOpenApiDocument(options: { serverUrl: string; limits: ApiLimits }) {
  const paths: Record<string, Record<string, Operation>> = {};
  for (const [key, operation] of Object.entries(buildOperations(options.limits)) as [ApiRouteKey, Operation][]) {
    const { method, path } = splitRouteKey(key);
    (paths[path] ??= {})[method] = describeOperation(key, operation);
  }
  return {
    openapi: "3.1.1",
    jsonSchemaDialect: "https://json-schema.org/draft/2020-12/schema",
    info: { title: "Sagline API", version: "1.0.0", description: describeApi(options.limits) },
    servers: [{ url: options.serverUrl }],
    security: [{ apiKey: [] }],
    tags: [
      { name: "Schedules", description: "Submit schedules and read results." },
      { name: "Review", description: "The review queue of members that did not pass, and the engineers' dispositions." },
      { name: "Webhooks", description: "Where results are sent (Standard Webhooks v1)." },
      { name: "API keys", description: "Keys of this organization." },
      { name: "Criteria", description: "The organization's limit profiles, materials and section catalogues." },
      { name: "Reference", description: "This document." },
    ],
    paths,
    webhooks: buildWebhooks(),
    components: {
      schemas: buildComponentSchemas(),
      securitySchemes: { apiKey: { type: "http", scheme: "bearer", description: "An API key: `Authorization: Bearer sgl_...`." } },
      responses: { Problem: jsonResponse("A problem.", "Problem") },
    },
  };
}

export type OpenApiDocument = ReturnType<typeof buildOpenApiDocument>;

let builtDocument: { key: string; document: OpenApiDocument } | undefined;

/**
 * buildOpenApiDocument, built once per process: its inputs (APP_URL and the rate-limit settings)
 * are read once per process, so every request would otherwise build the same document. A call
 * with other options builds afresh. Callers must not change the returned document.
 */
export function getOpenApiDocument(options: { serverUrl: string; limits: ApiLimits }): OpenApiDocument {
  const key = JSON.stringify(options);
  if (builtDocument?.key !== key) builtDocument = { key, document: buildOpenApiDocument(options) };
  return builtDocument.document;
}
