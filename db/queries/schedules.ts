import type { Sql, TransactionSql } from "postgres";

import { getSql } from "@/db/client";

export interface ScheduleRow {
  id: string;
  name: string;
  reference: string | null;
  status: string;
  failureReason: string | null;
  source: string;
  profile: { id: string; label: string; source: string };
  memberCount: number;
  checkedCount: number;
  passCount: number;
  failCount: number;
  errorCount: number;
  createdAt: Date;
  completedAt: Date | null;
  /** The schedule's unit system ("SI" or "US"), for showing lengths in its own units. */
  unitSystem: string;
}

// A running schedule's counts are summed from its chunks; an ended one's are on its own row.
const scheduleColumns = `s.id, s.name, s.reference, s.status, s.failure_reason, s.source, s.profile, s.member_count,
  case when s.status in ('completed', 'failed') then s.checked_count else p.checked_count end as checked_count,
  case when s.status in ('completed', 'failed') then s.pass_count else p.pass_count end as pass_count,
  case when s.status in ('completed', 'failed') then s.fail_count else p.fail_count end as fail_count,
  case when s.status in ('completed', 'failed') then s.error_count else p.error_count end as error_count,
  s.created_at, s.completed_at, s.header -> 'units' ->> 'system' as unit_system`;
/** A schedule's progress summed from its chunks (alias c): the one definition of it. */
const CHUNK_TOTALS_COLUMNS = `count(c.done_at)::int as chunks_done, (count(*) filter (where c.done_at is null))::int as open_chunks,
    coalesce(sum(c.member_count) filter (where c.done_at is not null), 0)::int as checked_count,
    coalesce(sum(c.pass_count), 0)::int as pass_count, coalesce(sum(c.fail_count), 0)::int as fail_count,
    coalesce(sum(c.error_count), 0)::int as error_count`;
// Ended schedules use their own totals (scheduleColumns): the lateral skips their chunks.
const scheduleSource = `schedules s cross join lateral (
  select ${CHUNK_TOTALS_COLUMNS} from schedule_chunks c where c.schedule_id = s.id and s.status not in ('completed', 'failed')) p`;

export interface ChunkTotals {
  chunks_done: number;
  open_chunks: number;
  checked_count: number;
  pass_count: number;
  fail_count: number;
  error_count: number;
}

/** The schedule's totals summed from its chunks, with `sql` or inside a transaction. */
export async function getChunkTotals(sql: Sql | TransactionSql, scheduleId: string): Promise<ChunkTotals> {
  const [totals] = await sql.unsafe(`select ${CHUNK_TOTALS_COLUMNS} from schedule_chunks c where c.schedule_id = $1`, [scheduleId]);
  return totals as unknown as ChunkTotals;
}

function toScheduleRow(r: Record<string, unknown>): ScheduleRow {
  const profile = r.profile as { id: string; label: string; source: string };
  return {
    id: r.id as string,
    name: r.name as string,
    reference: (r.reference as string | null) ?? null,
    status: r.status as string,
    failureReason: (r.failure_reason as string | null) ?? null,
    source: r.source as string,
    profile: { id: profile.id, label: profile.label, source: profile.source },
    memberCount: r.member_count as number,
    checkedCount: r.checked_count as number,
    passCount: r.pass_count as number,
    failCount: r.fail_count as number,
    errorCount: r.error_count as number,
    // unsafe() queries may hand timestamps back as text; normalise to Date either way.
    createdAt: new Date(r.created_at as string | Date),
    completedAt: r.completed_at ? new Date(r.completed_at as string | Date) : null,
    unitSystem: (r.unit_system as string | null) ?? "SI",
  };
}

/** Another organization's schedule reads exactly like a missing one: null. */
// Ids are written by createId("sch"): anything else cannot exist (and a NUL would fail in PostgreSQL).
const SCHEDULE_ID_PATTERN = /^sch_[0-9a-z]{1,40}$/;

export async function getSchedule(organizationId: string, scheduleId: string): Promise<ScheduleRow | null> {
  if (!SCHEDULE_ID_PATTERN.test(scheduleId)) return null;
  const [row] = await getSql().unsafe(`select ${scheduleColumns} from ${scheduleSource} where s.organization_id = $1 and s.id = $2`, [organizationId, scheduleId]);
  return row ? toScheduleRow(row) : null;
}

/** Newest first, keyset-paginated on (created_at, id). */
export async function listSchedules(organizationId: string, options: { limit: number; after?: { createdAt: string; id: string } }) {
  const sql = getSql();
  const rows = options.after
    ? await sql.unsafe(
        `select ${scheduleColumns} from ${scheduleSource} where s.organization_id = $1 and (s.created_at, s.id) < ($2::timestamptz, $3) order by s.created_at desc, s.id desc limit $4`,
        [organizationId, options.after.createdAt, options.after.id, options.limit + 1],
      )
    : await sql.unsafe(`select ${scheduleColumns} from ${scheduleSource} where s.organization_id = $1 order by s.created_at desc, s.id desc limit $2`, [organizationId, options.limit + 1]);
  const page = rows.slice(0, options.limit).map(toScheduleRow);
  return { rows: page, hasMore: rows.length > options.limit };
}

export type ResultStatus = "pass" | "fail" | "error";

/** The notes stored in an outcome's detail, as a list of strings (none when absent or malformed). */
export function readStoredNotes(value: unknown): string[] {
  return Array.isArray(value) ? value.filter((note): note is string => typeof note === "string") : [];
}

export async function getMemberResult(scheduleId: string, mark: string) {
  const sql = getSql();
  // The chunk holding the mark, and the member's place in it (marks are unique in a schedule).
  const [member] = await sql`
    select c.first_member + p.position - 1 as member_index, c.marks[p.position] as mark, c.members::json -> (p.position - 1) as input,
      s.header, coalesce(o.category, c.members::json -> (p.position - 1) ->> 'category') as category, o.pass, o.governing_check, o.utilization, o.factor_of_safety, o.limit_ratio, o.achieved_ratio, o.detail, o.member_index is not null as checked
    from schedule_chunks c
      cross join lateral (select array_position(c.marks, ${mark}::text) as position) p
      join schedules s on s.id = c.schedule_id
      left join member_outcomes o on o.schedule_id = c.schedule_id and o.member_index = c.first_member + p.position - 1
    where c.schedule_id = ${scheduleId} and p.position is not null`;
  if (!member) return null;
  const checks = await sql`
    select check_key, combination_id, span_index, span_kind, deflection_mm, at_mm, allowed_mm, utilization, factor_of_safety, pass, limit_ratio, achieved_ratio
    from member_checks where schedule_id = ${scheduleId} and member_index = ${member.member_index} order by check_key`;
  return { member, checks };
}

/** How many of the organization's schedules the workers are still checking (counted up to `cap`). */
export async function countUnfinishedSchedules(organizationId: string, cap = 100): Promise<number> {
  const [row] = await getSql()`
    select count(*)::int as n from (
      select 1 from schedules where organization_id = ${organizationId} and status not in ('completed', 'failed') limit ${cap}) s`;
  return (row?.n as number | undefined) ?? 0;
}
