import { assertMemberAndProfileValid } from "@/lib/engine/checks";
import { mapEnginePath } from "@/lib/engine/check-schedule";
import { parseSchedule, type ParsedSchedule, type ParseScheduleOptions } from "@/lib/engine/intake";
import type { InputIssue } from "@/lib/engine/model";
import { EngineInputError } from "@/lib/engine/solver/engine-input-error";
import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { loadSubmissionCriteria, storeScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";
import { DomainError, type FieldError } from "@/lib/server/errors";
import { exitIfArmedAfterCommit } from "@/lib/server/drills/exit-after-commit";
import { createId } from "@/lib/server/ids";
import { getMemberSource, type MemberSource } from "@/lib/schedule-members/lazy-members";
import { runInWindow } from "@/lib/server/run-in-window";

import { enqueueChunks } from "./enqueue-chunks";
import { issuesToFieldErrors, MAX_LISTED_ERRORS } from "./issue-pointers";

export const CHUNK_SIZE = Number(process.env.CHECK_CHUNK_SIZE ?? 2000);

export interface SubmitScheduleInput {
  organizationId: string;
  source: "api-json" | "api-csv" | "upload";
  /** A public-format schedule document (already JSON-parsed or built from CSV). */
  doc: unknown;
  submittedByUserId?: string | null;
  apiKeyId?: string | null;
  callbackEndpointId?: string | null;
  projectId?: string | null;
  /** Re-addresses issues to where the person can find them (CSV rows); JSON pointers otherwise. */
  toFieldErrors?: (issues: InputIssue[]) => FieldError[];
  /** A recheck: the schedule this submission rechecks with a newer profile version. */
  recheckOfScheduleId?: string | null;
  /** Runs inside the storing transaction, e.g. to complete an Idempotency-Key with the answer. */
  inTransaction?: (tx: TransactionSql, created: SubmittedSchedule) => Promise<void>;
}

export interface SubmittedSchedule {
  id: string;
  status: "queued";
  memberCount: number;
  createdAt: string;
}

/** A schedule that passed intake and the engine's member checks, and its members' marks in order. */
export interface CheckedSchedule {
  /** Without members: they are checked as they are read and not kept (see collectScheduleIssues). */
  schedule: ParsedSchedule;
  marks: string[];
}

/** The organization's criteria a schedule is read with: catalogues in use, materials, profiles. */
type CriteriaOptions = Pick<ParseScheduleOptions, "catalogue" | "organizationMaterials" | "organizationProfiles">;

/**
 * Every problem of a schedule, from intake and from the engine's member checks, all at once.
 * Each member is checked as soon as it is read and then dropped: holding the model of 100,000
 * members only to validate them would cost memory and garbage-collection time.
 */
export function collectScheduleIssues(
  doc: unknown,
  criteria: CriteriaOptions = {},
): ({ ok: true } & CheckedSchedule) | { ok: false; issues: InputIssue[]; unlistedCount: number } {
  const engineIssues: InputIssue[] = [];
  const marks: string[] = [];
  const parsed = parseSchedule(doc, {
    ...criteria,
    maxIssues: MAX_LISTED_ERRORS,
    retainMembers: false,
    onMember: (member, index, profile, origins) => {
      marks.push(member.mark);
      try {
        assertMemberAndProfileValid(member, profile);
      } catch (error) {
        if (!(error instanceof EngineInputError)) throw error;
        for (const issue of error.issues) engineIssues.push({ path: mapEnginePath(issue.path, `members[${index}]`, origins), message: issue.message });
      }
    },
  });
  // Intake problems first: engine checks of members that did not read cleanly say little.
  if (!parsed.ok) return parsed;
  return engineIssues.length > 0 ? { ok: false, issues: engineIssues, unlistedCount: 0 } : { ok: true, schedule: parsed.schedule, marks };
}

function findMembersWithNul(members: unknown[]): InputIssue[] {
  const issues: InputIssue[] = [];
  // A plain loop: members may be a lazy array (lazy-members.ts), read once each.
  for (let index = 0; index < members.length; index++) {
    if (JSON.stringify(members[index]).includes("\\u0000")) issues.push({ path: `members[${index}]`, message: "contains a NUL character (U+0000), which cannot be stored" });
  }
  return issues;
}

/** Members as the chunk writer reads them: the compact source of a lazy array, or a plain array. */
function readMemberSource(members: unknown[]): MemberSource {
  return (
    getMemberSource(members) ?? {
      count: members.length,
      memberAt: (index) => members[index],
      chunkText: (first, last) => JSON.stringify(members.slice(first, last)),
      mayHoldNulEscape: () => true,
    }
  );
}

/** Chunk inserts in flight at once: pipelined, yet only this many chunk texts exist at a time. */
const CHUNK_WRITES_IN_FLIGHT = 3;

/** A callback must be one of the organization's own endpoints; any other id reads as unknown. */
async function assertCallbackEndpoint(organizationId: string, endpointId: string): Promise<void> {
  const [found] = await getSql()`select 1 from webhook_endpoints where id = ${endpointId} and organization_id = ${organizationId}`;
  if (!found) {
    throw new DomainError("invalid_input", "The callback endpoint is not one of this organization's webhook endpoints.", [
      { pointer: "/query/callbackEndpointId", message: "register the endpoint first (Integrations, Webhooks) and pass its id" },
    ]);
  }
}

export function throwInvalidSchedule(errors: FieldError[], total: number): never {
  throw new DomainError(
    "invalid_input",
    `The schedule has ${total} problem${total === 1 ? "" : "s"}; nothing was stored.${total > errors.length ? ` The first ${errors.length} are listed.` : ""}`,
    errors,
    undefined,
    { errorCount: total },
  );
}

/** A schedule ready to store: checked, with its members still in their compact form. */
export interface PreparedSchedule {
  parsed: ParsedSchedule;
  marks: string[];
  header: Record<string, unknown>;
  members: MemberSource;
  chunkCount: number;
}

/**
 * Every check before storing (intake, the engine's member checks, characters PostgreSQL cannot
 * hold); throws the 422 listing the problems. Touches no database, so memory probes can run it.
 */
export function prepareSchedule(input: Pick<SubmitScheduleInput, "doc" | "toFieldErrors">, criteria: CriteriaOptions = {}): PreparedSchedule {
  const checked = collectScheduleIssues(input.doc, criteria);
  if (!checked.ok) {
    // Intake stops listing at the cap and ends with its "N more issues not listed" line: the
    // problem body states the total instead.
    const listedIssues = checked.unlistedCount > 0 ? checked.issues.slice(0, -1) : checked.issues;
    const listed = input.toFieldErrors ? input.toFieldErrors(listedIssues) : issuesToFieldErrors(listedIssues);
    throwInvalidSchedule(listed.slice(0, MAX_LISTED_ERRORS), listedIssues.length + checked.unlistedCount);
  }
  const doc = input.doc as Record<string, unknown>;
  const members = readMemberSource(doc.members as unknown[]);
  // PostgreSQL's text and jsonb cannot hold U+0000: refuse it by name instead of failing at the insert.
  const withNul = members.mayHoldNulEscape() ? findMembersWithNul(doc.members as unknown[]) : [];
  const headerHasNul = JSON.stringify([doc.name, doc.reference, doc.units, doc.profile]).includes("\\u0000");
  if (withNul.length > 0 || headerHasNul) {
    const issues = withNul.length > 0 ? withNul : [{ path: "", message: "the schedule's name, reference, units or profile contain a NUL character (U+0000), which cannot be stored" }];
    throwInvalidSchedule((input.toFieldErrors ?? issuesToFieldErrors)(issues).slice(0, MAX_LISTED_ERRORS), issues.length);
  }
  const header = { format: doc.format, name: doc.name, reference: doc.reference, units: doc.units, profile: doc.profile };
  return { parsed: checked.schedule, marks: checked.marks, header, members, chunkCount: Math.ceil(members.count / CHUNK_SIZE) };
}

/**
 * Validates a whole schedule (all or nothing), stores it with its work chunks (each holding its members)
 * in one transaction, then queues the chunks for the workers. Nothing is written when any member is bad.
 */
export async function submitSchedule(input: SubmitScheduleInput): Promise<SubmittedSchedule> {
  // The organization's catalogues in use, materials and named profile, frozen with the schedule.
  const criteria = await loadSubmissionCriteria(input.organizationId, input.doc);
  const { parsed, marks, header, members, chunkCount } = prepareSchedule(input, criteria.options);
  const id = createId("sch");

  const sql = getSql();
  if (input.callbackEndpointId) await assertCallbackEndpoint(input.organizationId, input.callbackEndpointId);
  const created = await sql.begin(async (tx) => {
    const [inserted] = await tx`
      insert into schedules (id, organization_id, project_id, name, reference, status, source, submitted_by_user_id, api_key_id,
        callback_endpoint_id, profile, header, member_count, chunk_count, queued_at)
      values (${id}, ${input.organizationId}, ${input.projectId ?? null}, ${parsed.name}, ${parsed.reference}, 'queued', ${input.source},
        ${input.submittedByUserId ?? null}, ${input.apiKeyId ?? null}, ${input.callbackEndpointId ?? null},
        ${JSON.stringify(parsed.profile)}::jsonb, ${JSON.stringify(header)}::jsonb, ${members.count}, ${chunkCount}, now())
      returning created_at`;
    await storeScheduleCriteria(tx, id, criteria.catalogueIds, criteria.freeze(), input.recheckOfScheduleId ?? null);
    // One row per chunk holding its members, all or none. Each chunk's JSON text is built just
    // before its insert (one text per chunk, never a string per member), a few pipelined at once.
    await runInWindow(chunkCount, CHUNK_WRITES_IN_FLIGHT, async (chunk) => {
      const first = chunk * CHUNK_SIZE;
      const last = Math.min(first + CHUNK_SIZE, members.count);
      await tx`
        insert into schedule_chunks (schedule_id, chunk_index, first_member, member_count, marks, members)
        values (${id}, ${chunk}, ${first}, ${last - first}, ${tx.array(marks.slice(first, last))}, ${members.chunkText(first, last)})`;
    });
    const stored: SubmittedSchedule = { id, status: "queued", memberCount: members.count, createdAt: new Date(inserted!.created_at as string).toISOString() };
    await input.inTransaction?.(tx, stored);
    return stored;
  });
  exitIfArmedAfterCommit();

  // Queued after commit; if Redis is away the reconciler queues it from PostgreSQL later.
  await enqueueChunks(id, Array.from({ length: chunkCount }, (_, i) => i)).catch((error: Error) =>
    console.error(`[sagline] schedule ${id} stored but not queued yet (${error.message}); the reconciler will queue it`),
  );
  return created;
}
