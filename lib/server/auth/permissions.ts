import type { Role } from "@/db/schema";

/** Every permission Sagline checks. Pages, server actions and route handlers all use this one table. */
export const permissions = [
  "organization:read",
  "schedules:submit",
  "review:read",
  "review:disposition",
  "criteria:manage",
  "integrations:manage",
  // Make and revoke API keys of one's own, with only the scopes one's role may grant (scopes.ts).
  "keys:issue",
  "settings:read",
  "people:manage",
] as const;

export type Permission = (typeof permissions)[number];

export const rolePermissions: Record<Role, readonly Permission[]> = {
  admin: permissions,
  engineer: [
    "organization:read",
    "schedules:submit",
    "review:read",
    "review:disposition",
    "criteria:manage",
    // Engineers put criteria:manage and review:write on keys for their firm's own tools.
    "keys:issue",
    "settings:read",
  ],
  integrator: ["organization:read", "integrations:manage", "keys:issue"],
  submitter: ["organization:read", "schedules:submit"],
  viewer: ["organization:read", "review:read"],
};

export function hasPermission(role: Role, permission: Permission): boolean {
  return rolePermissions[role].includes(permission);
}

export const roleLabels: Record<Role, string> = {
  admin: "Administrator",
  engineer: "Engineer",
  integrator: "Integrator",
  submitter: "Submitter",
  viewer: "Viewer",
};

export const roleDescriptions: Record<Role, string> = {
  admin: "People, roles and every setting",
  engineer: "Check criteria, review and dispositions, and API keys of their own for them",
  integrator: "API keys and webhook endpoints",
  submitter: "Submits schedules, reads results",
  viewer: "Reads results only",
};
