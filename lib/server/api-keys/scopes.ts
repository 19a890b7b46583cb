import { apiKeyScopes, type ApiKeyScope, type Role } from "@/db/schema";
import { hasPermission, type Permission } from "@/lib/server/auth/permissions";

export { apiKeyScopes, type ApiKeyScope };

/** Scopes an ordinary integration key lacks: they change who can reach the organization. */
export const adminScopes: readonly ApiKeyScope[] = ["webhooks:manage", "keys:manage"];

export const scopeDescriptions: Record<ApiKeyScope, string> = {
  "schedules:write": "Submit member schedules (JSON or CSV).",
  "results:read": "List schedules and read their results.",
  "webhooks:manage": "Register, change and remove webhook endpoints (administrative).",
  "keys:manage": "List, create and revoke this organization's API keys (administrative).",
  "criteria:manage": "Create, change and remove the organization's limit profiles, materials and section catalogues (engineers and administrators).",
  "review:write": "Record dispositions on members in review (engineers and administrators only).",
};

export function isApiKeyScope(value: string): value is ApiKeyScope {
  return (apiKeyScopes as readonly string[]).includes(value);
}

export function hasScope(granted: readonly string[], needed: ApiKeyScope): boolean {
  return granted.includes(needed);
}

/** The scopes of `wanted` that `granted` does not hold, in table order (a key cannot grant more than it has). */
export function listMissingScopes(granted: readonly string[], wanted: readonly ApiKeyScope[]): ApiKeyScope[] {
  return apiKeyScopes.filter((s) => wanted.includes(s) && !granted.includes(s));
}

/**
 * The dashboard permission a person needs to grant each scope: a key never does more than its
 * maker's role may. An integrator (integrations only) cannot mint a key that submits schedules.
 */
export const scopePermissions: Record<ApiKeyScope, Permission> = {
  "schedules:write": "schedules:submit",
  "results:read": "organization:read",
  "webhooks:manage": "integrations:manage",
  "keys:manage": "integrations:manage",
  "criteria:manage": "criteria:manage",
  // A key's dispositions are engineering decisions on record: only a role that may make them grants it.
  "review:write": "review:disposition",
};

/** The scopes a person of this role may put on a key, in table order. */
export function listGrantableScopes(role: Role): ApiKeyScope[] {
  return apiKeyScopes.filter((s) => hasPermission(role, scopePermissions[s]));
}
