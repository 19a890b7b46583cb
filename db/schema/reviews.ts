import { sql } from "drizzle-orm";
import { bigint, doublePrecision, index, integer, pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";
import { schedules } from "./schedules";
import { users } from "./users";

/** What an engineer decided about a member that did not pass. Sagline's own names. */
export const dispositionKinds = ["accepted_with_justification", "member_to_be_revised", "information_requested"] as const;
export type DispositionKind = (typeof dispositionKinds)[number];

/** A reviewable member's current state: awaiting review until a disposition is recorded. */
export const reviewStates = ["awaiting_review", ...dispositionKinds] as const;
export type ReviewState = (typeof reviewStates)[number];

/**
 * One row per member that did not pass (failed or errored), written in the same transaction as its
 * outcome, so the queue is complete whenever results are. It carries the few columns the queue
 * filters and sorts on across schedules, so the queue never scans result tables.
 */
export const memberReviews = pgTable(
  "member_reviews",
  {
    scheduleId: text()
      .notNull()
      .references(() => schedules.id, { onDelete: "cascade" }),
    memberIndex: integer().notNull(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    projectId: text(),
    /** The schedule's reference, copied: a later submission of the same reference finds earlier reviews by it. */
    reference: text(),
    mark: text().notNull(),
    category: text().notNull(),
    /** "fail" or "error": errored members need review as much as failed ones. */
    outcome: text({ enum: ["fail", "error"] }).notNull(),
    governingCheck: text(),
    /** Null for errored members; sorts last. */
    utilization: doublePrecision(),
    /**
     * SHA-256 of what the member was checked with (its input as submitted, the schedule's units and
     * limits, the resolved limit profile): equal hashes under the same reference mean an unchanged
     * member, whose earlier dispositions are shown as carried over.
     */
    inputHash: text(),
    state: text({ enum: reviewStates }).notNull().default("awaiting_review"),
    /** The disposition that set `state`; null while awaiting review. */
    latestDispositionId: bigint({ mode: "number" }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.scheduleId, t.memberIndex] }),
    index("member_reviews_queue_utilization_idx")
      .on(t.organizationId, t.utilization.desc().nullsLast(), t.scheduleId, t.memberIndex)
      .where(sql`${t.state} = 'awaiting_review'`),
    index("member_reviews_queue_age_idx")
      .on(t.organizationId, t.createdAt, t.scheduleId, t.memberIndex)
      .where(sql`${t.state} = 'awaiting_review'`),
    index("member_reviews_schedule_state_idx").on(t.scheduleId, t.state, t.memberIndex),
    index("member_reviews_carry_over_idx").on(t.organizationId, t.reference, t.mark, t.inputHash).where(sql`${t.reference} is not null`),
  ],
);

/**
 * The append-only record of decisions: who, when, what and why. Rows are never updated or deleted
 * except with their schedule; a later decision on the same member is a new row.
 */
export const memberDispositions = pgTable(
  "member_dispositions",
  {
    id: bigint({ mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    scheduleId: text()
      .notNull()
      .references(() => schedules.id, { onDelete: "cascade" }),
    memberIndex: integer().notNull(),
    mark: text().notNull(),
    kind: text({ enum: dispositionKinds }).notNull(),
    /** Required for accepted_with_justification; optional context otherwise. */
    justification: text(),
    decidedByUserId: text().references(() => users.id, { onDelete: "set null" }),
    /** Kept as text so the record survives the user's removal. */
    decidedByName: text().notNull(),
    /** The API key that recorded it, when one did (api_keys.id). */
    decidedByApiKeyId: text(),
    /** Set when one bulk action recorded several dispositions. */
    bulkId: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("member_dispositions_schedule_member_idx").on(t.scheduleId, t.memberIndex, t.id)],
);

/** How often an engineer wants the digest of schedules that completed with failures. */
export const digestFrequencies = ["immediate", "daily", "none"] as const;
export type DigestFrequency = (typeof digestFrequencies)[number];

export const reviewDigestPreferences = pgTable(
  "review_digest_preferences",
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    frequency: text({ enum: digestFrequencies }).notNull().default("immediate"),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.organizationId] })],
);

/**
 * Which schedule each person has had in a digest e-mail: one row per person and schedule, written
 * in the transaction that sends, so a schedule is in exactly one of a person's digests (at least
 * once: a crash between sending and committing can repeat one).
 */
export const reviewDigestSends = pgTable(
  "review_digest_sends",
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    scheduleId: text()
      .notNull()
      .references(() => schedules.id, { onDelete: "cascade" }),
    frequency: text({ enum: digestFrequencies }).notNull(),
    sentAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.scheduleId] }), index("review_digest_sends_user_id_sent_at_idx").on(t.userId, t.sentAt)],
);
