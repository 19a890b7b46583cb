import { eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { memberships, organizations, users, type Role } from "@/db/schema";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { hashPassword } from "@/lib/server/auth/passwords";
import { createId } from "@/lib/server/ids";

export type TestPerson = { id: string; email: string; password: string; name: string };

/** A throwaway engineering organization with one person per role, so queue, mail and events are this file's own. */
export async function createReviewOrganization(label: string) {
  const organizationId = createId("org");
  await getDb().insert(organizations).values({ id: organizationId, name: `Review test ${label} ${organizationId.slice(-4)}`, kind: "engineering" });
  const people = {} as Record<Role, TestPerson>;
  for (const role of ["admin", "engineer", "integrator", "viewer"] as const) {
    const id = createId("usr");
    const person = { id, email: `${role}-${id}@test.example`, password: `pw-${id}-long-enough`, name: `Invented ${role} ${id.slice(-4)}` };
    await getDb().insert(users).values({ id, email: person.email, name: person.name, passwordHash: await hashPassword(person.password) });
    await getDb().insert(memberships).values({ id: createId("mem"), userId: id, organizationId, role });
    people[role] = person;
  }
  const key = async (scopes: string[]) => (await createApiKey({ organizationId, name: `review test ${scopes.join(" ")}`, scopes, createdBy: { commandLine: true } })).secret;
  return { organizationId, people, key, remove: () => getDb().delete(organizations).where(eq(organizations.id, organizationId)) };
}
