// The end of a schedule: whichever chunk commits last completes it, once, with the totals of
// every chunk, even when the last two race; a retried chunk changes nothing; and a schedule whose
// last worker died between its chunk's commit and the completion is completed by the reconciler.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

// Jobs go to a queue prefix no worker listens on: this test runs the chunks itself.
process.env.REDIS_PREFIX = `completion-${process.pid}-${Date.now()}`;
process.env.CHECK_CHUNK_SIZE = "2";

async function submit(label: string, count: number): Promise<string> {
  const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
  // Every third beam spans 9 m under a heavy live load, so some members fail.
  const members = Array.from({ length: count }, (_, i) => createBeam(`${label}-${i}`, i % 3 === 2 ? 9 : 4, i % 3 === 2 ? 40 : 5));
  return (await submitSchedule({ organizationId: demoOrganizations.engineering.id, source: "api-json", doc: createScheduleDoc(members, `Completion ${label}, Fenwick Quay`) })).id;
}

async function completedEvents(id: string) {
  return getSql()<{ payload: { counts: Record<string, number> } }[]>`select payload from outbox_events where type = 'schedule.completed' and payload->>'scheduleId' = ${id}`;
}

async function readTotals(id: string) {
  const sql = getSql();
  const [schedule] = await sql`select status, chunks_done, checked_count, pass_count, fail_count, error_count from schedules where id = ${id}`;
  const [outcomes] = await sql`select count(*)::int as checked, (count(*) filter (where pass))::int as passed from member_outcomes where schedule_id = ${id}`;
  return { schedule: schedule!, outcomes: outcomes! };
}

describe("completing a schedule", () => {
  it("completes once when the last two chunks race, with every chunk's totals", async () => {
    const id = await submit("R", 6);
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    expect(await checkChunk(id, 0)).toBe("checked");
    expect(await Promise.all([checkChunk(id, 1), checkChunk(id, 2)])).toEqual(["checked", "checked"]);
    const { schedule, outcomes } = await readTotals(id);
    expect(outcomes).toEqual({ checked: 6, passed: 4 });
    expect(schedule).toEqual({ status: "completed", chunks_done: 3, checked_count: 6, pass_count: 4, fail_count: 2, error_count: 0 });
    const events = await completedEvents(id);
    expect(events).toHaveLength(1);
    expect(events[0]!.payload.counts).toEqual({ members: 6, checked: 6, passed: 4, failed: 2, errors: 0 });

    expect(await checkChunk(id, 2)).toBe("skipped");
    expect(await completedEvents(id)).toHaveLength(1);
  });

  it("the reconciler completes a schedule whose chunks are all in but that was never completed", async () => {
    const id = await submit("S", 3);
    const { checkChunk } = await import("@/lib/server/schedules/check-chunk");
    await checkChunk(id, 0);
    await checkChunk(id, 1);
    // What a worker killed right after its chunk's commit leaves: every result in, no completion.
    const sql = getSql();
    await sql`delete from outbox_events where payload->>'scheduleId' = ${id}`;
    await sql`update schedules set status = 'checking', completed_at = null, chunks_done = 0, checked_count = 0, pass_count = 0, fail_count = 0,
      updated_at = now() - interval '10 minutes' where id = ${id}`;
    await sql`update schedule_chunks set done_at = now() - interval '10 minutes' where schedule_id = ${id}`;
    expect((await readTotals(id)).schedule.status).toBe("checking");

    const { reconcileSchedules } = await import("@/lib/server/schedules/reconcile-schedules");
    await reconcileSchedules();
    expect((await readTotals(id)).schedule).toEqual({ status: "completed", chunks_done: 2, checked_count: 3, pass_count: 2, fail_count: 1, error_count: 0 });
    expect(await completedEvents(id)).toHaveLength(1);
    await reconcileSchedules();
    expect(await completedEvents(id)).toHaveLength(1);
  });
});
