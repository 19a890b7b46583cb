import { getServerSession } from "next-auth";
import { cookies } from "next/headers";
import { cache } from "react";

import type { Role } from "@/db/schema";
import { getUserForSession, listMembershipsOfUser, type MembershipSummary } from "@/db/queries/memberships";

import { getAuthOptions } from "./auth-options";
import { hasPermission, type Permission } from "./permissions";

export const ACTIVE_ORG_COOKIE = "sagline_org";

export interface RequestContext {
  user: { id: string; email: string; name: string };
  memberships: MembershipSummary[];
  /** null when the user belongs to no organization any more. */
  active: MembershipSummary | null;
}

/**
 * Who is asking, read fresh from PostgreSQL on every request (never from the token), so a role
 * change or a removal takes effect on the very next request. Cached per request only.
 */
export const getRequestContext = cache(async (): Promise<RequestContext | null> => {
  const session = (await getServerSession(getAuthOptions())) as { uid?: string; sessionVersion?: number } | null;
  if (!session?.uid) return null;
  const user = await getUserForSession(session.uid);
  if (!user) return null;
  // A password reset signs out sessions issued before it.
  if (session.sessionVersion !== user.sessionVersion) return null;
  const memberships = await listMembershipsOfUser(user.id);
  const wanted = (await cookies()).get(ACTIVE_ORG_COOKIE)?.value;
  const active = memberships.find((m) => m.organizationId === wanted) ?? memberships[0] ?? null;
  return { user: { id: user.id, email: user.email, name: user.name }, memberships, active };
});

export function can(context: RequestContext | null, permission: Permission): boolean {
  return !!context?.active && hasPermission(context.active.role, permission);
}

export function activeRole(context: RequestContext | null): Role | null {
  return context?.active?.role ?? null;
}
