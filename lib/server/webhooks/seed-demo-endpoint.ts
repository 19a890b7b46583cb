import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";

import { and, eq } from "drizzle-orm";

import type { Db } from "@/db/client";
import { organizations, webhookEndpoints } from "@/db/schema";
import { createId } from "@/lib/server/ids";

import { subscribableEventTypes } from "./events/event-types";
import { createSigningSecret } from "./sign";

/** Where the partner fake reads the secrets of its receivers (written by the seed, local only). */
export function partnerSecretsFile(localDir: string, port: string): string {
  return join(localDir, "partner-fake", `secrets-${port}.json`);
}

/**
 * With the local fakes on, registers the fake partner receiver as an endpoint of the demo
 * organization (once) and hands its secret to the fake through a file under .local, as a partner
 * would copy it from the console.
 */
export async function seedDemoEndpoint(db: Db, organizationId: string): Promise<void> {
  const port = process.env.PARTNER_PORT;
  if (process.env.SAGLINE_FAKES !== "1" || !port) return;
  const [organization] = await db.select({ id: organizations.id }).from(organizations).where(eq(organizations.id, organizationId));
  if (!organization) return;
  const url = `http://127.0.0.1:${port}/hooks/demo`;
  let [endpoint] = await db.select().from(webhookEndpoints).where(and(eq(webhookEndpoints.organizationId, organizationId), eq(webhookEndpoints.url, url)));
  if (!endpoint) {
    [endpoint] = await db
      .insert(webhookEndpoints)
      .values({ id: createId("wh"), organizationId, url, description: "Local fake partner receiver (docker-local/fakes/partner-fake.ts)", eventTypes: [...subscribableEventTypes], secret: createSigningSecret() })
      .returning();
  }
  const file = partnerSecretsFile(process.env.LOCAL_DIR ?? ".local", port);
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, JSON.stringify({ demo: [endpoint!.secret] }), { mode: 0o600 });
}
