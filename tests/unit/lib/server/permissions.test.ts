import { describe, expect, it } from "vitest";

import { roles } from "@/db/schema";
import { decideAccess } from "@/lib/server/auth/guards";
import { hasPermission, permissions, rolePermissions } from "@/lib/server/auth/permissions";
import type { RequestContext } from "@/lib/server/auth/request-context";

function contextFor(role: (typeof roles)[number] | null): RequestContext {
  const active = role
    ? { membershipId: "mem_x", organizationId: "org_x", organizationName: "X", organizationKind: "engineering" as const, role }
    : null;
  return { user: { id: "usr_x", email: "x@example.com", name: "X" }, memberships: active ? [active] : [], active };
}

describe("the permission table", () => {
  it("gives admins everything and viewers only reading", () => {
    expect([...rolePermissions.admin].sort()).toEqual([...permissions].sort());
    expect(rolePermissions.viewer).toEqual(["organization:read", "review:read"]);
  });

  it("keeps people management to admins and integrations to integrators and admins", () => {
    expect(roles.filter((r) => hasPermission(r, "people:manage"))).toEqual(["admin"]);
    expect(roles.filter((r) => hasPermission(r, "integrations:manage"))).toEqual(["admin", "integrator"]);
    expect(roles.filter((r) => hasPermission(r, "review:disposition"))).toEqual(["admin", "engineer"]);
  });

  it("lets engineers issue keys of their own beside integrators and admins, so review:write has someone to grant it", () => {
    expect(roles.filter((r) => hasPermission(r, "keys:issue"))).toEqual(["admin", "engineer", "integrator"]);
  });
});

describe("decideAccess", () => {
  it("asks for sign-in without a session, except on public entries", () => {
    expect(decideAccess("organization:read", null)).toBe("unauthenticated");
    expect(decideAccess("signed-in", null)).toBe("unauthenticated");
    expect(decideAccess("public", null)).toBe("allow");
  });

  it("refuses everything but public entries to someone with no organization left", () => {
    expect(decideAccess("signed-in", contextFor(null))).toBe("forbidden");
    expect(decideAccess("organization:read", contextFor(null))).toBe("forbidden");
  });

  it("follows the role's permissions", () => {
    expect(decideAccess("people:manage", contextFor("engineer"))).toBe("forbidden");
    expect(decideAccess("people:manage", contextFor("admin"))).toBe("allow");
    expect(decideAccess("schedules:submit", contextFor("submitter"))).toBe("allow");
    expect(decideAccess("schedules:submit", contextFor("viewer"))).toBe("forbidden");
  });
});
