// A chunk whose results are being written while the schedule fails: no result lands after the fail.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

// Jobs go to a queue prefix no worker listens on: this test runs the chunk itself.
process.env.REDIS_PREFIX = `fail-guard-${process.pid}-${Date.now()}`;

async function waitForLockWait(): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    const [row] = await getSql()`select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock' and query like '%for share%'`;
    if (row!.n > 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error("the chunk never waited for the schedule's lock");
}

describe("failSchedule against a chunk in progress", () => {
  it("the chunk writes nothing once the schedule has failed", async () => {
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    const doc = createScheduleDoc([createBeam("G-1"), createBeam("G-2")], "Fail guard, Quillon Row");
    const { id } = await submitSchedule({ organizationId: demoOrganizations.engineering.id, source: "api-json", doc });
    const sql = getSql();
    await sql`update schedules set status = 'checking' where id = ${id}`;

    // Hold the lock failSchedule takes, as if it were running now, then fail the schedule.
    const failing = await sql.reserve();
    await failing`begin`;
    await failing`select status from schedules where id = ${id} for no key update`;
    const checking = checkChunk(id, 0);
    await waitForLockWait();
    await failing`update schedules set status = 'failed', failure_reason = 'test: failed while a chunk was checked', completed_at = now() where id = ${id}`;
    await failing`commit`;
    failing.release();

    expect(await checking).toBe("skipped");
    const [outcomes] = await sql`select count(*)::int as n from member_outcomes where schedule_id = ${id}`;
    const [checks] = await sql`select count(*)::int as n from member_checks where schedule_id = ${id}`;
    const [chunk] = await sql`select done_at from schedule_chunks where schedule_id = ${id} and chunk_index = 0`;
    expect({ outcomes: outcomes!.n, checks: checks!.n, doneAt: chunk!.done_at }).toEqual({ outcomes: 0, checks: 0, doneAt: null });
  });

  it("the same chunk writes its results when the schedule is still running (the guard is what stops it)", async () => {
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    const doc = createScheduleDoc([createBeam("H-1"), createBeam("H-2")], "Fail guard control, Quillon Row");
    const { id } = await submitSchedule({ organizationId: demoOrganizations.engineering.id, source: "api-json", doc });
    expect(await checkChunk(id, 0)).toBe("checked");
    const [outcomes] = await getSql()`select count(*)::int as n from member_outcomes where schedule_id = ${id}`;
    expect(outcomes!.n).toBe(2);
  });
});
