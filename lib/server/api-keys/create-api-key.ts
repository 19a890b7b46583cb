import { eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { apiKeys, organizations, type ApiKeyScope } from "@/db/schema";
import { DomainError, type FieldError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import type { ApiKeyView } from "./api-key-view";
import { createApiKeySecret, displayPrefixOf, hashApiKey } from "./key-format";
import { API_KEY_EXPIRES_DAYS_MAX, API_KEY_NAME_MAX_LENGTH } from "./limits";
import { getApiKeyView } from "./list-api-keys";
import { apiKeyScopes, isApiKeyScope, listMissingScopes } from "./scopes";

const DAY_MS = 86_400_000;

export interface CreateApiKeyInput {
  organizationId: string;
  name: string;
  scopes: readonly string[];
  /** Whole days from now; absent means the key does not expire. */
  expiresInDays?: number | null;
  /** Who asks: a person, another key (which may only grant scopes it holds), or the command line. */
  createdBy: { userId: string } | { apiKeyId: string; scopes: readonly string[] } | { commandLine: true };
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
 * Creates a key and returns it with its secret, which exists only in this answer: the database
 * keeps its SHA-256. A key creating a key cannot hand out a scope it lacks.
 */
export async function createApiKey(input: CreateApiKeyInput): Promise<{ apiKey: ApiKeyView; secret: string }> {
  const { name, scopes, expiresInDays } = assertCreateInput(input);
  if ("apiKeyId" in input.createdBy) {
    const missing = listMissingScopes(input.createdBy.scopes, scopes);
    if (missing.length) throw new DomainError("insufficient_scope", `This key cannot grant scopes it does not hold: ${missing.join(", ")}.`);
  }
  const [organization] = await getDb().select({ id: organizations.id }).from(organizations).where(eq(organizations.id, input.organizationId));
  if (!organization) throw new DomainError("not_found", "That organization was not found.");

  const secret = createApiKeySecret();
  const id = createId("key");
  // Millisecond precision, so the keyset cursor (a JS Date) matches the stored value exactly.
  const now = new Date();
  await getDb()
    .insert(apiKeys)
    .values({
      id,
      organizationId: input.organizationId,
      name,
      displayPrefix: displayPrefixOf(secret),
      secretHash: hashApiKey(secret),
      scopes,
      expiresAt: expiresInDays === null ? null : new Date(now.getTime() + expiresInDays * DAY_MS),
      createdByUserId: "userId" in input.createdBy ? input.createdBy.userId : null,
      createdByApiKeyId: "apiKeyId" in input.createdBy ? input.createdBy.apiKeyId : null,
      createdAt: now,
      updatedAt: now,
    });
  const apiKey = await getApiKeyView(input.organizationId, id);
  if (!apiKey) throw new Error(`api key ${id} vanished after insert`);
  return { apiKey, secret };
}
