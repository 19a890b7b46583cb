import { getSql } from "@/db/client";
import { getEnv } from "@/lib/env";

/** Rows deleted per statement: a large backlog is cleared in short steps that never hold locks long. */
const PURGE_BATCH_ROWS = 5_000;
/** At most this many batches per table and run; the next run carries on. */
const PURGE_MAX_BATCHES = 20;

export interface PurgeCounts {
  signInThrottles: number;
  idempotencyKeys: number;
  passwordResets: number;
}

async function deleteInBatches(run: () => Promise<number>): Promise<number> {
  let total = 0;
  for (let batch = 0; batch < PURGE_MAX_BATCHES; batch += 1) {
    const deleted = await run();
    total += deleted;
    if (deleted < PURGE_BATCH_ROWS) break;
  }
  return total;
}

/**
 * Deletes rows whose purpose has passed: sign-in throttles whose window and lock are over,
 * Idempotency-Keys past their published 24 hours (an in-flight key with a live lease stays), and
 * reset links a day past expiry or use. Safe to run in several worker processes at once.
 */
export async function purgeExpiredRows(): Promise<PurgeCounts> {
  const sql = getSql();
  const window = `${getEnv().SIGN_IN_LOCK_MINUTES} minutes`;
  const signInThrottles = await deleteInBatches(async () => {
    const rows = await sql`
      delete from sign_in_throttles where email_key in (
        select email_key from sign_in_throttles
        where updated_at < now() - ${window}::interval and window_started_at < now() - ${window}::interval
          and (locked_until is null or locked_until < now())
        limit ${PURGE_BATCH_ROWS})`;
    return rows.count;
  });
  const idempotencyKeys = await deleteInBatches(async () => {
    const rows = await sql`
      delete from idempotency_keys where id in (
        select id from idempotency_keys
        where expires_at < now() and not (state = 'in_flight' and coalesce(lease_expires_at > now(), false))
        limit ${PURGE_BATCH_ROWS})`;
    return rows.count;
  });
  const passwordResets = await deleteInBatches(async () => {
    const rows = await sql`
      delete from password_resets where id in (
        select id from password_resets where expires_at < now() - interval '1 day'
        limit ${PURGE_BATCH_ROWS})`;
    return rows.count;
  });
  return { signInThrottles, idempotencyKeys, passwordResets };
}
