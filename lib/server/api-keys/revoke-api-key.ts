import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb, type Tx } from "@/db/client";
import { apiKeys } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";

import type { ApiKeyView } from "./api-key-view";
import { getApiKeyView } from "./list-api-keys";

/**
 * Revokes every key made, directly or through other keys, by the given keys. Run after the given
 * keys' own revocation in the same transaction: a key being made by one of them waits on that
 * row lock (create-api-key.ts locks its parent) and is either seen here or refused.
 */
export async function revokeDescendantKeys(tx: Tx, organizationId: string, parentIds: string[], now: Date): Promise<void> {
  if (parentIds.length === 0) return;
  await tx.execute(sql`
    with recursive tree(id) as (
      select id from api_keys where created_by_api_key_id in ${parentIds} and organization_id = ${organizationId}
      union
      select k.id from api_keys k join tree on k.created_by_api_key_id = tree.id
    )
    update api_keys set revoked_at = ${now.toISOString()}::timestamptz, updated_at = ${now.toISOString()}::timestamptz
    where id in (select id from tree) and revoked_at is null`);
}

/**
 * Revokes a key of this organization and every key made with it; they are refused from the next
 * request on (every request reads the key row). Revoking twice keeps the first time. Another
 * organization's key reads as missing.
 */
export async function revokeApiKey(input: { organizationId: string; keyId: string; madeByUserId?: string }): Promise<ApiKeyView> {
  const now = new Date();
  // Someone who may revoke only their own keys finds another person's key exactly as a missing one.
  const mine = input.madeByUserId === undefined ? undefined : eq(apiKeys.createdByUserId, input.madeByUserId);
  const [owned] = await getDb()
    .select({ id: apiKeys.id })
    .from(apiKeys)
    .where(and(eq(apiKeys.id, input.keyId), eq(apiKeys.organizationId, input.organizationId), mine));
  if (!owned) throw new DomainError("not_found", "That API key was not found.");
  await getDb().transaction(async (tx) => {
    await tx
      .update(apiKeys)
      .set({ revokedAt: now, updatedAt: now })
      .where(and(eq(apiKeys.id, input.keyId), eq(apiKeys.organizationId, input.organizationId), isNull(apiKeys.revokedAt)));
    await revokeDescendantKeys(tx, input.organizationId, [input.keyId], now);
  });
  const view = await getApiKeyView(input.organizationId, input.keyId);
  if (!view) throw new DomainError("not_found", "That API key was not found.");
  return view;
}
