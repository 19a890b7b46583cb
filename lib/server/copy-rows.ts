import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";

import type { Sql, TransactionSql } from "postgres";

export type CopyCell = string | number | boolean | null;

/**
 * One row as COPY ... (format csv) reads it. An unquoted empty field is NULL, so every string is
 * quoted (quotes doubled), the empty string included. Numbers and booleans need no quoting:
 * String(number) never holds a comma, quote or newline, and PostgreSQL reads "Infinity" and "NaN"
 * for double precision. Written as a loop: this runs for every result row of a schedule.
 */
export function encodeCsvLine(row: readonly CopyCell[]): string {
  let line = "";
  for (let i = 0; i < row.length; i++) {
    if (i > 0) line += ",";
    const cell = row[i];
    if (cell === null || cell === undefined) continue;
    // String(-0) is "0": keep the sign, as the number would round-trip through the driver
    if (typeof cell === "number") line += cell === 0 && 1 / cell < 0 ? "-0" : String(cell);
    else if (typeof cell === "boolean") line += cell ? "t" : "f";
    else line += cell.includes('"') ? `"${cell.replaceAll('"', '""')}"` : `"${cell}"`;
  }
  return line + "\n";
}

/**
 * Bulk-writes rows with PostgreSQL COPY (never a loop of single inserts). Runs inside the given
 * transaction, so a failure writes nothing, and rejects with PostgreSQL's error.
 */
export async function copyRows(sql: Sql | TransactionSql, table: string, columns: readonly string[], rows: Iterable<readonly CopyCell[]>): Promise<void> {
  const query = sql.unsafe(`copy ${table} (${columns.join(", ")}) from stdin with (format csv)`);
  const refused = observeRefusal(query as unknown as DriverQuery);
  // also rejects when the COPY statement itself fails, which `await query.writable()` reports
  refused.catch(() => undefined);
  // The connection may drop before the COPY starts: then only `refused` settles (a hang otherwise,
  // and a job that hangs keeps renewing its lock, so it is never retried).
  const writable = await Promise.race([query.writable(), refused]);
  async function* lines() {
    let batch = "";
    for (const row of rows) {
      batch += encodeCsvLine(row);
      if (batch.length > 1 << 20) {
        yield batch;
        batch = "";
      }
    }
    if (batch) yield batch;
  }
  try {
    await Promise.race([pipeline(Readable.from(lines()), writable), refused]);
  } catch (error) {
    writable.destroy();
    throw error;
  }
}

/** The part of a postgres-js query object that copyRows relies on (not in its public types). */
interface DriverQuery {
  reject: (error: unknown) => void;
}

/**
 * postgres-js (3.4) resolves a COPY query with its stream, and when PostgreSQL refuses the data
 * after the last row (a duplicate key, a bad value) or the connection drops, it only calls the
 * query's reject, which no longer settles anything: the stream never finishes and the caller
 * would wait forever. This hooks that reject into a promise that rejects with the error.
 * tests/integration/db/copy-rows.test.ts holds it to that, so an upgrade that changes it fails.
 */
function observeRefusal(query: DriverQuery): Promise<never> {
  const original = query.reject;
  return new Promise<never>((_, reject) => {
    query.reject = (error: unknown) => {
      reject(error);
      original(error);
    };
  });
}
