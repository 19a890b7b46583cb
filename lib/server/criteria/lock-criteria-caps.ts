import type { TransactionSql } from "postgres";

/**
 * Holds, until the transaction ends, the organization's lock on its criteria caps (how many
 * profiles and materials, how many sections in use). A cap is counted and the row written under
 * it, so two concurrent writes cannot both see room for one. A transaction-level advisory lock
 * rather than `for update` on the organization row: that would also block every insert that
 * references the organization (schedules, keys) for as long as the catalogue import runs.
 */
export async function lockCriteriaCaps(tx: TransactionSql, organizationId: string): Promise<void> {
  await tx`select pg_advisory_xact_lock(hashtextextended(${`sagline:criteria-caps:${organizationId}`}, 0))`;
}
