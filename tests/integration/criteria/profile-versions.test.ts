// An organization limit profile: a schedule names it by id and records the exact version it was
// checked against; an edit makes a new version and leaves every stored result as it was; "recheck
// with the new version" makes a new schedule linked to the old one, checked against the new version.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { createLimitProfile, getLimitProfileOrThrow, updateLimitProfile } from "@/lib/server/criteria/limit-profiles";
import { getScheduleProfileVersion, recheckSchedule } from "@/lib/server/criteria/recheck-schedule";
import { DomainError } from "@/lib/server/errors";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

import { createTestOrganization } from "./support";

process.env.REDIS_PREFIX = `criteria-profiles-${process.pid}-${Date.now()}`;

async function readStored(id: string) {
  const sql = getSql();
  const [schedule] = await sql`select profile, status, pass_count, fail_count from schedules where id = ${id}`;
  const outcomes = await sql`select member_index, pass, governing_check, utilization, limit_ratio, detail from member_outcomes where schedule_id = ${id} order by member_index`;
  const checks = await sql`select member_index, check_key, deflection_mm, allowed_mm, utilization, pass from member_checks where schedule_id = ${id} order by member_index, check_key`;
  const [criteria] = await sql`select profile_id, profile_version, recheck_of_schedule_id from schedule_criteria where schedule_id = ${id}`;
  return { schedule, outcomes, checks, criteria };
}

async function check(id: string): Promise<void> {
  const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
  expect(await checkChunk(id, 0)).toBe("checked");
}

describe("organization limit profiles and their versions", () => {
  it("a profile edit leaves old results untouched, and the recheck makes a linked submission against the new version", async () => {
    const organizationId = await createTestOrganization("profile versions");
    const profile = await createLimitProfile(organizationId, { label: "Floors, in-house copy of the IBC 2021 floor rows", source: "IBC 2021 Table 1604.3, copied", basedOnPreset: "ibc-2021-floor" });
    expect(profile.version).toBe(1);
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const doc = { ...createScheduleDoc([createBeam("B-1", 6, 7.5), createBeam("B-2", 4, 5)]), profile: { id: profile.id } };
    const first = await submitSchedule({ organizationId, source: "api-json", doc });
    await check(first.id);
    const before = await readStored(first.id);
    expect(before.criteria).toEqual({ profile_id: profile.id, profile_version: 1, recheck_of_schedule_id: null });
    expect((before.schedule!.profile as { id: string }).id).toBe(`${profile.id}.v1`);
    // the live row of the copied preset: l/360 (IBC 2021 Table 1604.3, floor members)
    const liveBefore = before.checks.find((c) => c.member_index === 0 && c.check_key === "live, span 1");
    expect(liveBefore!.allowed_mm).toBeCloseTo(6000 / 360, 9);

    // The edit: the live row made stricter, l/1000.
    const stored = await getLimitProfileOrThrow(organizationId, profile.id);
    const definition = structuredClone(stored.versions[0]!.definition) as { combinations: { id: string; limitRatio: number }[] };
    definition.combinations.find((c) => c.id === "live")!.limitRatio = 1000;
    const edited = await updateLimitProfile(organizationId, profile.id, { label: "Floors, in-house, live l/1000", source: "in-house rule, stricter than IBC 2021", definition, expectedVersion: 1 });
    expect(edited.version).toBe(2);

    // Stored results, the stored profile and the recorded version are exactly as they were.
    expect(await readStored(first.id)).toEqual(before);
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    expect(await checkChunk(first.id, 0)).toBe("skipped");
    expect(await readStored(first.id)).toEqual(before);
    expect(await getScheduleProfileVersion(organizationId, first.id)).toMatchObject({ profileId: profile.id, version: 1, currentVersion: 2 });

    // An edit from a stale version is refused.
    const stale = await updateLimitProfile(organizationId, profile.id, { label: "late edit", source: "in-house", definition, expectedVersion: 1 }).catch((e: unknown) => e);
    expect(stale).toBeInstanceOf(DomainError);
    expect((stale as DomainError).code).toBe("conflict");

    const recheck = await recheckSchedule({ organizationId, scheduleId: first.id });
    expect(recheck.id).not.toBe(first.id);
    expect(recheck.memberCount).toBe(2);
    await check(recheck.id);
    const after = await readStored(recheck.id);
    expect(after.criteria).toEqual({ profile_id: profile.id, profile_version: 2, recheck_of_schedule_id: first.id });
    expect((after.schedule!.profile as { id: string }).id).toBe(`${profile.id}.v2`);
    const liveAfter = after.checks.find((c) => c.member_index === 0 && c.check_key === "live, span 1");
    expect(liveAfter!.allowed_mm).toBeCloseTo(6000 / 1000, 9);
    // same member, same loads: the same deflection judged against the new limit
    expect(liveAfter!.deflection_mm).toBeCloseTo(liveBefore!.deflection_mm as number, 9);
    expect(await getScheduleProfileVersion(organizationId, first.id)).toMatchObject({ recheckedByScheduleIds: [recheck.id] });
    expect(await readStored(first.id)).toEqual(before);

    // The recheck is at the current version already: nothing newer to recheck with.
    const again = await recheckSchedule({ organizationId, scheduleId: recheck.id }).catch((e: unknown) => e);
    expect((again as DomainError).code).toBe("conflict");
  });

  it("refuses an invalid definition, naming the field, and a profile id of another organization", async () => {
    const organizationId = await createTestOrganization("profile errors");
    const refused = await createLimitProfile(organizationId, {
      label: "Broken",
      source: "test",
      definition: { combinations: [{ id: "live", label: "live", factors: { live: 1 }, limitRatio: -360 }], cantileverSpanMultiplier: 2 },
    }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(DomainError);
    expect((refused as DomainError).errors).toEqual([{ pointer: "/definition/combinations/0/limitRatio", message: expect.stringMatching(/greater than 0|positive/) }]);

    const other = await createTestOrganization("profile owner");
    const foreign = await createLimitProfile(other, { label: "Theirs", source: "test", basedOnPreset: "ibc-2021-floor" });
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const doc = { ...createScheduleDoc([createBeam("B-1")]), profile: { id: foreign.id } };
    const wrong = await submitSchedule({ organizationId, source: "api-json", doc }).catch((e: unknown) => e);
    expect((wrong as DomainError).errors).toEqual([{ pointer: "/profile/id", message: `unknown limit profile "${foreign.id}": not one of this organization's profiles (Settings, Limit profiles)` }]);
  });
});
