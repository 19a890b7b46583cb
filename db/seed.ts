// Seeds the invented demo scenario, only into an empty database. Prints the demo sign-ins.
import { sql } from "drizzle-orm";

import { closeDb, getDb } from "./client";
import { apiKeys, memberships, organizations, projects, users } from "./schema";
import { demoApiKey, demoOrganizations, demoProject, demoUsers } from "./seed-data";
import { displayPrefixOf, hashApiKey } from "@/lib/server/api-keys/key-format";
import { hashPassword } from "@/lib/server/auth/passwords";
import { createId } from "@/lib/server/ids";
import { seedDemoCatalogue } from "@/lib/server/criteria/seed-demo-catalogue";
import { seedDemoEndpoint } from "@/lib/server/webhooks/seed-demo-endpoint";
import { closeQueues } from "@/workers/queues";

import { seedCheckedSchedules } from "./seed-schedules";

const db = getDb();
const [{ count }] = (await db.select({ count: sql<number>`count(*)::int` }).from(organizations)) as [{ count: number }];

if (count > 0) {
  console.log("[sagline] database already has data; demo seed skipped");
} else {
  const hashed = await Promise.all(demoUsers.map((u) => hashPassword(u.password)));
  await db.transaction(async (tx) => {
    await tx.insert(organizations).values([demoOrganizations.engineering, demoOrganizations.fabricator]);
    await tx.insert(projects).values({ ...demoProject, organizationId: demoOrganizations.engineering.id, partnerOrganizationId: demoOrganizations.fabricator.id });
    for (const [index, user] of demoUsers.entries()) {
      const userId = `usr_demo${user.role}`;
      await tx.insert(users).values({ id: userId, email: user.email, name: user.name, passwordHash: hashed[index]! });
      await tx.insert(memberships).values({ id: createId("mem"), userId, organizationId: demoOrganizations.engineering.id, role: user.role });
    }
    // The administrator also runs the fabricator's account, so switching organizations can be tried.
    await tx.insert(memberships).values({ id: createId("mem"), userId: "usr_demoadmin", organizationId: demoOrganizations.fabricator.id, role: "admin" });
    await tx.insert(apiKeys).values({
      id: demoApiKey.id,
      organizationId: demoOrganizations.engineering.id,
      name: demoApiKey.name,
      displayPrefix: displayPrefixOf(demoApiKey.secret),
      secretHash: hashApiKey(demoApiKey.secret),
      scopes: [...demoApiKey.scopes],
      // schedules:write needs a role that may submit: the integrator could not have made this key.
      createdByUserId: "usr_demoadmin",
    });
  });
  // Checked by the real engine: one submission with dispositions on record, a revision awaiting review.
  await seedCheckedSchedules();
  console.log("[sagline] demo data seeded");
}

await seedDemoEndpoint(db, demoOrganizations.engineering.id);
await seedDemoCatalogue(demoOrganizations.engineering.id);

if (process.argv.includes("--print")) {
  console.log("\nDemo sign-ins (invented people; change or remove them before real use):");
  for (const u of demoUsers) console.log(`  ${u.role.padEnd(10)} ${u.email.padEnd(38)} ${u.password}`);
  console.log(`\nDemo API key (${demoOrganizations.engineering.name}; ${demoApiKey.scopes.join(", ")}):\n  ${demoApiKey.secret}`);
}
await closeQueues();
await closeDb();
// The schedules' queue producer keeps its own Redis connection (BullMQ leaves a passed-in
// connection open on close); everything is written and closed above, so end the process here.
process.exit(0);
