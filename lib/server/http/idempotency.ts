import { createHash, randomBytes } from "node:crypto";

import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";

/** Published in the API docs: a key is remembered for 24 hours after its first use. */
export const IDEMPOTENCY_TTL_HOURS = 24;
/**
 * How long a request holds its key while it runs. A request that dies leaves its key to the next
 * retry after this; one that is merely slow loses nothing but its claim (see CompleteKey).
 */
export const IDEMPOTENCY_LEASE_SECONDS = 120;

export interface StoredResponse {
  status: number;
  body: unknown;
}

/**
 * Records the answer under the key inside the caller's transaction, so the key is completed
 * exactly when the work commits. Throws (rolling the work back) when the claim was lost to a
 * retry that took over an expired lease: that retry does the work instead, so it happens once.
 */
export type CompleteKey = (tx: TransactionSql, response: StoredResponse) => Promise<void>;

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

const inFlight = () => new DomainError("idempotency_in_flight", "The first request with this Idempotency-Key is still being processed. Retry shortly.", [], 1);

/**
 * Claims the key: a new key, one whose 24 hours are over, or one whose holder let its lease lapse
 * (it died mid-way, and nothing it did was committed). Returns the claim's token, or null when
 * someone else holds or has completed the key.
 */
async function claimKey(organizationId: string, key: string, requestHash: string): Promise<{ id: number; token: string } | null> {
  const token = randomBytes(16).toString("hex");
  const [claimed] = await getSql()`
    insert into idempotency_keys as k (organization_id, key, request_hash, state, lease_token, lease_expires_at, expires_at)
    values (${organizationId}, ${key}, ${requestHash}, 'in_flight', ${token}, now() + make_interval(secs => ${IDEMPOTENCY_LEASE_SECONDS}),
      now() + make_interval(hours => ${IDEMPOTENCY_TTL_HOURS}))
    on conflict (organization_id, key) do update set
      request_hash = excluded.request_hash, state = 'in_flight', lease_token = excluded.lease_token,
      lease_expires_at = excluded.lease_expires_at, expires_at = excluded.expires_at,
      response_status = null, response_body = null, created_at = now(), updated_at = now()
    -- Rows claimed before leases existed have none: they count from their last update.
    where k.expires_at < now()
      or (k.state = 'in_flight' and coalesce(k.lease_expires_at, k.updated_at + make_interval(secs => ${IDEMPOTENCY_LEASE_SECONDS})) < now())
    returning id`;
  return claimed ? { id: claimed.id as number, token } : null;
}

async function readExisting(organizationId: string, key: string, requestHash: string): Promise<StoredResponse> {
  const [existing] = await getSql()`
    select request_hash, state, response_status, response_body from idempotency_keys
    where organization_id = ${organizationId} and key = ${key}`;
  // Released by a request that failed between our claim attempt and this read: retry.
  if (!existing) throw inFlight();
  if (existing.request_hash !== requestHash) {
    throw new DomainError("idempotency_key_reused", "This Idempotency-Key was already used with a different request. Use a new key for a new request.");
  }
  if (existing.state !== "completed") throw inFlight();
  return { status: existing.response_status as number, body: existing.response_body };
}

/**
 * IETF "The Idempotency-Key HTTP Header Field": the first request with a key runs; a repeat with
 * the same payload gets the stored answer; the same key with another payload is 422; a repeat
 * while the first still runs is 409. `run` must call completeKey inside the transaction that
 * stores its work. Only successes are stored: a request that fails releases its key (it wrote
 * nothing), so it can be corrected and sent again with the same key; one that dies leaves its
 * claim to expire after IDEMPOTENCY_LEASE_SECONDS.
 */
export async function runIdempotent(
  organizationId: string,
  key: string | null,
  /** A function, so that a request without a key never pays for hashing its body. */
  hashThisRequest: () => string,
  run: (completeKey: CompleteKey) => Promise<StoredResponse>,
): Promise<StoredResponse & { replayed: boolean }> {
  if (key === null) return { ...(await run(async () => {})), replayed: false };
  const requestHash = hashThisRequest();
  assertKeyShape(key);
  const claim = await claimKey(organizationId, key, requestHash);
  if (!claim) return { ...(await readExisting(organizationId, key, requestHash)), replayed: true };

  let completed = false;
  const completeKey: CompleteKey = async (tx, response) => {
    const updated = await tx`
      update idempotency_keys set state = 'completed', response_status = ${response.status},
        response_body = ${JSON.stringify(response.body)}::jsonb, lease_token = null, lease_expires_at = null, updated_at = now()
      where id = ${claim.id} and lease_token = ${claim.token} and state = 'in_flight'
      returning id`;
    if (updated.length === 0) throw inFlight();
    completed = true;
  };
  let response: StoredResponse;
  try {
    response = await run(completeKey);
  } catch (error) {
    // Only our own unfinished claim is released; a completed key or a taken-over one stays.
    await getSql()`delete from idempotency_keys where id = ${claim.id} and lease_token = ${claim.token} and state = 'in_flight'`.catch(
      (releaseError: Error) => console.error(`[sagline] idempotency key not released (${releaseError.message}); its lease expires on its own`),
    );
    throw error;
  }
  // A programming error, not a request error: the key keeps its claim until the lease ends.
  if (!completed) throw new Error("runIdempotent: the work committed without completing its Idempotency-Key");
  return { ...response, replayed: false };
}
