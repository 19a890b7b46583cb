import { createHash } from "node:crypto";

import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";

/** Published in the API docs: a key is remembered for 24 hours after its first use. */
export const IDEMPOTENCY_TTL_HOURS = 24;

export interface StoredResponse {
  status: number;
  body: unknown;
}

export function hashRequest(parts: (string | Uint8Array)[]): string {
  const hash = createHash("sha256");
  for (const part of parts) hash.update(part).update("\u0000");
  return hash.digest("hex");
}

function assertKeyShape(key: string): void {
  if (key.length === 0 || key.length > 255 || !/^[\x21-\x7e]+$/.test(key)) {
    throw new DomainError("bad_request", "Idempotency-Key must be 1 to 255 visible ASCII characters.", [{ pointer: "/headers/idempotency-key", message: "1 to 255 visible ASCII characters" }]);
  }
}

/**
 * IETF "The Idempotency-Key HTTP Header Field": the first request with a key runs; a repeat with
 * the same payload gets the stored answer; the same key with another payload is 422; a repeat
 * while the first still runs is 409. Only successes are stored, so a rejected request (which
 * wrote nothing) can be corrected and sent again with the same key.
 */
export async function runIdempotent(
  organizationId: string,
  key: string | null,
  /** A function, so that a request without a key never pays for hashing its body. */
  hashThisRequest: () => string,
  run: () => Promise<StoredResponse>,
): Promise<StoredResponse & { replayed: boolean }> {
  if (key === null) return { ...(await run()), replayed: false };
  const requestHash = hashThisRequest();
  assertKeyShape(key);
  const sql = getSql();
  await sql`delete from idempotency_keys where organization_id = ${organizationId} and key = ${key} and expires_at < now()`;
  const inserted = await sql`
    insert into idempotency_keys (organization_id, key, request_hash, state, expires_at)
    values (${organizationId}, ${key}, ${requestHash}, 'in_flight', now() + make_interval(hours => ${IDEMPOTENCY_TTL_HOURS}))
    on conflict (organization_id, key) do nothing
    returning id`;
  if (inserted.length === 0) {
    const [existing] = await sql`select request_hash, state, response_status, response_body from idempotency_keys where organization_id = ${organizationId} and key = ${key}`;
    if (!existing) throw new DomainError("idempotency_in_flight", "The first request with this Idempotency-Key is still being processed. Retry shortly.", [], 1);
    if (existing.request_hash !== requestHash) {
      throw new DomainError("idempotency_key_reused", "This Idempotency-Key was already used with a different request. Use a new key for a new request.");
    }
    if (existing.state === "in_flight") throw new DomainError("idempotency_in_flight", "The first request with this Idempotency-Key is still being processed. Retry shortly.", [], 1);
    return { status: existing.response_status as number, body: existing.response_body, replayed: true };
  }
  const id = inserted[0]!.id as number;
  try {
    const response = await run();
    await sql`update idempotency_keys set state = 'completed', response_status = ${response.status}, response_body = ${JSON.stringify(response.body)}::jsonb, updated_at = now() where id = ${id}`;
    return { ...response, replayed: false };
  } catch (error) {
    await sql`delete from idempotency_keys where id = ${id}`;
    throw error;
  }
}
