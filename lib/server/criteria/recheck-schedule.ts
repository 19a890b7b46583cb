import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";
import { submitSchedule, type SubmittedSchedule } from "@/lib/server/schedules/submit-schedule";

import { loadCurrentLimitProfile } from "./limit-profiles";

export interface ScheduleProfileVersion {
  profileId: string;
  /** The version the schedule was checked against. */
  version: number;
  /** The profile's version now; null when the profile has been removed. */
  currentVersion: number | null;
  currentLabel: string | null;
  /** The schedule this one rechecks, and the schedules that recheck this one, newest first. */
  recheckOfScheduleId: string | null;
  recheckedByScheduleIds: string[];
}

/** Which organization profile version a schedule was checked against; null for a preset or the schedule's own limits. */
export async function getScheduleProfileVersion(organizationId: string, scheduleId: string): Promise<ScheduleProfileVersion | null> {
  const sql = getSql();
  const [row] = await sql`
    select c.profile_id, c.profile_version, c.recheck_of_schedule_id, p.current_version, p.label
    from schedule_criteria c join schedules s on s.id = c.schedule_id
    left join limit_profiles p on p.id = c.profile_id and p.organization_id = s.organization_id
    where c.schedule_id = ${scheduleId} and s.organization_id = ${organizationId}`;
  if (!row || row.profile_id === null) return null;
  const rechecks = await sql`
    select c.schedule_id from schedule_criteria c join schedules s on s.id = c.schedule_id
    where c.recheck_of_schedule_id = ${scheduleId} and s.organization_id = ${organizationId} order by s.created_at desc limit 20`;
  return {
    profileId: row.profile_id as string,
    version: row.profile_version as number,
    currentVersion: (row.current_version as number | null) ?? null,
    currentLabel: (row.label as string | null) ?? null,
    recheckOfScheduleId: (row.recheck_of_schedule_id as string | null) ?? null,
    recheckedByScheduleIds: rechecks.map((r) => r.schedule_id as string),
  };
}

export interface RecheckInput {
  organizationId: string;
  scheduleId: string;
  submittedByUserId?: string | null;
  apiKeyId?: string | null;
}

/**
 * Submits a schedule again, unchanged but for its organization profile, now at the current
 * version: a new schedule linked to the old one (schedule_criteria.recheck_of_schedule_id). The
 * old schedule and its results are never touched.
 */
export async function recheckSchedule(input: RecheckInput): Promise<SubmittedSchedule> {
  const sql = getSql();
  const [row] = await sql`
    select s.header, s.source, s.project_id, c.profile_id, c.profile_version
    from schedules s left join schedule_criteria c on c.schedule_id = s.id
    where s.id = ${input.scheduleId} and s.organization_id = ${input.organizationId}`;
  if (!row) throw new DomainError("not_found", "The schedule was not found.");
  const profileId = row.profile_id as string | null;
  if (profileId === null) throw new DomainError("conflict", "This schedule was checked against a preset or its own limits, not an organization profile: there is no newer version to recheck with.");
  const current = await loadCurrentLimitProfile(input.organizationId, profileId);
  if (current === null) throw new DomainError("conflict", "The limit profile this schedule was checked against has been removed.");
  if (current.version === row.profile_version) throw new DomainError("conflict", `This schedule was already checked against version ${current.version}, the current one.`);
  const chunks = await sql`select members from schedule_chunks where schedule_id = ${input.scheduleId} order by chunk_index`;
  const members = chunks.flatMap((chunk) => JSON.parse(chunk.members as string) as unknown[]);
  const header = row.header as Record<string, unknown>;
  return submitSchedule({
    organizationId: input.organizationId,
    source: row.source as "api-json" | "api-csv" | "upload",
    doc: { ...header, profile: { id: profileId }, members },
    submittedByUserId: input.submittedByUserId ?? null,
    apiKeyId: input.apiKeyId ?? null,
    projectId: (row.project_id as string | null) ?? null,
    recheckOfScheduleId: input.scheduleId,
  });
}
