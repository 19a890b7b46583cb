import { and, asc, eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { memberships, organizations, users, type Role } from "@/db/schema";

export interface MembershipSummary {
  membershipId: string;
  organizationId: string;
  organizationName: string;
  organizationKind: "engineering" | "fabricator";
  role: Role;
}

export async function getUserForSession(userId: string) {
  const [user] = await getDb()
    .select({ id: users.id, email: users.email, name: users.name, sessionVersion: users.sessionVersion })
    .from(users)
    .where(eq(users.id, userId));
  return user ?? null;
}

export async function listMembershipsOfUser(userId: string): Promise<MembershipSummary[]> {
  return getDb()
    .select({
      membershipId: memberships.id,
      organizationId: organizations.id,
      organizationName: organizations.name,
      organizationKind: organizations.kind,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(organizations, eq(organizations.id, memberships.organizationId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(organizations.name));
}

export async function listMembersOfOrganization(organizationId: string) {
  return getDb()
    .select({
      membershipId: memberships.id,
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.organizationId, organizationId))
    .orderBy(asc(users.name));
}

export async function getMembershipInOrganization(organizationId: string, membershipId: string) {
  const [row] = await getDb()
    .select()
    .from(memberships)
    .where(and(eq(memberships.id, membershipId), eq(memberships.organizationId, organizationId)));
  return row ?? null;
}
