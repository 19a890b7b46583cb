/** Events an endpoint can subscribe to. webhook.test goes only to the endpoint it was sent to. */
export const subscribableEventTypes = ["schedule.completed", "schedule.failed", "member.dispositioned"] as const;
export type SubscribableEventType = (typeof subscribableEventTypes)[number];

export const allEventTypes = [...subscribableEventTypes, "webhook.test"] as const;
export type EventType = (typeof allEventTypes)[number];

export const eventTypeDescriptions: Record<EventType, string> = {
  "schedule.completed": "A schedule finished checking: counts and the pass/fail table",
  "schedule.failed": "A schedule could not be checked, with the reason",
  "member.dispositioned": "An engineer dispositioned a member in review",
  "webhook.test": "Sent from the console to try an endpoint",
};

/** The Standard Webhooks body: the event's type, when it happened, and its data. */
export interface WebhookEnvelope<T> {
  type: EventType;
  timestamp: string;
  data: T;
}

export function createEnvelope<T>(type: EventType, at: Date, data: T): WebhookEnvelope<T> {
  return { type, timestamp: at.toISOString(), data };
}
