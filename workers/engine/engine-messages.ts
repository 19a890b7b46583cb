import type { ScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";
import type { Outcome } from "@/lib/server/schedules/check-chunk";

/** A chunk for an engine thread: the members travel as the JSON text PostgreSQL stored. */
export type EngineTask = { taskId: number; header: Record<string, unknown>; firstMember: number; membersJson: string; criteria: ScheduleCriteria | null };

export type EngineReply = { taskId: number; ok: true; outcomes: Outcome[] } | { taskId: number; ok: false; message: string };
