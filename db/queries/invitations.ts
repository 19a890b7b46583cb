import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { invitations } from "@/db/schema";

export async function listOpenInvitations(organizationId: string) {
  return getDb()
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(
      and(
        eq(invitations.organizationId, organizationId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        sql`${invitations.expiresAt} > now()`,
      ),
    )
    .orderBy(invitations.createdAt);
}
