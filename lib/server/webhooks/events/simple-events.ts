import { z } from "zod";

import { dispositionKinds } from "@/db/schema/reviews";

import { createEnvelope, type WebhookEnvelope } from "./event-types";

export interface ScheduleFailedData {
  scheduleId: string;
  name: string | null;
  status: "failed";
  /** Why the check stopped (docs/glossary.md, "Failure reason"). */
  failureReason: string;
}

export function buildScheduleFailedEvent(input: { scheduleId: string; name: string | null; reason: string; occurredAt: Date }): WebhookEnvelope<ScheduleFailedData> {
  return createEnvelope("schedule.failed", input.occurredAt, { scheduleId: input.scheduleId, name: input.name, status: "failed", failureReason: input.reason });
}

/** What the review flow writes to the outbox for member.dispositioned (lib/server/review). */
export const memberDispositionedPayloadSchema = z.object({
  /** The disposition's public id, `dsp_...`. */
  dispositionId: z.string().min(1),
  scheduleId: z.string().min(1),
  /** The schedule's reference, when it has one: revisions of one schedule share it. */
  reference: z.string().nullable().default(null),
  mark: z.string().min(1),
  disposition: z.enum(dispositionKinds),
  /** The person's display name (or the API key's label); never an e-mail or an id that reveals an account. */
  by: z.string().min(1),
  /** The written justification or context; always present for accepted_with_justification. */
  note: z.string().nullable().default(null),
  decidedAt: z.string().min(1),
  /** Shared by every disposition one bulk action recorded; null for a single one. */
  bulkId: z.string().nullable().default(null),
});
export type MemberDispositionedPayload = z.input<typeof memberDispositionedPayloadSchema>;
export type MemberDispositionedData = z.infer<typeof memberDispositionedPayloadSchema> & { memberUrl: string };

/** member.dispositioned: the stored payload plus the member's API address. */
export function buildMemberDispositionedEvent(input: MemberDispositionedPayload & { occurredAt: Date; appUrl: string }): WebhookEnvelope<MemberDispositionedData> {
  const { occurredAt, appUrl, ...data } = input;
  const parsed = memberDispositionedPayloadSchema.parse(data);
  const memberUrl = new URL(`/api/v1/schedules/${encodeURIComponent(parsed.scheduleId)}/members/${encodeURIComponent(parsed.mark)}`, appUrl).toString();
  return createEnvelope("member.dispositioned", occurredAt, { ...parsed, memberUrl });
}

export interface WebhookTestData {
  endpointId: string;
  message: string;
}

export function buildWebhookTestEvent(input: { endpointId: string; occurredAt: Date }): WebhookEnvelope<WebhookTestData> {
  return createEnvelope("webhook.test", input.occurredAt, {
    endpointId: input.endpointId,
    message: "A test event from Sagline. If your receiver verified its signature, the endpoint is set up.",
  });
}
