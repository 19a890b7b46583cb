import { z } from "zod";

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

/** What the review flow writes to the outbox for member.dispositioned. */
export const memberDispositionedPayloadSchema = z.object({
  scheduleId: z.string().min(1),
  mark: z.string().min(1),
  disposition: z.string().min(1),
  /** The person's display name; never an e-mail or an id that reveals an account. */
  by: z.string().min(1),
  note: z.string().nullable().default(null),
});
export type MemberDispositionedData = z.infer<typeof memberDispositionedPayloadSchema>;

export function buildMemberDispositionedEvent(input: MemberDispositionedData & { occurredAt: Date }): WebhookEnvelope<MemberDispositionedData> {
  const { occurredAt, ...data } = input;
  return createEnvelope("member.dispositioned", occurredAt, memberDispositionedPayloadSchema.parse(data));
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
