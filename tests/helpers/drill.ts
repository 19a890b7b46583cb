// Shared pieces of the fault drills: workers of their own on a private queue prefix, and waiting
// on a schedule straight from PostgreSQL.
import { spawn, type ChildProcess } from "node:child_process";

import { getSql } from "@/db/client";

export function createDrill(name: string) {
  const prefix = `sagline-${name}-${Date.now().toString(36)}`;
  const children = new Set<ChildProcess>();

  function startWorker(extraEnv: Record<string, string> = {}): ChildProcess {
    const child = spawn("npx", ["tsx", "workers/index.ts"], {
      env: {
        ...process.env,
        REDIS_PREFIX: prefix,
        WORKER_LOCK_MS: "5000",
        WORKER_STALLED_CHECK_MS: "2000",
        WORKER_MAX_STALLED: "50",
        CHECK_CONCURRENCY: "2",
        RECONCILE_AFTER_SECONDS: "3",
        RECONCILE_EVERY_MS: "1000",
        ...extraEnv,
      },
      stdio: "ignore",
      detached: true,
    });
    children.add(child);
    return child;
  }

  function killHard(child: ChildProcess) {
    if (child.pid) {
      try {
        process.kill(-child.pid, "SIGKILL");
      } catch {
        // already gone
      }
    }
    children.delete(child);
  }

  function killAll() {
    for (const child of [...children]) killHard(child);
  }

  return { prefix, startWorker, killHard, killAll };
}

export async function getScheduleProgress(id: string) {
  // Progress as the chunks record it (the schedule's own totals are written when it ends).
  const [row] = await getSql()`
    select s.status, s.chunk_count, count(c.done_at)::int as chunks_done,
      coalesce(sum(c.member_count) filter (where c.done_at is not null), 0)::int as checked_count
    from schedules s join schedule_chunks c on c.schedule_id = s.id where s.id = ${id} group by s.id`;
  return row as { status: string; chunks_done: number; chunk_count: number; checked_count: number };
}

export async function waitForProgress(id: string, test: (p: Awaited<ReturnType<typeof getScheduleProgress>>) => boolean, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const progress = await getScheduleProgress(id).catch(() => null);
    if (progress && test(progress)) return progress;
    if (Date.now() > deadline) throw new Error(`schedule ${id}: ${JSON.stringify(progress)}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** Exactly one outcome per member and one row per member and check. */
export async function countResults(id: string) {
  const sql = getSql();
  const [outcomes] = await sql`select count(*)::int as n, count(distinct member_index)::int as d from member_outcomes where schedule_id = ${id}`;
  const [checks] = await sql`select count(*)::int as n, count(distinct (member_index, check_key))::int as d from member_checks where schedule_id = ${id}`;
  return { outcomes, checks };
}
