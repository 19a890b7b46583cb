import type { Permission } from "./permissions";

/**
 * Who may reach what: every page, cookie-session route and server action, in one table.
 * "public" needs nothing; "signed-in" needs a session and an organization; otherwise a permission
 * of the active membership's role. tests/integration/auth/access-matrix.test.ts fails when a page,
 * route or action exists without an entry here.
 */
export type Access = "public" | "signed-in" | Permission;

export const pageAccess = {
  "/": "public",
  "/sign-in": "public",
  "/forgot-password": "public",
  "/reset-password/[token]": "public",
  "/invitations/[token]": "public",
  "/schedules": "organization:read",
  "/verification": "signed-in",
  "/review": "review:read",
  "/integrations": "keys:issue",
  "/settings": "organization:read",
  "/settings/limit-profiles": "organization:read",
  "/settings/limit-profiles/[profileId]": "organization:read",
  "/settings/materials": "organization:read",
  "/settings/section-catalogues": "organization:read",
  "/settings/section-catalogues/[catalogueId]": "organization:read",
  "/people": "people:manage",
  "/integrations/keys": "keys:issue",
  "/api-docs": "public",
  "/schedules/new": "schedules:submit",
  "/schedules/[scheduleId]": "organization:read",
  "/schedules/[scheduleId]/members/[mark]": "organization:read",
  "/schedules/[scheduleId]/record": "organization:read",
  "/integrations/webhooks": "integrations:manage",
  "/integrations/webhooks/deliveries": "integrations:manage",
} as const satisfies Record<string, Access>;

/** Route handlers that use the cookie session or none (API-key routes live in their own table). */
export const routeAccess = {
  "GET /api/health": "public",
  "GET /api/auth/[...nextauth]": "public",
  "POST /api/auth/[...nextauth]": "public",
  "POST /api/schedules/upload": "schedules:submit",
  "GET /api/schedules/[scheduleId]/progress": "organization:read",
  "GET /api/schedules/[scheduleId]/results": "organization:read",
  "GET /api/review": "review:read",
  "GET /api/webhooks/deliveries": "integrations:manage",
  "GET /api/templates/schedule.csv": "public",
  "GET /schedules/[scheduleId]/results.csv": "organization:read",
} as const satisfies Record<string, Access>;

/** Server actions, keyed `area/actionName` as exported from app/.../<area>/actions.ts. */
export const actionAccess = {
  "(auth)/requestPasswordReset": "public",
  "(auth)/resetPassword": "public",
  "(auth)/acceptInvitation": "public",
  "(dashboard)/switchOrganization": "signed-in",
  "people/inviteMember": "people:manage",
  "people/changeMemberRole": "people:manage",
  "people/removeMember": "people:manage",
  "people/revokeInvitation": "people:manage",
  // Without integrations:manage a person sees and revokes only the keys they made.
  "keys/createApiKey": "keys:issue",
  "keys/revokeApiKey": "keys:issue",
  "webhooks/createEndpoint": "integrations:manage",
  "webhooks/updateEndpoint": "integrations:manage",
  "webhooks/setEndpointEnabled": "integrations:manage",
  "webhooks/deleteEndpoint": "integrations:manage",
  "webhooks/revealSecret": "integrations:manage",
  "webhooks/rotateSecret": "integrations:manage",
  "webhooks/sendTestEvent": "integrations:manage",
  "webhooks/resendDelivery": "integrations:manage",
  "webhooks/resendFailedSince": "integrations:manage",
  "review/recordDisposition": "review:disposition",
  "review/previewBulkDisposition": "review:disposition",
  "review/applyBulkDisposition": "review:disposition",
  "review/saveDigestPreference": "review:disposition",
  "limit-profiles/createLimitProfile": "criteria:manage",
  "limit-profiles/updateLimitProfile": "criteria:manage",
  "limit-profiles/deleteLimitProfile": "criteria:manage",
  "limit-profiles/recheckSchedule": "schedules:submit",
  "materials/createMaterial": "criteria:manage",
  "materials/updateMaterial": "criteria:manage",
  "materials/deleteMaterial": "criteria:manage",
  "section-catalogues/importCatalogue": "criteria:manage",
  "section-catalogues/setCatalogueInUse": "criteria:manage",
  "section-catalogues/deleteCatalogue": "criteria:manage",
  // A what-if reads the record and writes nothing: whoever may read results may try one.
  "members/recheckMember": "organization:read",
} as const satisfies Record<string, Access>;

export type PagePath = keyof typeof pageAccess;
export type ActionKey = keyof typeof actionAccess;
