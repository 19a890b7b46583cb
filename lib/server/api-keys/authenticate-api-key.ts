import { and, eq, isNull, lt, or } from "drizzle-orm";

import { getDb } from "@/db/client";
import { apiKeys, type ApiKeyScope } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";

import { getApiKeyStatus } from "./api-key-view";
import { hashApiKey, isWellFormedApiKey } from "./key-format";

/** The caller an API-key route handler sees. */
export interface ApiKeyContext {
  organizationId: string;
  apiKeyId: string;
  scopes: readonly ApiKeyScope[];
}

const LAST_USED_RESOLUTION_MS = 60_000;

function refuse(detail: string): DomainError {
  return new DomainError("invalid_api_key", detail);
}

/**
 * Checks a presented key: shape and checksum first (no database work for garbage), then the hash
 * lookup, then revoked and expired. Read on every request, so a revocation applies to the next one.
 */
export async function authenticateApiKey(presented: string, now: Date = new Date()): Promise<ApiKeyContext & { lastUsedAt: Date | null }> {
  if (!isWellFormedApiKey(presented)) throw refuse("The API key is malformed or mistyped (its checksum does not match).");
  const [row] = await getDb()
    .select({
      id: apiKeys.id,
      organizationId: apiKeys.organizationId,
      scopes: apiKeys.scopes,
      revokedAt: apiKeys.revokedAt,
      expiresAt: apiKeys.expiresAt,
      lastUsedAt: apiKeys.lastUsedAt,
    })
    .from(apiKeys)
    .where(eq(apiKeys.secretHash, hashApiKey(presented)));
  if (!row) throw refuse("The API key is not recognised.");
  const status = getApiKeyStatus(row, now);
  if (status === "revoked") throw refuse("The API key has been revoked.");
  if (status === "expired") throw refuse("The API key has expired.");
  return { organizationId: row.organizationId, apiKeyId: row.id, scopes: row.scopes, lastUsedAt: row.lastUsedAt };
}

/**
 * Records use at most once a minute per key: the in-memory check skips the write almost always,
 * and the conditional update keeps concurrent requests from writing more than once.
 */
export async function touchApiKeyLastUsed(key: { apiKeyId: string; lastUsedAt: Date | null }, now: Date = new Date()): Promise<boolean> {
  if (key.lastUsedAt && now.getTime() - key.lastUsedAt.getTime() < LAST_USED_RESOLUTION_MS) return false;
  const threshold = new Date(now.getTime() - LAST_USED_RESOLUTION_MS);
  const updated = await getDb()
    .update(apiKeys)
    .set({ lastUsedAt: now })
    .where(and(eq(apiKeys.id, key.apiKeyId), or(isNull(apiKeys.lastUsedAt), lt(apiKeys.lastUsedAt, threshold))))
    .returning({ id: apiKeys.id });
  return updated.length > 0;
}
