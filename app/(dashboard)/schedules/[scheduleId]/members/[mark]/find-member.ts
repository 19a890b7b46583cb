import { cache } from "react";

import { getSchedule } from "@/db/queries/schedules";

// Next passes the segment percent-encoded; a malformed escape is simply a mark that does not exist.
export function decodeMark(segment: string): string | null {
  try {
    return decodeURIComponent(segment);
  } catch {
    return null;
  }
}

/** The layout, the title and the page read the same schedule once per request. */
export const findSchedule = cache(async (organizationId: string, scheduleId: string) => getSchedule(organizationId, scheduleId));
