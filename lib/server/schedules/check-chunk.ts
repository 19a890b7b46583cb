import { checkMember } from "@/lib/engine/check-member";
import { parseSchedule } from "@/lib/engine/intake";
import type { MemberResult } from "@/lib/engine/model";
import { EngineInputError } from "@/lib/engine/solver/engine-input-error";
import { mapEnginePath } from "@/lib/engine/check-schedule";
import { getSql } from "@/db/client";
import { copyRows } from "@/lib/server/copy-rows";
import { loadScheduleCriteria, toParseOptions, type ScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";
import { insertMemberReviews } from "@/lib/server/review/insert-member-reviews";
import { FREQUENCY_CHECK_NAME, nameDeflectionCheck } from "@/lib/vocabulary";

import { completeScheduleIfDone, failSchedule } from "./finish-schedule";

export const MAX_CHUNK_ATTEMPTS = 10;

/** What the results table shows of a member's input beside its outcome (stored with it, so a page never re-reads the chunk). */
export type OutcomeInput = { section: string | null; material: string | null; quantity: number; spansMm: number[] };
/** spanOrigins: the public path of each engine span, so checks are named as the user wrote the spans. */
export type Outcome = {
  index: number;
  mark: string;
  category: string;
  input?: OutcomeInput;
  result: MemberResult | null;
  error: string | null;
  spanOrigins?: readonly string[];
};

function describeInput(member: { sectionName?: string; materialName?: string; quantity: number; spans: { lengthMm: number }[] }): OutcomeInput {
  return { section: member.sectionName ?? null, material: member.materialName ?? null, quantity: member.quantity, spansMm: member.spans.map((s) => s.lengthMm) };
}

/**
 * Parses one chunk's stored members with the schedule's header and checks each one; an engine
 * input error becomes that member's error. `criteria`: what the schedule was submitted with
 * (organization catalogue, materials, profile), so failing members get the lightest passing
 * catalogue section.
 */
export function checkMembers(header: Record<string, unknown>, firstMember: number, inputs: unknown[], criteria: ScheduleCriteria | null = null): Outcome[] {
  const options = toParseOptions(criteria);
  // paths count from the chunk's first member, so errors name the member as the schedule numbers it
  const parsed = parseSchedule({ ...header, members: inputs }, { ...options, firstMemberIndex: firstMember });
  // The whole schedule passed this at submission; failing now means stored data changed.
  if (!parsed.ok) throw new Error(`stored members no longer parse: ${parsed.issues[0]?.path}: ${parsed.issues[0]?.message}`);
  return parsed.schedule.members.map((member, i) => {
    const index = firstMember + i;
    const input = describeInput(member);
    const spanOrigins = parsed.schedule.origins[i]?.spans;
    try {
      return { index, mark: member.mark, category: member.category, input, result: checkMember(member, parsed.schedule.profile, criteria?.catalogue), error: null, spanOrigins };
    } catch (error) {
      if (!(error instanceof EngineInputError)) throw error;
      return { index, mark: member.mark, category: member.category, input, result: null, error: error.issues.map((e) => `${mapEnginePath(e.path, `members[${index}]`, parsed.schedule.origins[i])}: ${e.message}`).join("; ") };
    }
  });
}

/** Runs checkMembers over a chunk's stored JSON text: inline, or on an engine thread (workers/engine). */
export type ChunkChecker = (
  header: Record<string, unknown>,
  firstMember: number,
  membersJson: string,
  criteria: ScheduleCriteria | null,
) => Outcome[] | Promise<Outcome[]>;

const checkMembersInline: ChunkChecker = (header, firstMember, membersJson, criteria) =>
  checkMembers(header, firstMember, JSON.parse(membersJson) as unknown[], criteria);

/**
 * Checks one chunk of a schedule and stores its results. Safe to run twice or to be killed at any
 * point: results, the chunk's done flag and the schedule's progress commit in one transaction,
 * and a chunk already done is skipped, so no result is ever lost or doubled.
 */
export async function checkChunk(scheduleId: string, chunkIndex: number, runChecks: ChunkChecker = checkMembersInline): Promise<"checked" | "skipped"> {
  const sql = getSql();
  const [chunk] = await sql`
    update schedule_chunks c set attempts = attempts + 1
    from schedules s
    where c.schedule_id = ${scheduleId} and c.chunk_index = ${chunkIndex} and s.id = c.schedule_id
    returning c.done_at, c.first_member, c.member_count, c.attempts, s.status,
      -- A chunk that will be skipped needs neither its members (about 0.5 MB) nor the header.
      case when c.done_at is null and s.status not in ('completed', 'failed') then c.members end as members,
      case when c.done_at is null and s.status not in ('completed', 'failed') then s.header end as header`;
  if (!chunk || chunk.done_at || chunk.status === "completed" || chunk.status === "failed") return "skipped";
  if (chunk.attempts > MAX_CHUNK_ATTEMPTS) {
    await failSchedule(scheduleId, `chunk ${chunkIndex} could not be checked after ${MAX_CHUNK_ATTEMPTS} attempts`);
    return "skipped";
  }
  // Only the first chunks see "queued": the rest leave the schedule's row alone.
  if (chunk.status === "queued") await sql`update schedules set status = 'checking', updated_at = now() where id = ${scheduleId} and status = 'queued'`;

  const criteria = await loadScheduleCriteria(scheduleId);
  const outcomes = await runChecks(chunk.header as Record<string, unknown>, chunk.first_member as number, chunk.members as string, criteria);

  const passed = outcomes.filter((o) => o.result?.pass).length;
  const errored = outcomes.filter((o) => o.error !== null).length;
  const wrote = await sql.begin(async (tx) => {
    // Results and the chunk's counts commit together; concurrent chunks of the schedule never
    // wait for each other (shared locks agree, result tables have no foreign key, and the
    // schedule's progress is summed from its chunks).
    // A shared lock on the schedule: failSchedule and completion take a stronger one, so results
    // never land after the schedule has ended, and ending waits for results already being written.
    const [schedule] = await tx`select status from schedules where id = ${scheduleId} for share`;
    if (!schedule || schedule.status === "completed" || schedule.status === "failed") return false;
    const [locked] = await tx`select done_at from schedule_chunks where schedule_id = ${scheduleId} and chunk_index = ${chunkIndex} for update`;
    if (!locked || locked.done_at) return false;
    await copyRows(
      tx,
      "member_outcomes",
      ["schedule_id", "member_index", "mark", "category", "pass", "governing_check", "utilization", "factor_of_safety", "limit_ratio", "achieved_ratio", "detail", ...OUTCOME_INPUT_COLUMNS],
      outcomeRows(scheduleId, outcomes),
    );
    await copyRows(
      tx,
      "member_checks",
      ["schedule_id", "member_index", "check_key", "combination_id", "span_index", "span_kind", "deflection_mm", "at_mm", "allowed_mm", "utilization", "factor_of_safety", "pass", "limit_ratio", "achieved_ratio"],
      checkRows(scheduleId, outcomes),
    );
    // The review queue is written with the outcomes, so it is never behind them.
    // Only chunks with members to review pay for parsing their inputs here (the engine threads parsed them to check).
    const inputs = outcomes.some((o) => o.error !== null || o.result?.pass !== true) ? (JSON.parse(chunk.members as string) as unknown[]) : [];
    await insertMemberReviews(tx, scheduleId, chunk.first_member as number, outcomes, inputs);
    await tx`
      update schedule_chunks set done_at = now(), pass_count = ${passed}, fail_count = ${outcomes.length - passed - errored}, error_count = ${errored}
      where schedule_id = ${scheduleId} and chunk_index = ${chunkIndex}`;
    return true;
  });
  // After the commit, so that whichever chunk commits last sees every chunk done. A worker that
  // dies just here leaves the completion to the reconciler.
  if (wrote) await completeScheduleIfDone(scheduleId);
  return wrote ? "checked" : "skipped";
}

/** The stored and public name of a check: "live, span 1", "total, left overhang" (lib/vocabulary.ts). */
export function checkKeyOf(combinationId: string, spanIndex: number, spanOrigins?: readonly string[]): string {
  return nameDeflectionCheck(combinationId, spanIndex, spanOrigins);
}

/** The public name of what governs the member: the deflection check's name, or "frequency". */
export function nameGoverningCheck(o: Outcome): string | null {
  const governing = o.result?.governingCheck ?? null;
  if (governing === null) return null;
  if (governing.kind === "frequency") return FREQUENCY_CHECK_NAME;
  const deflection = o.result?.governing ?? null;
  return deflection === null ? governing.key : checkKeyOf(deflection.combinationId, deflection.spanIndex, o.spanOrigins);
}

export const OUTCOME_INPUT_COLUMNS = ["section", "material", "quantity", "spans_mm"] as const;

export function* outcomeRows(scheduleId: string, outcomes: Outcome[]) {
  for (const o of outcomes) {
    const r = o.result;
    // What governs overall, frequency included; the deflection figures only when a deflection check governs.
    const governing = r?.governingCheck ?? null;
    const deflection = governing?.kind === "deflection" ? (r?.governing ?? null) : null;
    // Shape and rotations are recomputed on demand for one member (get-member-report.ts): cheap for
    // one, but a large share of the bytes written for every member of a big schedule.
    // Engine notes (e.g. "gross section: cracking not included") travel with the detail to every view.
    const detail = r
      ? r.frequency === null && r.suggestion === null && r.notes === undefined
        ? null
        : { frequency: r.frequency, suggestion: r.suggestion, error: null, ...(r.notes === undefined ? {} : { notes: r.notes }) }
      : { frequency: null, suggestion: null, error: o.error };
    yield [
      scheduleId,
      o.index,
      o.mark,
      o.category,
      r?.pass ?? false,
      nameGoverningCheck(o),
      governing?.utilization ?? null,
      governing?.factorOfSafety ?? null,
      deflection?.limitRatio ?? null,
      deflection?.achievedRatio ?? null,
      detail === null ? null : JSON.stringify(detail),
      o.input?.section ?? null,
      o.input?.material ?? null,
      o.input?.quantity ?? null,
      o.input ? `{${o.input.spansMm.join(",")}}` : null,
    ] as const;
  }
}

export function* checkRows(scheduleId: string, outcomes: Outcome[]) {
  for (const o of outcomes) {
    for (const c of o.result?.checks ?? []) {
      yield [
        scheduleId,
        o.index,
        checkKeyOf(c.combinationId, c.spanIndex, o.spanOrigins),
        c.combinationId,
        c.spanIndex,
        c.spanKind,
        c.deflectionMm,
        c.atMm,
        c.allowedMm,
        c.utilization,
        c.factorOfSafety,
        c.pass,
        c.limitRatio ?? null,
        c.achievedRatio ?? null,
      ] as const;
    }
  }
}
