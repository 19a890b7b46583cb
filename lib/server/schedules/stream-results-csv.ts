import { getSortKey, listResultPage } from "@/db/queries/results";

import { formatResultCsvLine, RESULT_CSV_CAUTION_LINE, RESULT_CSV_HEADER } from "./represent";
import type { ResultQuery } from "./result-query";

/** Rows read per query while streaming: memory stays flat whatever the schedule's size. */
const STREAM_BATCH_ROWS = 2000;

/**
 * The results as CSV text, streamed batch by batch through the query's keyset ordering (linear
 * time, constant memory), at most `limit` rows, ending with the caution line.
 */
export function streamResultsCsv(scheduleId: string, query: ResultQuery, options: { limit: number; withHeader: boolean }): ReadableStream<Uint8Array> {
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
        if (options.withHeader) text += `${RESULT_CSV_HEADER.join(",")}\r\n`;
      }
      const { rows, hasMore } = remaining > 0 ? await listResultPage(scheduleId, { sort: query.sort, filters: query.filters, limit: Math.min(STREAM_BATCH_ROWS, remaining), position }) : { rows: [], hasMore: false };
      for (const row of rows) text += `${formatResultCsvLine(row)}\r\n`;
      remaining -= rows.length;
      const last = rows.at(-1);
      if (hasMore && last && remaining > 0) {
        position = { sort: query.sort, key: getSortKey(last, query.sort), index: last.memberIndex, back: false, page: 1 };
      } else {
        text += `${RESULT_CSV_CAUTION_LINE}\r\n`;
        done = true;
      }
      controller.enqueue(encoder.encode(text));
      if (done) controller.close();
    },
  });
}
