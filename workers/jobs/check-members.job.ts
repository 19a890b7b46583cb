import { z } from "zod";

import { checkChunk } from "@/lib/server/schedules/check-chunk";
import { withTimeout } from "@/lib/server/with-timeout";

import { defineJob } from "../define-job";
import { createEnginePool, type EnginePool } from "../engine/engine-pool";
import { queueNames } from "../queues";

const CHECK_CONCURRENCY_DEFAULT = 4;
/**
 * A chunk still running after this fails and is retried: a job whose promise never settles (a
 * database call lost with its connection) would otherwise keep renewing its lock and hold its
 * chunk forever. Far above the slowest allowed chunk; a late duplicate is harmless (checkChunk
 * writes a chunk once, under its row lock).
 */
const CHECK_JOB_TIMEOUT_MS = Number(process.env.CHECK_JOB_TIMEOUT_MS ?? 900_000);
let enginePool: EnginePool | undefined;

/** One engine thread per check job this process runs at once; workers/index.ts starts them at start, so they warm up before the first job. */
export function getEnginePool(): EnginePool {
  enginePool ??= createEnginePool(Number(process.env.CHECK_CONCURRENCY ?? CHECK_CONCURRENCY_DEFAULT));
  return enginePool;
}

export async function closeEnginePool(): Promise<void> {
  const pool = enginePool;
  enginePool = undefined;
  await pool?.close();
}

export const checkMembersJob = defineJob({
  queue: queueNames.checkMembers,
  concurrency: { env: "CHECK_CONCURRENCY", default: CHECK_CONCURRENCY_DEFAULT },
  payload: z.object({ scheduleId: z.string().regex(/^sch_[0-9a-z]+$/), chunkIndex: z.number().int().min(0) }),
  handle: ({ scheduleId, chunkIndex }) =>
    withTimeout(checkChunk(scheduleId, chunkIndex, getEnginePool().checkMembers), CHECK_JOB_TIMEOUT_MS, `chunk ${chunkIndex} of ${scheduleId} still running after ${CHECK_JOB_TIMEOUT_MS} ms`),
});
