import { sql } from "drizzle-orm";
import { index, pgTable, text, timestamp, uniqueIndex, type AnyPgColumn } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";
import { users } from "./users";

/** What an API key may do. webhooks:manage and keys:manage are administrative; criteria:manage changes engineering criteria; review:write records engineering decisions. */
export const apiKeyScopes = ["schedules:write", "results:read", "webhooks:manage", "keys:manage", "criteria:manage", "review:write"] as const;
export type ApiKeyScope = (typeof apiKeyScopes)[number];

/**
 * Keys for partner systems. Only the SHA-256 of the full key is stored (a database leak hands out
 * nothing usable) plus a short display prefix so people can tell keys apart.
 */
export const apiKeys = pgTable(
  "api_keys",
  {
    /** Public id, `key_...`; never the secret. */
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    name: text().notNull(),
    /** The first characters of the key, e.g. `sgl_7Hq2xK9p`, shown in lists. */
    displayPrefix: text().notNull(),
    secretHash: text().notNull(),
    scopes: text({ enum: apiKeyScopes }).array().notNull(),
    expiresAt: timestamp({ withTimezone: true }),
    /** Who created it: a person in the console, another key through the API, or neither (the CLI). */
    createdByUserId: text().references(() => users.id, { onDelete: "set null" }),
    createdByApiKeyId: text().references((): AnyPgColumn => apiKeys.id, { onDelete: "set null" }),
    revokedAt: timestamp({ withTimezone: true }),
    /** Coarse: written at most once a minute per key, never on every request. */
    lastUsedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("api_keys_secret_hash_idx").on(t.secretHash),
    index("api_keys_organization_id_created_at_idx").on(t.organizationId, sql`${t.createdAt} desc`, sql`${t.id} desc`),
  ],
);
