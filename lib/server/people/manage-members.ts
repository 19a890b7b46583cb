import { and, eq, isNull, ne, sql } from "drizzle-orm";

import { getDb, type Tx } from "@/db/client";
import { apiKeys, invitations, memberships, type Role } from "@/db/schema";
import { revokeDescendantKeys } from "@/lib/server/api-keys/revoke-api-key";
import { DomainError } from "@/lib/server/errors";

async function lockMembership(tx: Tx, organizationId: string, membershipId: string) {
  const [row] = await tx
    .select()
    .from(memberships)
    .where(and(eq(memberships.id, membershipId), eq(memberships.organizationId, organizationId)))
    .for("update");
  // Another organization's membership is reported exactly like a missing one.
  if (!row) throw new DomainError("not_found", "That member was not found.");
  return row;
}

async function assertAnotherAdminRemains(tx: Tx, organizationId: string, membershipId: string) {
  const [other] = await tx
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.organizationId, organizationId), eq(memberships.role, "admin"), ne(memberships.id, membershipId)))
    .limit(1)
    .for("update");
  if (!other) throw new DomainError("conflict", "Every organization keeps at least one administrator.");
}

export async function changeMemberRole(input: { organizationId: string; membershipId: string; role: Role }) {
  await getDb().transaction(async (tx) => {
    const row = await lockMembership(tx, input.organizationId, input.membershipId);
    if (row.role === "admin" && input.role !== "admin") await assertAnotherAdminRemains(tx, input.organizationId, row.id);
    await tx.update(memberships).set({ role: input.role, updatedAt: sql`now()` }).where(eq(memberships.id, row.id));
  });
}

/** What happens to the API keys a removed person made in this organization: the admin chooses. */
export const creatorKeyChoices = ["revoke", "keep"] as const;
export type CreatorKeyChoice = (typeof creatorKeyChoices)[number];

/**
 * Removes a person from the organization. Their API keys there (and keys made with those keys)
 * are revoked in the same transaction unless the admin chose to keep them working; there is no
 * default, so nobody's keys outlive them by accident. Returns how many keys were revoked.
 */
export async function removeMember(input: { organizationId: string; membershipId: string; creatorKeys: CreatorKeyChoice }): Promise<{ revokedKeys: number }> {
  return getDb().transaction(async (tx) => {
    const row = await lockMembership(tx, input.organizationId, input.membershipId);
    if (row.role === "admin") await assertAnotherAdminRemains(tx, input.organizationId, row.id);
    await tx.delete(memberships).where(eq(memberships.id, row.id));
    if (input.creatorKeys === "keep") return { revokedKeys: 0 };
    const now = new Date();
    const revoked = await tx
      .update(apiKeys)
      .set({ revokedAt: now, updatedAt: now })
      .where(and(eq(apiKeys.organizationId, input.organizationId), eq(apiKeys.createdByUserId, row.userId), isNull(apiKeys.revokedAt)))
      .returning({ id: apiKeys.id });
    const made = await tx
      .select({ id: apiKeys.id })
      .from(apiKeys)
      .where(and(eq(apiKeys.organizationId, input.organizationId), eq(apiKeys.createdByUserId, row.userId)));
    await revokeDescendantKeys(tx, input.organizationId, made.map((k) => k.id), now);
    return { revokedKeys: revoked.length };
  });
}

export async function revokeInvitation(input: { organizationId: string; invitationId: string }) {
  const updated = await getDb()
    .update(invitations)
    .set({ revokedAt: sql`now()`, updatedAt: sql`now()` })
    .where(
      and(
        eq(invitations.id, input.invitationId),
        eq(invitations.organizationId, input.organizationId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    )
    .returning({ id: invitations.id });
  if (updated.length === 0) throw new DomainError("not_found", "That invitation was not found or is no longer open.");
}
