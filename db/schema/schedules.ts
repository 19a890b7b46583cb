import { sql } from "drizzle-orm";
import { bigint, boolean, doublePrecision, index, integer, json, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";

import { organizations, projects } from "./organizations";
import { users } from "./users";

export const scheduleStatuses = ["received", "queued", "checking", "completed", "failed"] as const;
export type ScheduleStatus = (typeof scheduleStatuses)[number];

export const schedules = pgTable(
  "schedules",
  {
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    projectId: text().references(() => projects.id, { onDelete: "set null" }),
    name: text().notNull(),
    reference: text(),
    status: text({ enum: scheduleStatuses }).notNull().default("received"),
    failureReason: text(),
    /** "api-json", "api-csv", "upload" */
    source: text().notNull(),
    submittedByUserId: text().references(() => users.id, { onDelete: "set null" }),
    /** The API key that submitted it, when one did (api_keys.id). */
    apiKeyId: text(),
    /** A registered webhook endpoint of the organization to report to (webhook_endpoints.id). */
    callbackEndpointId: text(),
    /** The resolved limit profile every member is checked against. */
    profile: jsonb().notNull(),
    /** The schedule-level part of the submitted document (format, units, limits); workers re-read members with it. */
    header: jsonb().notNull(),
    memberCount: integer().notNull(),
    chunkCount: integer().notNull(),
    // Totals written once, when the schedule ends; while it runs, db/queries/schedules.ts sums its
    // chunks instead, so concurrent chunks never queue on this row.
    chunksDone: integer().notNull().default(0),
    checkedCount: integer().notNull().default(0),
    passCount: integer().notNull().default(0),
    failCount: integer().notNull().default(0),
    errorCount: integer().notNull().default(0),
    queuedAt: timestamp({ withTimezone: true }),
    completedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("schedules_organization_id_created_at_idx").on(t.organizationId, t.createdAt, t.id),
    index("schedules_status_idx").on(t.status).where(sql`${t.status} not in ('completed', 'failed')`),
  ],
);

/**
 * A member's overall result: written once per member (the primary key is the guard). Result tables
 * carry no foreign key: a per-row key check would cost more than the COPY that writes them; rows
 * are written only by checkChunk for a schedule it has locked, and deleted with it.
 */
export const memberOutcomes = pgTable(
  "member_outcomes",
  {
    scheduleId: text().notNull(),
    memberIndex: integer().notNull(),
    mark: text().notNull(),
    category: text().notNull(),
    pass: boolean().notNull(),
    governingCheck: text(),
    utilization: doublePrecision(),
    factorOfSafety: doublePrecision(),
    /** The governing deflection check's limit l/N and achieved l/N; null when the frequency governs or there is none. */
    limitRatio: doublePrecision(),
    achievedRatio: doublePrecision(),
    /**
     * Engine output beyond the checks: frequency, suggestion, or the error; null when there is
     * none (most passing members). json: written often, never queried inside.
     */
    detail: json(),
    /** The member's section and material as named in the schedule (catalogue name or "custom" label), for the results table. */
    section: text(),
    material: text(),
    quantity: integer(),
    /** Span lengths, mm, left to right. */
    spansMm: doublePrecision().array(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.scheduleId, t.memberIndex] }),
    // Only failing members: the "fail" filter reads it; indexing every member cost more to write.
    index("member_outcomes_schedule_id_failing_idx").on(t.scheduleId, t.memberIndex).where(sql`not ${t.pass}`),
    // Only errored members (a handful): the "error" filter reads it.
    index("member_outcomes_schedule_id_error_idx").on(t.scheduleId, t.memberIndex).where(sql`(${t.detail} ->> 'error') is not null`),
    // The results table's two deep orderings, each read as a keyset (db/queries/results.ts writes
    // the same expressions): highest utilization first, errors (no utilization) last; marks
    // case-insensitively in code-point order, so a mark prefix is one index range. Each index
    // costs about 1 s more per 100,000 rows written by COPY (README, bench:dashboard), so category
    // has none: its ordering is a top-N sort of the schedule's rows, bounded by its size.
    index("member_outcomes_schedule_id_utilization_idx").on(t.scheduleId, sql`coalesce(-${t.utilization}, 'Infinity'::float8)`, t.memberIndex),
    index("member_outcomes_schedule_id_mark_idx").on(t.scheduleId, sql`lower(${t.mark}) collate "C"`, t.memberIndex),
  ],
);

/** One row per member, combination and span: exactly one result per member and check. */
export const memberChecks = pgTable(
  "member_checks",
  {
    scheduleId: text().notNull(),
    memberIndex: integer().notNull(),
    checkKey: text().notNull(),
    combinationId: text().notNull(),
    spanIndex: integer().notNull(),
    spanKind: text().notNull(),
    deflectionMm: doublePrecision().notNull(),
    atMm: doublePrecision().notNull(),
    allowedMm: doublePrecision().notNull(),
    utilization: doublePrecision().notNull(),
    factorOfSafety: doublePrecision(),
    pass: boolean().notNull(),
    /** Limit l/N the check used and achieved l/N (null for zero deflection); null on rows written before they were stored. */
    limitRatio: doublePrecision(),
    achievedRatio: doublePrecision(),
  },
  (t) => [primaryKey({ columns: [t.scheduleId, t.memberIndex, t.checkKey] })],
);

/**
 * Work units of a schedule, each holding its members as submitted; done flips once, so progress
 * never double counts a retried chunk. Members are stored per chunk, not per row: one row per
 * member cost more to write (and index) than checking it, and workers read a chunk at a time.
 */
export const scheduleChunks = pgTable(
  "schedule_chunks",
  {
    scheduleId: text()
      .notNull()
      .references(() => schedules.id, { onDelete: "cascade" }),
    chunkIndex: integer().notNull(),
    firstMember: integer().notNull(),
    memberCount: integer().notNull(),
    /** The members' marks in order: a member's page finds its chunk and position by mark. */
    marks: text().array().notNull(),
    /**
     * The members in order: a JSON array, public format as submitted. text, not json: the server
     * wrote it with JSON.stringify, and having PostgreSQL validate 28 MB again cost more than the
     * rest of storing it. Read back with JSON.parse, or cast to json for one member.
     */
    members: text().notNull(),
    doneAt: timestamp({ withTimezone: true }),
    attempts: integer().notNull().default(0),
    /** Outcome counts of the chunk's members, written with done_at. */
    passCount: integer().notNull().default(0),
    failCount: integer().notNull().default(0),
    errorCount: integer().notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.scheduleId, t.chunkIndex] })],
);

/** IETF Idempotency-Key draft: scoped to the organization, expiring, replaying the first answer. */
export const idempotencyKeys = pgTable(
  "idempotency_keys",
  {
    id: bigint({ mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    key: text().notNull(),
    requestHash: text().notNull(),
    state: text({ enum: ["in_flight", "completed"] }).notNull(),
    /** While in flight: who holds the key, and until when (a retry may take over after that). */
    leaseToken: text(),
    leaseExpiresAt: timestamp({ withTimezone: true }),
    responseStatus: integer(),
    responseBody: jsonb(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("idempotency_keys_organization_id_key_idx").on(t.organizationId, t.key),
    // The scheduled purge deletes by expiry.
    index("idempotency_keys_expires_at_idx").on(t.expiresAt),
  ],
);
