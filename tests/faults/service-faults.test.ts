// RELIABILITY figures 3 and 4: Redis restarted, Redis flushed, and PostgreSQL restarted (while a
// worker is inside a result COPY) in the middle of a schedule. Each drill first proves the fault hit
// an unfinished schedule, then that the same worker process (never restarted) finishes it with
// exactly one result per member and check, within the stated time. 20,000 members in chunks of
// 2,000 (production's size, so each result COPY is long enough to be caught in flight).
import { execFileSync } from "node:child_process";

import { Redis } from "ioredis";
import { afterAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { countResults, createDrill, getScheduleProgress, submitDrillSchedule, waitForFinalState, waitForProgress } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("faults");
const MEMBERS = 20_000;
const CHUNKS = MEMBERS / 2000;
/** Fault to final state (stated in README). */
const FINISH_WITHIN_MS = 240_000;
afterAll(async () => {
  drill.killAll();
  await closeQueues();
});

function submit(label: string) {
  return submitDrillSchedule(drill, { markPrefix: "F", memberCount: MEMBERS, label, chunkSize: 2000 });
}

/** The fault must land mid-schedule: some chunks stored, the schedule not finished. */
async function expectUnfinished(id: string) {
  const progress = await getScheduleProgress(id);
  expect(progress.status).not.toMatch(/completed|failed/);
  expect(progress.chunks_done).toBeLessThan(CHUNKS);
  return progress;
}

/** Completed after the fault (so the fault hit it unfinished), once, by the same worker process. */
async function expectCompleteOnce(id: string, worker: ReturnType<typeof drill.startWorker>, faultAtMs: number) {
  const final = await waitForFinalState(id, FINISH_WITHIN_MS);
  expect(final.status).toBe("completed");
  expect(final.completedAtMs).toBeGreaterThan(faultAtMs);
  expect(final.checked_count).toBe(MEMBERS);
  expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
  // The worker carried on by itself: the process that saw the fault is the one still running.
  expect(worker.exitCode).toBeNull();
  return final;
}

describe("service faults during a schedule", () => {
  const worker = drill.startWorker({ CHECK_CONCURRENCY: "2" });

  it("Redis flushed: the reconciler finishes the schedule from PostgreSQL", { timeout: 400_000 }, async () => {
    const id = await submit("Flush drill");
    await waitForProgress(id, (p) => p.chunks_done >= 1, 180_000);
    const redis = new Redis(process.env.REDIS_URL!);
    await expectUnfinished(id);
    const faultAtMs = Date.now();
    // The faults suite's Redis database is its own (test-faults.sh): FLUSHDB loses every queued job.
    await redis.flushdb();
    expect(await redis.dbsize()).toBeLessThanOrEqual(5);
    await redis.quit();
    const final = await expectCompleteOnce(id, worker, faultAtMs);
    console.log(`[faults] flush: completed ${final.seconds.toFixed(1)} s after submission`);
  });

  it("Redis restarted: workers resume by themselves", { timeout: 400_000 }, async () => {
    const id = await submit("Redis restart drill");
    await waitForProgress(id, (p) => p.chunks_done >= 1, 180_000);
    await expectUnfinished(id);
    const faultAtMs = Date.now();
    execFileSync("bash", ["docker-local/redis.sh", "stop"], { stdio: "ignore" });
    await new Promise((r) => setTimeout(r, 1500));
    execFileSync("bash", ["docker-local/redis.sh", "start"], { stdio: "ignore" });
    const final = await expectCompleteOnce(id, worker, faultAtMs);
    console.log(`[faults] Redis restart: completed ${final.seconds.toFixed(1)} s after submission`);
  });

  it("PostgreSQL restarted during a result COPY: jobs retry, nothing lost or doubled", { timeout: 400_000 }, async () => {
    const id = await submit("PostgreSQL restart drill");
    // Catch a worker inside the COPY of this schedule's results, then stop the server under it.
    const sql = getSql();
    await waitForProgress(id, (p) => p.status === "checking", 180_000);
    await expectUnfinished(id);
    let copying = false;
    const deadline = Date.now() + 180_000;
    while (!copying && Date.now() < deadline) {
      const [row] = await sql`select count(*)::int as n from pg_stat_activity where state = 'active' and datname = current_database() and query ilike 'copy member_%'`;
      copying = (row!.n as number) > 0;
      if (!copying) await new Promise((r) => setTimeout(r, 5));
    }
    expect(copying).toBe(true);
    // The same script test-faults.sh started the cluster with: same data folder, port and options.
    const database = new URL(process.env.DATABASE_URL!).pathname.slice(1);
    const faultAtMs = Date.now();
    execFileSync("bash", ["docker-local/postgres.sh", "stop"], { stdio: "ignore" });
    execFileSync("bash", ["docker-local/postgres.sh", "start", database], { stdio: "ignore" });
    // The COPY caught in flight was rolled back with its transaction; the completion comes after.
    const final = await expectCompleteOnce(id, worker, faultAtMs);
    console.log(`[faults] PostgreSQL restart mid-COPY: completed ${final.seconds.toFixed(1)} s after submission`);
  });
});
