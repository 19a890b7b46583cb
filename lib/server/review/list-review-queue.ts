import { getSql } from "@/db/client";
import type { ReviewState } from "@/db/schema";
import { decodeCursor, encodeCursor } from "@/lib/server/http/cursor";

import { readCarriedOver, type CarriedOver } from "./carried-over";
import type { QueueQuery, QueueSort } from "./queue-filters";
import { queueWhere, timestampKey } from "./queue-sql";

export interface QueueRow {
  scheduleId: string;
  scheduleName: string;
  reference: string | null;
  projectId: string | null;
  projectName: string | null;
  memberIndex: number;
  mark: string;
  category: string;
  outcome: "fail" | "error";
  governingCheck: string | null;
  utilization: number | null;
  state: ReviewState;
  /** When the member entered the queue (its outcome was written). */
  queuedAt: string;
  /** The latest disposition of the same member, unchanged, in an earlier submission of the same reference; shown, never applied. */
  carriedOver: CarriedOver | null;
}

export interface QueuePage {
  rows: QueueRow[];
  nextCursor: string | null;
}

/** A cursor names its sort: a cursor from another ordering is refused rather than misread. */
type Position = { sort: QueueSort; key: string | number | null; s: string; i: number };
const TIMESTAMP_KEY = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}Z$/;

function isPosition(sort: QueueSort) {
  return (v: unknown): v is Position => {
    if (typeof v !== "object" || v === null) return false;
    const p = v as Record<string, unknown>;
    const keyOk = sort === "utilization" ? p.key === null || (typeof p.key === "number" && Number.isFinite(p.key)) : typeof p.key === "string" && TIMESTAMP_KEY.test(p.key);
    return p.sort === sort && keyOk && typeof p.s === "string" && /^sch_[0-9a-z]{1,40}$/.test(p.s) && Number.isSafeInteger(p.i) && (p.i as number) >= 0 && (p.i as number) < 2 ** 31;
  };
}

export const QUEUE_MAX_LIMIT = 200;
/** Rows per page of the dashboard's queue (the page and its live refresh read the same page). */
export const REVIEW_PAGE_SIZE = 50;

/**
 * One page of the review queue of an organization: filtered, in one of three orders, keyset
 * paginated on (sort key, schedule id, member index) so a deep page costs what the first does.
 */
export async function listReviewQueue(organizationId: string, query: QueueQuery, options: { limit: number; cursor?: string | null }): Promise<QueuePage> {
  const sql = getSql();
  const limit = Math.min(Math.max(1, options.limit), QUEUE_MAX_LIMIT);
  const after = options.cursor ? decodeCursor(options.cursor, isPosition(query.sort)) : undefined;

  const order = {
    utilization: sql`r.utilization desc nulls last, r.schedule_id, r.member_index`,
    age: sql`r.created_at, r.schedule_id, r.member_index`,
    schedule: sql`s.created_at desc, r.schedule_id, r.member_index`,
  }[query.sort];
  const sortKey = {
    utilization: sql`r.utilization`,
    age: sql.unsafe(timestampKey("r.created_at")),
    schedule: sql.unsafe(timestampKey("s.created_at")),
  }[query.sort];
  const keyset = !after
    ? sql``
    : query.sort === "utilization"
      ? after.key === null
        ? sql`and r.utilization is null and (r.schedule_id, r.member_index) > (${after.s}, ${after.i})`
        : sql`and (r.utilization < ${after.key} or r.utilization is null or (r.utilization = ${after.key} and (r.schedule_id, r.member_index) > (${after.s}, ${after.i})))`
      : query.sort === "age"
        ? sql`and (r.created_at, r.schedule_id, r.member_index) > (${after.key}::timestamptz, ${after.s}, ${after.i})`
        : sql`and (s.created_at < ${after.key}::timestamptz or (s.created_at = ${after.key}::timestamptz and (r.schedule_id, r.member_index) > (${after.s}, ${after.i})))`;

  const rows = await sql`
    select r.schedule_id, s.name as schedule_name, s.reference, r.project_id, p.name as project_name, r.member_index, r.mark, r.category,
      r.outcome, r.governing_check, r.utilization, r.state, ${sql.unsafe(timestampKey("r.created_at"))} as queued_at, ${sortKey} as sort_key,
      r.reference as review_reference, r.input_hash
    from member_reviews r
    join schedules s on s.id = r.schedule_id
    left join projects p on p.id = r.project_id
    where ${queueWhere(sql, organizationId, query)} ${keyset}
    order by ${order}
    limit ${limit + 1}`;
  const page = rows.slice(0, limit);
  const carried = await readCarriedOver(
    organizationId,
    page.map((r) => ({ scheduleId: r.schedule_id as string, mark: r.mark as string, reference: r.review_reference as string | null, inputHash: r.input_hash as string | null, queuedAt: r.queued_at as string })),
  );
  const last = page.at(-1);
  return {
    rows: page.map((r, index) => ({
      scheduleId: r.schedule_id as string,
      scheduleName: r.schedule_name as string,
      reference: (r.reference as string | null) ?? null,
      projectId: (r.project_id as string | null) ?? null,
      projectName: (r.project_name as string | null) ?? null,
      memberIndex: r.member_index as number,
      mark: r.mark as string,
      category: r.category as string,
      outcome: r.outcome as "fail" | "error",
      governingCheck: (r.governing_check as string | null) ?? null,
      utilization: (r.utilization as number | null) ?? null,
      state: r.state as ReviewState,
      queuedAt: r.queued_at as string,
      carriedOver: carried[index] ?? null,
    })),
    nextCursor:
      rows.length > limit && last
        ? encodeCursor({ sort: query.sort, key: (last.sort_key as string | number | null) ?? null, s: last.schedule_id as string, i: last.member_index as number } satisfies Position)
        : null,
  };
}
