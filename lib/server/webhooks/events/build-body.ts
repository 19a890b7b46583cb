import { asc, eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { readStoredNotes } from "@/db/queries/schedules";
import { memberOutcomes, schedules } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { createResultDownloadLinks } from "@/lib/server/schedules/result-download-link";
import { getOutcome } from "@/lib/vocabulary";

import { allEventTypes, createEnvelope, type EventType } from "./event-types";
import { buildScheduleCompletedEvent, RESULT_ROWS_CAP } from "./schedule-completed";
import { buildMemberDispositionedEvent, buildScheduleFailedEvent, buildWebhookTestEvent, memberDispositionedPayloadSchema } from "./simple-events";

export interface OutboxEventRow {
  id: string;
  organizationId: string;
  type: string;
  payload: unknown;
  createdAt: Date;
}

/** The event cannot be turned into a body; retrying may help only if the data appears later. */
export class EventBodyError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EventBodyError";
  }
}

function readScheduleId(payload: unknown): string | null {
  const value = (payload as { scheduleId?: unknown } | null)?.scheduleId;
  return typeof value === "string" ? value : null;
}

async function loadSchedule(organizationId: string, scheduleId: string) {
  const [schedule] = await getDb().select().from(schedules).where(eq(schedules.id, scheduleId));
  return schedule && schedule.organizationId === organizationId ? schedule : null;
}

/**
 * The JSON body of an event, built from the outbox row and the results it points at. Completed
 * results never change, so every retry of an event sends the same body (with a fresh timestamp
 * header). The body carries ids and results, never a secret.
 */
export async function buildEventBody(event: OutboxEventRow): Promise<string> {
  const occurredAt = event.createdAt;
  const type = event.type as EventType;
  if (!allEventTypes.includes(type)) return JSON.stringify({ type: event.type, timestamp: occurredAt.toISOString(), data: event.payload });
  switch (type) {
    case "schedule.completed": {
      const scheduleId = readScheduleId(event.payload);
      const schedule = scheduleId ? await loadSchedule(event.organizationId, scheduleId) : null;
      if (!schedule) throw new EventBodyError(`could not build the event: schedule ${scheduleId ?? "(none)"} was not found`);
      const rows = await getDb()
        .select({
          mark: memberOutcomes.mark,
          governingCheck: memberOutcomes.governingCheck,
          utilization: memberOutcomes.utilization,
          factorOfSafety: memberOutcomes.factorOfSafety,
          limitRatio: memberOutcomes.limitRatio,
          achievedRatio: memberOutcomes.achievedRatio,
          pass: memberOutcomes.pass,
          detail: memberOutcomes.detail,
        })
        .from(memberOutcomes)
        .where(eq(memberOutcomes.scheduleId, schedule.id))
        // Failing and errored members (pass = false) before passing ones, each in member order.
        .orderBy(asc(memberOutcomes.pass), asc(memberOutcomes.memberIndex))
        .limit(RESULT_ROWS_CAP + 1);
      const withNotes = rows.map(({ detail, pass, ...row }) => {
        const stored = detail as { notes?: unknown; error?: unknown } | null;
        const error = typeof stored?.error === "string" && stored.error !== "" ? stored.error : null;
        return { ...row, status: getOutcome({ pass, error }), ...(error === null ? {} : { failureReason: error }), notes: readStoredNotes(stored?.notes) };
      });
      const env = getEnv();
      const download = createResultDownloadLinks({ organizationId: schedule.organizationId, scheduleId: schedule.id, occurredAt, appUrl: env.APP_URL, secret: env.NEXTAUTH_SECRET });
      return JSON.stringify(buildScheduleCompletedEvent({ schedule, rows: withNotes, appUrl: env.APP_URL, occurredAt, download }));
    }
    case "schedule.failed": {
      const scheduleId = readScheduleId(event.payload) ?? "";
      const schedule = scheduleId ? await loadSchedule(event.organizationId, scheduleId) : null;
      const reason = (event.payload as { reason?: unknown }).reason;
      return JSON.stringify(
        buildScheduleFailedEvent({
          scheduleId,
          name: schedule?.name ?? null,
          reason: typeof reason === "string" && reason ? reason : (schedule?.failureReason ?? "unknown"),
          occurredAt,
        }),
      );
    }
    case "member.dispositioned": {
      const parsed = memberDispositionedPayloadSchema.safeParse(event.payload);
      if (!parsed.success) throw new EventBodyError(`could not build the event: the member.dispositioned payload is malformed (${parsed.error.issues.map((i) => i.path.join(".")).join(", ")})`);
      return JSON.stringify(buildMemberDispositionedEvent({ ...parsed.data, occurredAt, appUrl: getEnv().APP_URL }));
    }
    case "webhook.test": {
      const endpointId = (event.payload as { endpointId?: unknown }).endpointId;
      return JSON.stringify(buildWebhookTestEvent({ endpointId: typeof endpointId === "string" ? endpointId : "", occurredAt }));
    }
  }
  return JSON.stringify(createEnvelope(type, occurredAt, event.payload));
}
