// Member throughput of one worker process at a given check concurrency (engine threads):
// submits a schedule of production-size chunks, starts a worker with CHECK_CONCURRENCY, and times
// the first stored chunk to completion (so the process start and warm-up are not counted).
// Run by docker-local/bench-workers.sh (npm run bench:workers); not a test. The worker log goes to
// .local/logs/drill-sagline-throughput-*.log.
import { getSql, closeDb } from "@/db/client";
import { createDrill, submitDrillSchedule, waitForProgress } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 40_000);
const levels = (process.env.BENCH_CONCURRENCY ?? "1,2").split(",").map(Number);

const results: string[] = [];
for (const concurrency of levels) {
  const drill = createDrill(`throughput-${concurrency}`);
  const id = await submitDrillSchedule(drill, { markPrefix: "T", memberCount: MEMBERS, label: `Throughput c${concurrency}`, chunkSize: 2000 });
  drill.startWorker({ CHECK_CONCURRENCY: String(concurrency) });
  const first = await waitForProgress(id, (p) => p.chunks_done >= 1, 180_000);
  const started = performance.now();
  await waitForProgress(id, (p) => p.status === "completed", 600_000);
  const seconds = (performance.now() - started) / 1000;
  drill.killAll();
  const perSecond = Math.round((MEMBERS - first.checked_count) / seconds);
  results.push(`c${concurrency}=${perSecond}`);
  console.log(`bench:workers concurrency ${concurrency}: ${MEMBERS - first.checked_count} members in ${seconds.toFixed(1)} s = ${perSecond} members/s`);
  const sql = getSql();
  await sql`delete from member_checks where schedule_id = ${id}`;
  await sql`delete from member_outcomes where schedule_id = ${id}`;
  await sql`delete from schedules where id = ${id}`;
}
await closeQueues();
await closeDb();
console.log(`bench:workers members_per_s ${results.join(" ")}`);
