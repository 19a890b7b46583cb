// A chunk that takes several times the job lock (members of 50 spans and 1,000 loads each, the
// largest a member may be): the engine runs on worker threads, so the lock keeps being renewed.
// Two worker processes watch the same queue: had a lock lapsed, the other would take the job again
// (a second attempt in PostgreSQL, a stalled count in BullMQ). Sized for this 2-core machine: 80
// such members in two chunks of 40 (each several seconds against a 1.5 s lock), not 2,000.
import { afterAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { chunkJobId } from "@/lib/server/schedules/enqueue-chunks";
import { countResults, createDrill, submitDrillSchedule, waitForFinalState } from "@/tests/helpers/drill";
import { getQueue, queueNames, closeQueues } from "@/workers/queues";

const drill = createDrill("long");
const LOCK_MS = 1_500;
const CHUNK_MEMBERS = 40;
const MEMBERS = 80;
const SPANS = 50;
const LOADS = 1_000;
const FINISH_WITHIN_MS = 300_000;

afterAll(async () => {
  drill.killAll();
  await closeQueues();
});

function createHeavyMember(i: number) {
  const spansM = Array.from({ length: SPANS }, () => 4);
  const loads = Array.from({ length: LOADS }, (_, j) =>
    j < 2 ? { case: j === 0 ? "dead" : "live", type: "uniform", w: 3 } : { case: j % 2 ? "live" : "dead", type: "point", P: 1, at: (j * 0.197) % (4 * SPANS) },
  );
  return { mark: `H-${i}`, category: "floor_beam", quantity: 1, material: "steel-s355", section: { shape: "i_plate", bf: 150, tf: 10.7, d: 300, tw: 7.1 }, spans: spansM, supports: ["pinned", ...spansM.map(() => "roller")], loads };
}

describe("a chunk longer than the job lock", () => {
  it("is processed once, never stalls and completes the schedule", { timeout: 400_000 }, async () => {
    const env = { WORKER_LOCK_MS: String(LOCK_MS), WORKER_STALLED_CHECK_MS: "500", WORKER_MAX_STALLED: "1", CHECK_CONCURRENCY: "1" };
    drill.startWorker(env);
    drill.startWorker(env);
    const members = Array.from({ length: MEMBERS }, (_, i) => createHeavyMember(i));
    const id = await submitDrillSchedule(drill, { markPrefix: "H", memberCount: MEMBERS, members, label: "Long chunk drill", chunkSize: CHUNK_MEMBERS });
    const final = await waitForFinalState(id, FINISH_WITHIN_MS);
    expect(final.status).toBe("completed");

    const queue = getQueue(queueNames.checkMembers);
    const jobs = await Promise.all([0, 1].map((i) => queue.getJob(chunkJobId(id, i))));
    const runMs = jobs.map((job) => (job?.finishedOn ?? 0) - (job?.processedOn ?? 0));
    console.log(`[long-chunk] chunk run times ${runMs.join(", ")} ms against a ${LOCK_MS} ms lock; completed ${final.seconds.toFixed(1)} s after submission`);
    // The fault is real: each chunk ran for more than twice the lock.
    expect(Math.min(...runMs)).toBeGreaterThan(2 * LOCK_MS);
    expect(jobs.map((job) => job?.stalledCounter ?? -1)).toEqual([0, 0]);
    const attempts = await getSql()`select attempts from schedule_chunks where schedule_id = ${id} order by chunk_index`;
    expect(attempts.map((r) => r.attempts as number)).toEqual([1, 1]);
    expect(await countResults(id)).toMatchObject({ outcomes: { n: MEMBERS, d: MEMBERS } });
  });
});
