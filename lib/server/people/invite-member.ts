import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { invitations, memberships, organizations, users, type Role } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { roleLabels } from "@/lib/server/auth/permissions";
import { DomainError } from "@/lib/server/errors";
import { createId, createSecretToken, hashToken } from "@/lib/server/ids";
import { sendMail } from "@/lib/server/mail/send-mail";
import { buildInvitationMail } from "@/lib/server/mail/templates";

export const INVITATION_TTL_HOURS = 72;

/** Creates a single-use invitation and e-mails its link. The token itself is never stored. */
export async function inviteMember(input: {
  organizationId: string;
  invitedBy: { id: string; name: string };
  email: string;
  role: Role;
}): Promise<{ invitationId: string }> {
  const db = getDb();
  const email = input.email.toLowerCase();
  const [existing] = await db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organizationId, input.organizationId), sql`lower(${users.email}) = ${email}`));
  if (existing) throw new DomainError("conflict", "That person is already a member.", [{ pointer: "email", message: "Already a member of this organization." }]);

  const [organization] = await db.select().from(organizations).where(eq(organizations.id, input.organizationId));
  if (!organization) throw new DomainError("not_found", "Organization not found.");

  const token = createSecretToken();
  const invitationId = createId("inv");
  await db.transaction(async (tx) => {
    // A new invitation replaces any open one for the same address.
    await tx
      .update(invitations)
      .set({ revokedAt: sql`now()`, updatedAt: sql`now()` })
      .where(
        and(
          eq(invitations.organizationId, input.organizationId),
          eq(invitations.email, email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
        ),
      );
    await tx.insert(invitations).values({
      id: invitationId,
      organizationId: input.organizationId,
      email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedByUserId: input.invitedBy.id,
      expiresAt: new Date(Date.now() + INVITATION_TTL_HOURS * 3_600_000),
    });
  });

  const url = `${getEnv().APP_URL}/invitations/${token}`;
  try {
    await sendMail(
      buildInvitationMail({
        to: email,
        organizationName: organization.name,
        roleLabel: roleLabels[input.role],
        inviterName: input.invitedBy.name,
        url,
        expiresInHours: INVITATION_TTL_HOURS,
      }),
    );
  } catch (error) {
    console.error("[sagline] invitation e-mail failed", error);
    await db.update(invitations).set({ revokedAt: sql`now()` }).where(eq(invitations.id, invitationId));
    throw new DomainError("unavailable", "The invitation e-mail could not be sent, so no invitation was made. Try again shortly.");
  }
  return { invitationId };
}
