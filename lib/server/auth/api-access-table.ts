import type { ApiKeyScope } from "@/db/schema";

/**
 * Every public API route (app/api/v1) and the API-key scope it needs; "public" needs no key.
 * tests/integration/api/v1/api-access-matrix.test.ts fails when a route file exports a method that
 * is missing here, fails when an entry here has no route file exporting that method, and checks
 * every listed route's 401/403 answers against this table.
 */
/** "signed-link": no API key; the path carries a signed, expiring token (result downloads). */
export type ApiAccess = ApiKeyScope | "public" | "signed-link";

export const apiRouteScopes = {
  "GET /api/v1/openapi.json": "public",

  "GET /api/v1/api-keys": "keys:manage",
  "POST /api/v1/api-keys": "keys:manage",
  "DELETE /api/v1/api-keys/[keyId]": "keys:manage",

  "POST /api/v1/schedules": "schedules:write",
  "GET /api/v1/schedules": "results:read",
  "GET /api/v1/schedules/[scheduleId]": "results:read",
  "GET /api/v1/schedules/[scheduleId]/results": "results:read",
  "GET /api/v1/schedules/[scheduleId]/members/[mark]": "results:read",
  "POST /api/v1/schedules/[scheduleId]/members/[mark]/dispositions": "review:write",
  "GET /api/v1/review": "results:read",
  "POST /api/v1/schedules/[scheduleId]/recheck": "schedules:write",

  "GET /api/v1/limit-profiles": "results:read",
  "POST /api/v1/limit-profiles": "criteria:manage",
  "GET /api/v1/limit-profiles/[profileId]": "results:read",
  "PUT /api/v1/limit-profiles/[profileId]": "criteria:manage",
  "DELETE /api/v1/limit-profiles/[profileId]": "criteria:manage",
  "GET /api/v1/materials": "results:read",
  "POST /api/v1/materials": "criteria:manage",
  "GET /api/v1/materials/[materialId]": "results:read",
  "PUT /api/v1/materials/[materialId]": "criteria:manage",
  "DELETE /api/v1/materials/[materialId]": "criteria:manage",
  "GET /api/v1/section-catalogues": "results:read",
  "POST /api/v1/section-catalogues": "criteria:manage",
  "GET /api/v1/section-catalogues/[catalogueId]": "results:read",
  "PATCH /api/v1/section-catalogues/[catalogueId]": "criteria:manage",
  "DELETE /api/v1/section-catalogues/[catalogueId]": "criteria:manage",
  "GET /api/v1/result-downloads/[token]": "signed-link",

  "GET /api/v1/webhook-endpoints": "webhooks:manage",
  "POST /api/v1/webhook-endpoints": "webhooks:manage",
  "GET /api/v1/webhook-endpoints/[endpointId]": "webhooks:manage",
  "PATCH /api/v1/webhook-endpoints/[endpointId]": "webhooks:manage",
  "DELETE /api/v1/webhook-endpoints/[endpointId]": "webhooks:manage",
  "POST /api/v1/webhook-endpoints/[endpointId]/rotate-secret": "webhooks:manage",
  "POST /api/v1/webhook-endpoints/[endpointId]/test": "webhooks:manage",
} as const satisfies Record<string, ApiAccess>;

export type ApiRouteKey = keyof typeof apiRouteScopes;
