import { and, eq } from "drizzle-orm";

import { getDb, type Tx } from "@/db/client";
import { apiKeys, organizations, type ApiKeyScope, type Role } from "@/db/schema";
import { DomainError, type FieldError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import type { ApiKeyView } from "./api-key-view";
import { createApiKeySecret, displayPrefixOf, hashApiKey } from "./key-format";
import { API_KEY_EXPIRES_DAYS_MAX, API_KEY_NAME_MAX_LENGTH } from "./limits";
import { getApiKeyView } from "./list-api-keys";
import { apiKeyScopes, isApiKeyScope, listGrantableScopes, listMissingScopes } from "./scopes";

const DAY_MS = 86_400_000;

export interface CreateApiKeyInput {
  organizationId: string;
  name: string;
  scopes: readonly string[];
  /** Whole days from now; absent means the key does not expire. */
  expiresInDays?: number | null;
  /**
   * Who asks: a person (who may only grant scopes their role allows), another key (only scopes it
   * holds, expiring no later than it), or the command line.
   */
  createdBy: { userId: string; role: Role } | { apiKeyId: string; scopes: readonly string[] } | { commandLine: true };
}

function assertCreateInput(input: CreateApiKeyInput): { name: string; scopes: ApiKeyScope[]; expiresInDays: number | null } {
  const errors: FieldError[] = [];
  const name = input.name.trim();
  if (!name) errors.push({ pointer: "/name", message: "Give the key a name, e.g. the system that will use it." });
  else if (name.length > API_KEY_NAME_MAX_LENGTH) errors.push({ pointer: "/name", message: `Keep the name to ${API_KEY_NAME_MAX_LENGTH} characters.` });
  else if (/[\u0000-\u001f\u007f]/.test(name)) errors.push({ pointer: "/name", message: "The name contains control characters." });
  const unknown = input.scopes.filter((s) => !isApiKeyScope(s));
  if (input.scopes.length === 0) errors.push({ pointer: "/scopes", message: "Choose at least one scope." });
  for (const s of unknown) errors.push({ pointer: "/scopes", message: `"${s.slice(0, 40)}" is not a scope; use ${apiKeyScopes.join(", ")}.` });
  const days = input.expiresInDays ?? null;
  if (days !== null && (!Number.isInteger(days) || days < 1 || days > API_KEY_EXPIRES_DAYS_MAX)) {
    errors.push({ pointer: "/expiresInDays", message: `Use a whole number of days from 1 to ${API_KEY_EXPIRES_DAYS_MAX}, or leave it out for no expiry.` });
  }
  if (errors.length) throw new DomainError("invalid_input", "The key could not be created; see errors.", errors);
  const scopes = apiKeyScopes.filter((s) => input.scopes.includes(s));
  return { name, scopes, expiresInDays: days };
}

/**
 * The parent key, locked against revocation until this transaction ends, so a child is never
 * made from a key that is being revoked (revokeApiKey then finds the child and revokes it too).
 */
async function lockParentKey(tx: Tx, organizationId: string, parentId: string): Promise<{ expiresAt: Date | null }> {
  const [parent] = await tx
    .select({ revokedAt: apiKeys.revokedAt, expiresAt: apiKeys.expiresAt })
    .from(apiKeys)
    .where(and(eq(apiKeys.id, parentId), eq(apiKeys.organizationId, organizationId)))
    .for("share");
  if (!parent || parent.revokedAt || (parent.expiresAt && parent.expiresAt.getTime() <= Date.now())) {
    throw new DomainError("invalid_api_key", "The API key making this request is no longer valid.");
  }
  return { expiresAt: parent.expiresAt };
}

function assertRoleMayGrant(role: Role, scopes: readonly ApiKeyScope[]): void {
  const grantable = listGrantableScopes(role);
  const refused = scopes.filter((s) => !grantable.includes(s));
  if (refused.length > 0) {
    throw new DomainError("forbidden", `Your role cannot grant ${refused.join(", ")}.`, [
      { pointer: "/scopes", message: `Your role may grant ${grantable.join(", ") || "no scopes"}.` },
    ]);
  }
}

/** The earlier of the requested expiry and the parent's: a child key never outlives its parent. */
function capExpiry(requested: Date | null, parentExpiresAt: Date | null): Date | null {
  if (!parentExpiresAt) return requested;
  if (!requested) return parentExpiresAt;
  return requested.getTime() < parentExpiresAt.getTime() ? requested : parentExpiresAt;
}

/**
 * Creates a key and returns it with its secret, which exists only in this answer: the database
 * keeps its SHA-256. A key creating a key cannot hand out a scope it lacks, and its child expires
 * no later than it does and is revoked with it; a person cannot grant more than their role allows.
 */
export async function createApiKey(input: CreateApiKeyInput): Promise<{ apiKey: ApiKeyView; secret: string }> {
  const { name, scopes, expiresInDays } = assertCreateInput(input);
  const createdBy = input.createdBy;
  if ("apiKeyId" in createdBy) {
    const missing = listMissingScopes(createdBy.scopes, scopes);
    if (missing.length) throw new DomainError("insufficient_scope", `This key cannot grant scopes it does not hold: ${missing.join(", ")}.`);
  }
  if ("role" in createdBy) assertRoleMayGrant(createdBy.role, scopes);
  const [organization] = await getDb().select({ id: organizations.id }).from(organizations).where(eq(organizations.id, input.organizationId));
  if (!organization) throw new DomainError("not_found", "That organization was not found.");

  const secret = createApiKeySecret();
  const id = createId("key");
  // Millisecond precision, so the keyset cursor (a JS Date) matches the stored value exactly.
  const now = new Date();
  const requestedExpiry = expiresInDays === null ? null : new Date(now.getTime() + expiresInDays * DAY_MS);
  await getDb().transaction(async (tx) => {
    const parent = "apiKeyId" in createdBy ? await lockParentKey(tx, input.organizationId, createdBy.apiKeyId) : null;
    await tx.insert(apiKeys).values({
      id,
      organizationId: input.organizationId,
      name,
      displayPrefix: displayPrefixOf(secret),
      secretHash: hashApiKey(secret),
      scopes,
      expiresAt: capExpiry(requestedExpiry, parent?.expiresAt ?? null),
      createdByUserId: "userId" in createdBy ? createdBy.userId : null,
      createdByApiKeyId: "apiKeyId" in createdBy ? createdBy.apiKeyId : null,
      createdAt: now,
      updatedAt: now,
    });
  });
  const apiKey = await getApiKeyView(input.organizationId, id);
  if (!apiKey) throw new Error(`api key ${id} vanished after insert`);
  return { apiKey, secret };
}
