import { getSortKey, listResultPage, type ResultPageRow } from "@/db/queries/results";

import { formatResultCsvLine, representResult, RESULT_CSV_CAUTION_LINE, RESULT_CSV_HEADER } from "./represent";
import type { ResultQuery } from "./result-query";

/** Rows read per query while streaming: memory stays flat whatever the schedule's size. */
const STREAM_BATCH_ROWS = 2000;

/**
 * The results as CSV text, streamed batch by batch through the query's keyset ordering (linear
 * time, constant memory), at most `limit` rows, ending with the caution line.
 */
export function streamResultsCsv(scheduleId: string, query: ResultQuery, options: { limit: number; withHeader: boolean }): ReadableStream<Uint8Array> {
  return streamResultLines(scheduleId, query, {
    limit: options.limit,
    first: options.withHeader ? `${RESULT_CSV_HEADER.join(",")}\r\n` : "",
    formatRow: (row) => `${formatResultCsvLine(row)}\r\n`,
    last: `${RESULT_CSV_CAUTION_LINE}\r\n`,
  });
}

/** The results as NDJSON, one results-page row per line, streamed the same way (no caution line: it is not a row). */
export function streamResultsNdjson(scheduleId: string, query: ResultQuery, options: { limit: number }): ReadableStream<Uint8Array> {
  return streamResultLines(scheduleId, query, { limit: options.limit, first: "", formatRow: (row) => `${JSON.stringify(representResult(row))}\n`, last: "" });
}

function streamResultLines(
  scheduleId: string,
  query: ResultQuery,
  options: { limit: number; first: string; formatRow: (row: ResultPageRow) => string; last: string },
): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  let position = query.position;
  let remaining = options.limit;
  let started = false;
  let done = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (done) return;
      let text = "";
      if (!started) {
        started = true;
        text += options.first;
      }
      const { rows, hasMore } = remaining > 0 ? await listResultPage(scheduleId, { sort: query.sort, filters: query.filters, limit: Math.min(STREAM_BATCH_ROWS, remaining), position }) : { rows: [], hasMore: false };
      for (const row of rows) text += options.formatRow(row);
      remaining -= rows.length;
      const last = rows.at(-1);
      if (hasMore && last && remaining > 0) {
        position = { sort: query.sort, key: getSortKey(last, query.sort), index: last.memberIndex, back: false, page: 1 };
      } else {
        text += options.last;
        done = true;
      }
      controller.enqueue(encoder.encode(text));
      if (done) controller.close();
    },
  });
}
