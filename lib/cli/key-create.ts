/**
 * Creates an API key from the command line, e.g. for a new deployment before anyone can sign in:
 * `npm run key:create -- --org ORG_ID --name NAME --scopes schedules:write,results:read [--expires-days N]`.
 * Prints the key once on stdout (details on stderr). Exit codes: 0 created, 2 bad input, 3 internal error.
 */
import { closeDb } from "@/db/client";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { KEY_CREATE_USAGE, KeyCreateUsageError, parseKeyCreateArgs } from "@/lib/server/api-keys/key-create-args";
import { DomainError } from "@/lib/server/errors";

async function main(): Promise<number> {
  try {
    const args = parseKeyCreateArgs(process.argv.slice(2));
    const { apiKey, secret } = await createApiKey({ ...args, createdBy: { commandLine: true } });
    console.error(`Created ${apiKey.id} "${apiKey.name}" for ${args.organizationId} with ${apiKey.scopes.join(", ")}; expires ${apiKey.expiresAt ?? "never"}.`);
    console.error("Store this key now; it is not shown again (Sagline keeps only its hash):");
    console.log(secret);
    return 0;
  } catch (error) {
    if (error instanceof KeyCreateUsageError) {
      console.error(`${error.message}\n${KEY_CREATE_USAGE}`);
      return 2;
    }
    if (error instanceof DomainError) {
      console.error(error.message);
      for (const e of error.errors) console.error(`  ${e.pointer ?? ""}: ${e.message}`);
      return 2;
    }
    console.error("key:create failed:", error instanceof Error ? error.message : error);
    if (error instanceof Error && error.message.startsWith("Invalid environment")) {
      console.error("Run it as npm run key:create -- ... (after npm start it reads .local/instance.env), or set DATABASE_URL and the rest yourself (README, Operations).");
    }
    return 3;
  } finally {
    await closeDb();
  }
}

process.exitCode = await main();
