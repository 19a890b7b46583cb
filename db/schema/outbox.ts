import { index, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";

/**
 * Events written in the same transaction as the change they describe (transactional outbox), so a
 * completed schedule's event survives any crash. Webhook delivery and e-mail consume it.
 */
export const outboxEvents = pgTable(
  "outbox_events",
  {
    /** Public event id, `evt_...`; also the webhook-id of every delivery of this event. */
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    /** Dotted lowercase event name, e.g. `schedule.completed`. */
    type: text().notNull(),
    payload: jsonb().notNull(),
    /** Set once the dispatcher has fanned the event out to deliveries. */
    dispatchedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("outbox_events_dispatched_at_created_at_idx").on(t.dispatchedAt, t.createdAt)],
);
