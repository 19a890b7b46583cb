import { demoOrganizations } from "@/db/seed-data";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";

/** A fresh key for a test, created the way the command line does. */
export async function createTestKey(scopes: string[] = ["schedules:write", "results:read"], organizationId: string = demoOrganizations.engineering.id) {
  const { secret } = await createApiKey({ organizationId, name: `test ${Date.now()}`, scopes, createdBy: { commandLine: true } });
  return secret;
}
