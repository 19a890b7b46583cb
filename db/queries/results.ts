import type { PendingQuery, Row } from "postgres";

import { getSql } from "@/db/client";

import { readStoredNotes, type ResultStatus } from "./schedules";

/** The orderings of a schedule's results; each has its own index (db/schema/schedules.ts). */
export const RESULT_SORTS = ["schedule", "utilization", "mark", "category"] as const;
export type ResultSort = (typeof RESULT_SORTS)[number];

export interface ResultQueryFilters {
  status?: ResultStatus;
  category?: string;
  /** Only members awaiting an engineer's review (member_reviews.state). */
  awaitingReview?: boolean;
  /** Utilization strictly above this value. */
  utilizationAbove?: number;
  /** Marks starting with this text, case-insensitively. */
  markPrefix?: string;
}

/**
 * A position in one ordering: the sort key and member index of the row next to the page, and
 * whether the page lies after it (next) or before it (previous). `page` is the number of the page
 * the cursor leads to, for display only.
 */
export interface ResultPosition {
  sort: ResultSort;
  /** utilization: number or null (an error); mark: the lowered mark; category: the category; schedule: unused. */
  key: number | string | null;
  index: number;
  back: boolean;
  page: number;
}

export interface ResultReview {
  state: string;
  decidedBy: string | null;
  /** ISO 8601: rows travel to the browser as JSON. */
  decidedAt: string | null;
}

export interface ResultPageRow {
  memberIndex: number;
  mark: string;
  /** The mark as the mark ordering compares it (PostgreSQL's lower()). */
  markKey: string;
  category: string;
  status: ResultStatus;
  governingCheck: string | null;
  utilization: number | null;
  factorOfSafety: number | null;
  /** The governing check's signed deflection, mm (+ downward), and its allowed magnitude, mm; null without one. */
  governingDeflectionMm: number | null;
  allowedDeflectionMm: number | null;
  limitRatio: number | null;
  achievedRatio: number | null;
  notes: string[];
  section: string | null;
  material: string | null;
  quantity: number | null;
  spansMm: number[];
  /** The review state of a member that did not pass; null for a passing member or before review rows exist. */
  review: ResultReview | null;
}

type Sql = ReturnType<typeof getSql>;
type Fragment = PendingQuery<Row[]>;

// The key expressions must match the index expressions exactly for PostgreSQL to use them.
function keyExpression(sql: Sql, sort: ResultSort, alias = "o"): Fragment {
  const t = sql(alias);
  switch (sort) {
    case "utilization":
      return sql`coalesce(-${t}.utilization, 'Infinity'::float8)`;
    case "mark":
      return sql`lower(${t}.mark) collate "C"`;
    case "category":
      return sql`${t}.category`;
    case "schedule":
      return sql`${t}.member_index`;
  }
}

function orderFragment(sql: Sql, sort: ResultSort, back: boolean, alias = "o"): Fragment {
  const index = sql`${sql(alias)}.member_index`;
  if (sort === "schedule") return back ? sql`${index} desc` : index;
  const key = keyExpression(sql, sort, alias);
  return back ? sql`${key} desc, ${index} desc` : sql`${key}, ${index}`;
}

function keyParameter(sql: Sql, position: ResultPosition): Fragment {
  switch (position.sort) {
    case "utilization":
      return position.key === null ? sql`'Infinity'::float8` : sql`coalesce(-(${position.key as number})::float8, 'Infinity'::float8)`;
    case "mark":
      return sql`(${position.key as string})::text collate "C"`;
    case "category":
      return sql`(${position.key as string})::text`;
    case "schedule":
      return sql`(${position.index})::int`;
  }
}

/** The smallest string above every string starting with `prefix` in code-point order, or null when there is none. */
export function getPrefixUpperBound(prefix: string): string | null {
  const points = [...prefix];
  while (points.length > 0) {
    const last = points.pop()!.codePointAt(0)!;
    let next = last + 1;
    if (next >= 0xd800 && next <= 0xdfff) next = 0xe000;
    if (next <= 0x10ffff) return points.join("") + String.fromCodePoint(next);
  }
  return null;
}

function keysetFragment(sql: Sql, sort: ResultSort, position: ResultPosition | undefined): Fragment {
  if (!position) return sql``;
  const back = position.back;
  if (sort === "schedule") return back ? sql`and o.member_index < ${position.index}` : sql`and o.member_index > ${position.index}`;
  const key = keyExpression(sql, sort);
  return back
    ? sql`and (${key}, o.member_index) < (${keyParameter(sql, position)}, ${position.index}::int)`
    : sql`and (${key}, o.member_index) > (${keyParameter(sql, position)}, ${position.index}::int)`;
}

