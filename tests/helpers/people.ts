import { getDb } from "@/db/client";
import { memberships, users, type Role } from "@/db/schema";
import { demoOrganizations } from "@/db/seed-data";
import { hashPassword } from "@/lib/server/auth/passwords";
import { createId } from "@/lib/server/ids";

/** A throwaway person in the demo engineering organization, so tests never lock demo accounts. */
export async function createTestMember(role: Role, organizationId: string = demoOrganizations.engineering.id) {
  const id = createId("usr");
  const email = `${id}@test.example`;
  const password = `pw-${id}-long-enough`;
  await getDb().insert(users).values({ id, email, name: `Test ${role} ${id.slice(-4)}`, passwordHash: await hashPassword(password) });
  const membershipId = createId("mem");
  await getDb().insert(memberships).values({ id: membershipId, userId: id, organizationId, role });
  return { id, email, password, membershipId };
}
