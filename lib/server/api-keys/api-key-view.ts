import type { ApiKeyScope } from "@/db/schema";

export type ApiKeyStatus = "active" | "expired" | "revoked";

export type ApiKeyCreator = { kind: "user"; id: string; name: string } | { kind: "api_key"; id: string; prefix: string };

/** A key as the API and the console show it (api-schemas/v1/api-key.schema.json). Never the secret. */
export interface ApiKeyView {
  id: string;
  name: string;
  prefix: string;
  scopes: ApiKeyScope[];
  status: ApiKeyStatus;
  /** null for keys made with the command line, or whose creator has since been removed. */
  createdBy: ApiKeyCreator | null;
  createdAt: string;
  /** Coarse: updated at most once a minute. */
  lastUsedAt: string | null;
  expiresAt: string | null;
  revokedAt: string | null;
}

export interface ApiKeyRowWithCreator {
  id: string;
  name: string;
  displayPrefix: string;
  scopes: ApiKeyScope[];
  createdAt: Date;
  lastUsedAt: Date | null;
  expiresAt: Date | null;
  revokedAt: Date | null;
  creatorUserId: string | null;
  creatorUserName: string | null;
  creatorKeyId: string | null;
  creatorKeyPrefix: string | null;
}

export function getApiKeyStatus(key: { revokedAt: Date | null; expiresAt: Date | null }, now: Date): ApiKeyStatus {
  if (key.revokedAt) return "revoked";
  if (key.expiresAt && key.expiresAt.getTime() <= now.getTime()) return "expired";
  return "active";
}

export function toApiKeyView(row: ApiKeyRowWithCreator, now: Date = new Date()): ApiKeyView {
  const createdBy: ApiKeyCreator | null =
    row.creatorUserId && row.creatorUserName
      ? { kind: "user", id: row.creatorUserId, name: row.creatorUserName }
      : row.creatorKeyId && row.creatorKeyPrefix
        ? { kind: "api_key", id: row.creatorKeyId, prefix: row.creatorKeyPrefix }
        : null;
  return {
    id: row.id,
    name: row.name,
    prefix: row.displayPrefix,
    scopes: row.scopes,
    status: getApiKeyStatus(row, now),
    createdBy,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    expiresAt: row.expiresAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}