function filterFragment(sql: Sql, filters: ResultQueryFilters): Fragment {
  const parts: Fragment[] = [];
  if (filters.status === "pass") parts.push(sql`and o.pass`);
  // A failed member always has a governing check and an errored one never has (check-chunk.ts):
  // testing that column spares parsing every failure's detail.
  else if (filters.status === "fail") parts.push(sql`and not o.pass and o.governing_check is not null`);
  else if (filters.status === "error") parts.push(sql`and (o.detail ->> 'error') is not null`);
  if (filters.category) parts.push(sql`and o.category = ${filters.category}`);
  if (filters.utilizationAbove !== undefined) parts.push(sql`and o.utilization > ${filters.utilizationAbove}`);
  if (filters.awaitingReview) {
    parts.push(sql`and exists (select 1 from member_reviews r where r.schedule_id = o.schedule_id and r.member_index = o.member_index and r.state = 'awaiting_review')`);
  }
  if (filters.markPrefix) {
    const lowered = filters.markPrefix.toLowerCase();
    const upper = getPrefixUpperBound(lowered);
    parts.push(sql`and lower(o.mark) collate "C" >= (${lowered})::text collate "C"`);
    if (upper !== null) parts.push(sql`and lower(o.mark) collate "C" < (${upper})::text collate "C"`);
  }
  return parts.reduce((all, part) => sql`${all} ${part}`, sql``);
}

function toRow(r: Row): ResultPageRow {
  return {
    memberIndex: r.member_index as number,
    mark: r.mark as string,
    markKey: r.mark_key as string,
    category: r.category as string,
    status: (r.error ? "error" : r.pass ? "pass" : "fail") as ResultStatus,
    governingCheck: (r.governing_check as string | null) ?? null,
    utilization: (r.utilization as number | null) ?? null,
    factorOfSafety: (r.factor_of_safety as number | null) ?? null,
    governingDeflectionMm: (r.deflection_mm as number | null) ?? null,
    allowedDeflectionMm: (r.allowed_mm as number | null) ?? null,
    limitRatio: (r.limit_ratio as number | null) ?? null,
    achievedRatio: (r.achieved_ratio as number | null) ?? null,
    notes: readStoredNotes(r.notes),
    section: (r.section as string | null) ?? null,
    material: (r.material as string | null) ?? null,
    quantity: (r.quantity as number | null) ?? null,
    spansMm: Array.isArray(r.spans_mm) ? (r.spans_mm as number[]) : [],
    review: r.review_state ? { state: r.review_state as string, decidedBy: (r.decided_by as string | null) ?? null, decidedAt: r.decided_at ? new Date(r.decided_at as string).toISOString() : null } : null,
  };
}

/**
 * One page of a schedule's results in the given ordering, after (or before) a position. Keyset
 * reads: each page costs the same at any depth. The governing check's figures and the review
 * state are joined for the page's rows only.
 */
export async function listResultPage(
  scheduleId: string,
  options: { sort: ResultSort; filters: ResultQueryFilters; limit: number; position?: ResultPosition },
): Promise<{ rows: ResultPageRow[]; hasMore: boolean }> {
  const sql = getSql();
  const position = options.position;
  const back = position?.back === true;
  const keyset = keysetFragment(sql, options.sort, position);
  const rows = await sql`
    with page as (
      select o.schedule_id, o.member_index, o.mark, o.category, o.pass, o.governing_check, o.utilization, o.factor_of_safety, o.limit_ratio, o.achieved_ratio,
        o.detail ->> 'error' as error, o.detail -> 'notes' as notes, o.section, o.material, o.quantity, o.spans_mm, lower(o.mark) as mark_key
      from member_outcomes o
      where o.schedule_id = ${scheduleId} ${filterFragment(sql, options.filters)} ${keyset}
      order by ${orderFragment(sql, options.sort, back)}
      limit ${options.limit + 1})
    select page.*, c.deflection_mm, c.allowed_mm, r.state as review_state, d.decided_by_name as decided_by, d.created_at as decided_at
    from page
      left join member_checks c on c.schedule_id = page.schedule_id and c.member_index = page.member_index and c.check_key = page.governing_check
      left join member_reviews r on r.schedule_id = page.schedule_id and r.member_index = page.member_index
      left join member_dispositions d on d.id = r.latest_disposition_id
    order by ${orderFragment(sql, options.sort, false, "page")}`;
  // Display order is always ascending; a page read backwards ends at the row before the position.
  const ordered = rows.map(toRow);
  const hasMore = ordered.length > options.limit;
  const page = back ? ordered.slice(ordered.length > options.limit ? 1 : 0) : ordered.slice(0, options.limit);
  return { rows: page, hasMore };
}

/** The row's key in an ordering, as a cursor holds it. */
export function getSortKey(row: Pick<ResultPageRow, "utilization" | "markKey" | "category" | "memberIndex">, sort: ResultSort): number | string | null {
  switch (sort) {
    case "utilization":
      return row.utilization;
    case "mark":
      return row.markKey;
    case "category":
      return row.category;
    case "schedule":
      return row.memberIndex;
  }
}

