import { getSchedule } from "@/db/queries/schedules";
import { getEnv } from "@/lib/env";
import { MAX_MEMBERS } from "@/lib/engine/intake";
import { assertFound } from "@/lib/server/errors";

import { readResultDownloadToken } from "./result-download-link";
import { streamResultsCsv, streamResultsNdjson } from "./stream-results-csv";

/**
 * The full result table behind a signed download link, as CSV (the export's columns) or NDJSON
 * (one results-page row per line). The token is the only credential: it names the organization,
 * the schedule and the format, and it expires (result-download-link.ts).
 */
export async function downloadResults(token: string, now: Date): Promise<Response> {
  const claims = readResultDownloadToken(token, getEnv().NEXTAUTH_SECRET, now);
  const schedule = assertFound(await getSchedule(claims.organizationId, claims.scheduleId), "The schedule");
  // Streamed in keyset batches like the dashboard's export: memory stays flat at any size.
  const query = { sort: "schedule" as const, filters: {} };
  const headers = {
    "cache-control": "no-store",
    "referrer-policy": "no-referrer",
    "x-schedule-status": schedule.status,
    "content-disposition": `attachment; filename="${schedule.id}-results.${claims.format}"`,
  };
  if (claims.format === "csv") {
    return new Response(streamResultsCsv(schedule.id, query, { limit: MAX_MEMBERS, withHeader: true }), { headers: { ...headers, "content-type": "text/csv; charset=utf-8" } });
  }
  return new Response(streamResultsNdjson(schedule.id, query, { limit: MAX_MEMBERS }), { headers: { ...headers, "content-type": "application/x-ndjson; charset=utf-8" } });
}
