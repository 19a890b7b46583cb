import { sql } from "drizzle-orm";
import { bigint, boolean, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";
import { outboxEvents } from "./outbox";

export const endpointDisabledReasons = ["manual", "gone", "failing"] as const;
export type EndpointDisabledReason = (typeof endpointDisabledReasons)[number];

/**
 * A partner's receiver. The signing secret is stored as issued (`whsec_...`): HMAC signing needs
 * the raw key, so a hash would not do; the database is the trust boundary (see README, Webhooks).
 * During a rotation the previous secret keeps signing until previousSecretExpiresAt.
 */
export const webhookEndpoints = pgTable(
  "webhook_endpoints",
  {
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    url: text().notNull(),
    description: text().notNull().default(""),
    /** Dotted lowercase event names this endpoint receives. */
    eventTypes: jsonb().$type<string[]>().notNull(),
    enabled: boolean().notNull().default(true),
    disabledReason: text({ enum: endpointDisabledReasons }),
    disabledAt: timestamp({ withTimezone: true }),
    secret: text().notNull(),
    previousSecret: text(),
    previousSecretExpiresAt: timestamp({ withTimezone: true }),
    /** Deliveries that ended dead in a row; any success resets it. */
    consecutiveFailedDeliveries: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("webhook_endpoints_organization_id_created_at_idx").on(t.organizationId, t.createdAt)],
);

export const deliveryStatuses = ["pending", "succeeded", "failed", "dead"] as const;
export type DeliveryStatus = (typeof deliveryStatuses)[number];

/**
 * One event for one endpoint, with its current state. The unique (event, endpoint) pair makes
 * dispatch idempotent. "failed" means the last attempt failed and another is scheduled; "dead"
 * means no further attempt will be made unless someone resends it.
 */
export const webhookDeliveries = pgTable(
  "webhook_deliveries",
  {
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    eventId: text()
      .notNull()
      .references(() => outboxEvents.id, { onDelete: "cascade" }),
    endpointId: text()
      .notNull()
      .references(() => webhookEndpoints.id, { onDelete: "cascade" }),
    eventType: text().notNull(),
    status: text({ enum: deliveryStatuses }).notNull().default("pending"),
    /** Attempts made so far, over every (re)send. Attempt numbers are 1-based and never reused. */
    attemptCount: integer().notNull().default(0),
    /** Attempts made since the delivery was last (re)sent: the position in the retry schedule. */
    roundAttempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }),
    lastStatusCode: integer(),
    lastError: text(),
    succeededAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("webhook_deliveries_event_id_endpoint_id_idx").on(t.eventId, t.endpointId),
    index("webhook_deliveries_organization_id_created_at_idx").on(t.organizationId, t.createdAt),
    index("webhook_deliveries_endpoint_id_created_at_idx").on(t.endpointId, t.createdAt),
    index("webhook_deliveries_status_next_attempt_at_idx")
      .on(t.status, t.nextAttemptAt)
      .where(sql`${t.status} in ('pending', 'failed')`),
  ],
);

/** Every HTTP attempt, as the receiver answered it (response body truncated). */
export const webhookAttempts = pgTable(
  "webhook_attempts",
  {
    id: bigint({ mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    deliveryId: text()
      .notNull()
      .references(() => webhookDeliveries.id, { onDelete: "cascade" }),
    attemptNumber: integer().notNull(),
    statusCode: integer(),
    latencyMs: integer().notNull(),
    responseBody: text(),
    error: text(),
    /** What happened: "succeeded", "failed" (will retry), "dead", "gone". */
    outcome: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("webhook_attempts_delivery_id_attempt_number_idx").on(t.deliveryId, t.attemptNumber)],
);