/** How many members match the filters (one index or heap count; bounded by the schedule's size). */
export async function countResults(scheduleId: string, filters: ResultQueryFilters): Promise<number> {
  const sql = getSql();
  const [row] = await sql`select count(*)::int as n from member_outcomes o where o.schedule_id = ${scheduleId} ${filterFragment(sql, filters)}`;
  return (row?.n as number | undefined) ?? 0;
}

/**
 * The position of the `skip`th row after `from` (or from the start) in an ordering, and whether
 * any row follows it: a jump to a page, or the end of a CSV page before it is streamed. It reads
 * past the skipped rows' keys once (an offset over the ordering's index), so it costs in
 * proportion to `skip`; undefined when fewer rows follow.
 */
export async function findPosition(
  scheduleId: string,
  options: { sort: ResultSort; filters: ResultQueryFilters; skip: number; from?: ResultPosition; page: number },
): Promise<{ position: ResultPosition; more: boolean } | undefined> {
  if (options.skip < 1) return undefined;
  const sql = getSql();
  const rows = await sql`
    select o.member_index, o.utilization, lower(o.mark) as mark_key, o.category from member_outcomes o
    where o.schedule_id = ${scheduleId} ${filterFragment(sql, options.filters)} ${keysetFragment(sql, options.sort, options.from)}
    order by ${orderFragment(sql, options.sort, false)} offset ${options.skip - 1} limit 2`;
  const row = rows[0];
  if (!row) return undefined;
  const memberIndex = row.member_index as number;
  const key = getSortKey({ memberIndex, utilization: (row.utilization as number | null) ?? null, markKey: row.mark_key as string, category: row.category as string }, options.sort);
  return { position: { sort: options.sort, key, index: memberIndex, back: false, page: options.page }, more: rows.length > 1 };
}

/** The position just before page `page` (1-based), for a jump to it; undefined for page 1 or past the end. */
export async function findPagePosition(
  scheduleId: string,
  options: { sort: ResultSort; filters: ResultQueryFilters; limit: number; page: number },
): Promise<ResultPosition | undefined> {
  if (options.page <= 1) return undefined;
  const found = await findPosition(scheduleId, { sort: options.sort, filters: options.filters, skip: (options.page - 1) * options.limit, page: options.page });
  return found?.position;
}

export interface RecordedDisposition {
  kind: string;
  justification: string | null;
  decidedBy: string;
  decidedAt: string;
}

export interface FailureRecordRow {
  memberIndex: number;
  mark: string;
  category: string;
  status: ResultStatus;
  governingCheck: string | null;
  utilization: number | null;
  limitRatio: number | null;
  achievedRatio: number | null;
  reviewState: string | null;
  /** Oldest first, at most `dispositionsPerMember`. */
  dispositions: RecordedDisposition[];
}

/**
 * The members that did not pass, in schedule order, each with its recorded decisions: the body of
 * the printable record. At most `limit` members and `dispositionsPerMember` decisions each.
 */
export async function listFailureRecord(scheduleId: string, options: { limit: number; dispositionsPerMember: number }): Promise<FailureRecordRow[]> {
  const sql = getSql();
  const rows = await sql`
    select o.member_index, o.mark, o.category, o.pass, o.governing_check, o.utilization, o.limit_ratio, o.achieved_ratio, o.detail ->> 'error' as error, r.state as review_state,
      coalesce((select json_agg(json_build_object('kind', d.kind, 'justification', d.justification, 'decidedBy', d.decided_by_name, 'decidedAt', d.created_at) order by d.id)
        from (select * from member_dispositions d where d.schedule_id = o.schedule_id and d.member_index = o.member_index order by d.id limit ${options.dispositionsPerMember}) d), '[]'::json) as dispositions
    from member_outcomes o
      left join member_reviews r on r.schedule_id = o.schedule_id and r.member_index = o.member_index
    where o.schedule_id = ${scheduleId} and not o.pass
    order by o.member_index
    limit ${options.limit}`;
  return rows.map((r) => ({
    memberIndex: r.member_index as number,
    mark: r.mark as string,
    category: r.category as string,
    status: (r.error ? "error" : "fail") as ResultStatus,
    governingCheck: (r.governing_check as string | null) ?? null,
    utilization: (r.utilization as number | null) ?? null,
    limitRatio: (r.limit_ratio as number | null) ?? null,
    achievedRatio: (r.achieved_ratio as number | null) ?? null,
    reviewState: (r.review_state as string | null) ?? null,
    dispositions: (r.dispositions as RecordedDisposition[]).map((d) => ({ ...d, decidedAt: new Date(d.decidedAt).toISOString() })),
  }));
}
