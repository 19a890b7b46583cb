import { and, eq, isNull } from "drizzle-orm";

import { getDb } from "@/db/client";
import { apiKeys } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";

import type { ApiKeyView } from "./api-key-view";
import { getApiKeyView } from "./list-api-keys";

/**
 * Revokes a key of this organization; it is refused from the next request on (every request reads
 * the key row). Revoking twice keeps the first time. Another organization's key reads as missing.
 */
export async function revokeApiKey(input: { organizationId: string; keyId: string }): Promise<ApiKeyView> {
  const now = new Date();
  await getDb()
    .update(apiKeys)
    .set({ revokedAt: now, updatedAt: now })
    .where(and(eq(apiKeys.id, input.keyId), eq(apiKeys.organizationId, input.organizationId), isNull(apiKeys.revokedAt)));
  const view = await getApiKeyView(input.organizationId, input.keyId);
  if (!view) throw new DomainError("not_found", "That API key was not found.");
  return view;
}
