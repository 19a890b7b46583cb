import { and, desc, eq, lt, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";

import { getDb } from "@/db/client";
import { apiKeys, users } from "@/db/schema";

import { toApiKeyView, type ApiKeyView } from "./api-key-view";

/** Keyset position: the last key of the previous page (newest first). */
export interface ApiKeyCursor {
  createdAt: Date;
  id: string;
}

const creatorKeys = alias(apiKeys, "creator_keys");

// PostgreSQL keeps microseconds, a JS Date milliseconds: compare at the cursor's precision so a
// page boundary never skips or repeats a key.
const createdAtMs = sql<Date>`date_trunc('milliseconds', ${apiKeys.createdAt})`;

function selectKeysWithCreator(where: SQL | undefined) {
  return getDb()
    .select({
      id: apiKeys.id,
      name: apiKeys.name,
      displayPrefix: apiKeys.displayPrefix,
      scopes: apiKeys.scopes,
      createdAt: apiKeys.createdAt,
      lastUsedAt: apiKeys.lastUsedAt,
      expiresAt: apiKeys.expiresAt,
      revokedAt: apiKeys.revokedAt,
      creatorUserId: users.id,
      creatorUserName: users.name,
      creatorKeyId: creatorKeys.id,
      creatorKeyPrefix: creatorKeys.displayPrefix,
    })
    .from(apiKeys)
    .leftJoin(users, eq(users.id, apiKeys.createdByUserId))
    .leftJoin(creatorKeys, eq(creatorKeys.id, apiKeys.createdByApiKeyId))
    .where(where);
}

/** One page of an organization's keys, newest first, with the cursor of the next page (null at the end). */
export async function listApiKeys(input: {
  organizationId: string;
  limit: number;
  after?: ApiKeyCursor | null;
  /** Only the keys this person made (a role that issues keys but does not manage integrations). */
  madeByUserId?: string;
}): Promise<{ items: ApiKeyView[]; next: ApiKeyCursor | null }> {
  const { organizationId, limit, after, madeByUserId } = input;
  // postgres-js binds raw parameters as text, so the cursor's time goes in as ISO 8601.
  const afterAt = after ? sql`${after.createdAt.toISOString()}::timestamptz` : null;
  const position =
    after && afterAt ? or(sql`${createdAtMs} < ${afterAt}`, and(sql`${createdAtMs} = ${afterAt}`, lt(apiKeys.id, after.id))) : undefined;
  const maker = madeByUserId === undefined ? undefined : eq(apiKeys.createdByUserId, madeByUserId);
  const rows = await selectKeysWithCreator(and(eq(apiKeys.organizationId, organizationId), maker, position))
    .orderBy(desc(createdAtMs), desc(apiKeys.id))
    .limit(limit + 1);
  const page = rows.slice(0, limit);
  const last = page.at(-1);
  const next = rows.length > limit && last ? { createdAt: last.createdAt, id: last.id } : null;
  const now = new Date();
  return { items: page.map((row) => toApiKeyView(row, now)), next };
}

/** The key as shown, or null when it does not exist in this organization (another tenant's id included). */
export async function getApiKeyView(organizationId: string, keyId: string): Promise<ApiKeyView | null> {
  const [row] = await selectKeysWithCreator(and(eq(apiKeys.organizationId, organizationId), eq(apiKeys.id, keyId)));
  return row ? toApiKeyView(row) : null;
}
