// Worker process entry: starts one BullMQ worker per job definition, with the concurrency its
// environment variable sets, and closes them all gracefully on SIGTERM (in-flight jobs finish).
import { Worker } from "bullmq";

import { closeDb } from "@/db/client";
import { getEnv } from "@/lib/env";

import { createWorkerConnection } from "./connection";
import { runJob } from "./define-job";
import { closeEnginePool, getEnginePool } from "./jobs/check-members.job";
import { closeQueues } from "./queues";
import { jobDefinitions } from "./registry";
import { startPeriodicTasks } from "./periodic";

const env = getEnv();
getEnginePool();
const workers = jobDefinitions.map((definition) => {
  const concurrency = Number(process.env[definition.concurrency.env] ?? definition.concurrency.default);
  const worker = new Worker(definition.queue, (job) => runJob(definition, job), {
    connection: createWorkerConnection(),
    prefix: env.REDIS_PREFIX,
    concurrency,
    // A killed worker's job is retried once its lock lapses; shorter in drills and tests.
    lockDuration: Number(process.env.WORKER_LOCK_MS ?? 30_000),
    stalledInterval: Number(process.env.WORKER_STALLED_CHECK_MS ?? 30_000),
    maxStalledCount: Number(process.env.WORKER_MAX_STALLED ?? 3),
  });
  worker.on("failed", (job, error) => console.error(`[worker] ${definition.queue} job ${job?.id} failed: ${error.message}`));
  worker.on("error", (error) => console.error(`[worker] ${definition.queue}: ${error.message}`));
  console.log(`[worker] ${definition.queue} started, concurrency ${concurrency}`);
  return worker;
});
const stopPeriodic = startPeriodicTasks();

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[worker] ${signal}: finishing in-flight jobs`);
  stopPeriodic();
  await Promise.all(workers.map((w) => w.close()));
  await closeEnginePool();
  await closeQueues();
  await closeDb();
  process.exit(0);
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
