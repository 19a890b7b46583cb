import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";

import type { Sql, TransactionSql } from "postgres";

type Cell = string | number | boolean | null;

// CSV as COPY reads it: every non-null value quoted, quotes doubled; an unquoted empty field is NULL.
function toCsvLine(row: readonly Cell[]): string {
  return (
    row
      .map((cell) => (cell === null ? "" : `"${String(cell).replaceAll('"', '""')}"`))
      .join(",") + "\n"
  );
}

/**
 * Bulk-writes rows with PostgreSQL COPY (never a loop of single inserts). Runs inside the given
 * transaction, so a failure writes nothing.
 */
export async function copyRows(sql: Sql | TransactionSql, table: string, columns: readonly string[], rows: Iterable<readonly Cell[]>): Promise<void> {
  const writable = await sql.unsafe(`copy ${table} (${columns.join(", ")}) from stdin with (format csv)`).writable();
  async function* lines() {
    let batch = "";
    for (const row of rows) {
      batch += toCsvLine(row);
      if (batch.length > 1 << 20) {
        yield batch;
        batch = "";
      }
    }
    if (batch) yield batch;
  }
  await pipeline(Readable.from(lines()), writable);
}
