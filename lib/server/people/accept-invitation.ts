import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { invitations, memberships, organizations, users } from "@/db/schema";
import { hashPassword, verifyPassword } from "@/lib/server/auth/passwords";
import { assertAttemptsAllowed } from "@/lib/server/auth/throttle";
import { invitationAddressRule, invitationTokenRule } from "@/lib/server/auth/throttle-rules";
import { DomainError } from "@/lib/server/errors";
import { createId, hashToken } from "@/lib/server/ids";

const refused = "This invitation link has expired, was already used or was withdrawn. Ask your administrator for a new one.";

/** What the invitation page shows before the person accepts. null when the link is not usable. */
export async function getOpenInvitation(token: string) {
  const [row] = await getDb()
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      organizationName: organizations.name,
      accountExists: sql<boolean>`exists (select 1 from ${users} where lower(${users.email}) = ${invitations.email})`,
    })
    .from(invitations)
    .innerJoin(organizations, eq(organizations.id, invitations.organizationId))
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        sql`${invitations.expiresAt} > now()`,
      ),
    );
  return row ?? null;
}

/**
 * Accepts an invitation once: a new account gets a name and password; an existing account proves
 * itself with its password. The invitation row is locked so two clicks cannot both succeed.
 * Throttled per link and per client address before anything else, since an existing account's
 * password is checked here too (a second door to guess it through).
 */
export async function acceptInvitation(input: { token: string; name?: string; password: string; clientAddress: string }) {
  await assertAttemptsAllowed(
    [
      { rule: invitationTokenRule, subject: hashToken(input.token) },
      { rule: invitationAddressRule, subject: input.clientAddress },
    ],
    "Too many attempts to accept this invitation.",
  );
  return getDb().transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(invitations)
      .where(
        and(
          eq(invitations.tokenHash, hashToken(input.token)),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
          sql`${invitations.expiresAt} > now()`,
        ),
      )
      .for("update");
    if (!invitation) throw new DomainError("not_found", refused);

    const [existing] = await tx.select().from(users).where(sql`lower(${users.email}) = ${invitation.email}`);
    let userId: string;
    if (existing) {
      if (!(await verifyPassword(existing.passwordHash, input.password))) {
        throw new DomainError("invalid_input", "That password does not match the existing account.", [
          { pointer: "password", message: "Enter the password of your existing Sagline account." },
        ]);
      }
      userId = existing.id;
    } else {
      if (!input.name) throw new DomainError("invalid_input", "Enter your name.", [{ pointer: "name", message: "Enter your name." }]);
      userId = createId("usr");
      await tx.insert(users).values({ id: userId, email: invitation.email, name: input.name, passwordHash: await hashPassword(input.password) });
    }
    await tx
      .insert(memberships)
      .values({ id: createId("mem"), userId, organizationId: invitation.organizationId, role: invitation.role })
      .onConflictDoUpdate({ target: [memberships.userId, memberships.organizationId], set: { role: invitation.role, updatedAt: sql`now()` } });
    await tx.update(invitations).set({ acceptedAt: sql`now()`, updatedAt: sql`now()` }).where(eq(invitations.id, invitation.id));
    return { email: invitation.email, organizationId: invitation.organizationId };
  });
}
