// RELIABILITY figure 13: one organization's flood (ten 100,000-member schedules queued) does not
// hold another organization's 10-member schedule longer than 5 s. Production's chunk size (2,000
// members), one worker process at check concurrency 2 (this machine's two cores).
import { afterAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { createDrill, createDrillBeams, submitDrillSchedule, waitForProgress } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("fair");
const FLOOD_SCHEDULES = 10;
const FLOOD_MEMBERS = 100_000;
const SMALL_MEMBERS = 10;
/** The promise (RELIABILITY figure 13): submission to completion of the small schedule. */
const PROMISED_MS = 5_000;
const flood: string[] = [];

async function countOpenChunks(ids: string[]) {
  const [row] = await getSql()`
    select count(*)::int as open from schedule_chunks c join schedules s on s.id = c.schedule_id
    where c.schedule_id = any(${ids}) and c.done_at is null and s.status not in ('completed', 'failed')`;
  return row!.open as number;
}

afterAll(async () => {
  drill.killAll();
  await closeQueues();
  // The flood is not needed past the drill: its rows would only slow the drills after it.
  if (flood.length > 0) {
    const sql = getSql();
    await sql`delete from member_checks where schedule_id = any(${flood})`;
    await sql`delete from member_outcomes where schedule_id = any(${flood})`;
    await sql`delete from schedules where id = any(${flood})`;
  }
});

describe("fairness between organizations", () => {
  it(`a 10-member schedule completes within ${PROMISED_MS / 1000} s while another organization has ten 100,000-member schedules queued`, { timeout: 600_000 }, async () => {
    drill.startWorker({ CHECK_CONCURRENCY: "2" });
    const members = createDrillBeams("A", FLOOD_MEMBERS);
    for (let i = 0; i < FLOOD_SCHEDULES; i++) {
      flood.push(await submitDrillSchedule(drill, { markPrefix: "A", memberCount: FLOOD_MEMBERS, members, label: `Flood ${i + 1}`, chunkSize: 2000, organizationId: demoOrganizations.engineering.id }));
    }
    // The worker is up and busy with the flood before the small schedule arrives.
    await waitForProgress(flood[0]!, (p) => p.chunks_done >= 1, 120_000);
    const openBefore = await countOpenChunks(flood);
    // Most of the flood (500 chunks in all) is still queued: at least seven schedules' worth.
    expect(openBefore).toBeGreaterThanOrEqual(350);

    const started = Date.now();
    const small = await submitDrillSchedule(drill, { markPrefix: "B", memberCount: SMALL_MEMBERS, label: "Small", chunkSize: 2000, organizationId: demoOrganizations.fabricator.id });
    const done = await waitForProgress(small, (p) => p.status === "completed" || p.status === "failed", 120_000);
    const tookMs = Date.now() - started;
    const openAfter = await countOpenChunks(flood);
    console.log(`[fairness] small schedule completed in ${tookMs} ms; flood chunks open before ${openBefore}, after ${openAfter}`);

    expect(done.status).toBe("completed");
    expect(done.checked_count).toBe(SMALL_MEMBERS);
    // The flood was still queued when the small schedule finished: it did not wait for the flood.
    expect(openAfter).toBeGreaterThanOrEqual(300);
    expect(tookMs).toBeLessThanOrEqual(PROMISED_MS);
  });
});
