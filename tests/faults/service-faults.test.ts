// RELIABILITY figures 3 and 4: Redis restarted, Redis's queue data lost, and PostgreSQL restarted
// in the middle of a schedule. Workers carry on without being restarted; every schedule completes
// with exactly one result per member and check.
import { execFileSync } from "node:child_process";

import { Redis } from "ioredis";
import { afterAll, describe, expect, it } from "vitest";

import { countResults, createDrill, submitDrillSchedule, waitForProgress } from "@/tests/helpers/drill";

const drill = createDrill("faults");
const MEMBERS = 6_000;
afterAll(() => drill.killAll());

function submit(label: string) {
  return submitDrillSchedule(drill, { markPrefix: "F", memberCount: MEMBERS, label });
}

async function expectComplete(id: string) {
  await waitForProgress(id, (p) => p.status === "completed", 180_000);
  expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
}

describe("service faults during a schedule", () => {
  it("Redis's queue data lost: the reconciler finishes the schedule from PostgreSQL", { timeout: 240_000 }, async () => {
    drill.startWorker();
    const id = await submit("Flush drill");
    await waitForProgress(id, (p) => p.chunks_done >= 3, 60_000);
    // Delete every key of this drill's queues: what a FLUSHDB would do to them.
    const redis = new Redis(process.env.REDIS_URL!);
    const keys = await redis.keys(`${drill.prefix}:*`);
    if (keys.length > 0) await redis.del(...keys);
    await redis.quit();
    await expectComplete(id);
  });

  it("Redis restarted: workers resume by themselves", { timeout: 240_000 }, async () => {
    const id = await submit("Redis restart drill");
    await waitForProgress(id, (p) => p.chunks_done >= 3, 60_000);
    execFileSync("bash", ["docker-local/redis.sh", "stop"], { stdio: "ignore" });
    await new Promise((r) => setTimeout(r, 1500));
    execFileSync("bash", ["docker-local/redis.sh", "start"], { stdio: "ignore" });
    await expectComplete(id);
  });

  it("PostgreSQL restarted: jobs retry, nothing lost or doubled", { timeout: 240_000 }, async () => {
    const id = await submit("PostgreSQL restart drill");
    await waitForProgress(id, (p) => p.chunks_done >= 3, 60_000);
    // The same script npm test started the cluster with: same data folder, port and server options
    // (lib.sh derives them from the SAGLINE_* environment this process inherited).
    const database = new URL(process.env.DATABASE_URL!).pathname.slice(1);
    execFileSync("bash", ["docker-local/postgres.sh", "stop"], { stdio: "ignore" });
    execFileSync("bash", ["docker-local/postgres.sh", "start", database], { stdio: "ignore" });
    await expectComplete(id);
  });
});
