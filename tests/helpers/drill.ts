// Shared pieces of the fault drills: workers and web processes of their own on a private queue
// prefix, and waiting on a schedule straight from PostgreSQL.
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, openSync } from "node:fs";

import { getSql } from "@/db/client";
import { getChunkTotals } from "@/db/queries/schedules";
import { demoOrganizations } from "@/db/seed-data";

import { createBeam, createScheduleDoc } from "./schedules";

export function createDrill(name: string) {
  const prefix = `sagline-${name}-${Date.now().toString(36)}`;
  const children = new Set<ChildProcess>();

  // Every worker of the drill writes to one log, for reading after a failure.
  mkdirSync(".local/logs", { recursive: true });
  const log = openSync(`.local/logs/drill-${prefix}.log`, "a");

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
      stdio: ["ignore", log, log],
      detached: true,
    });
    children.add(child);
    return child;
  }

  /**
   * A web process of the built app (`next start`, as test.sh and the supervisor run it) on a port of
   * the drill's own, queueing on the drill's prefix so the drill's workers take its schedules.
   */
  function startWeb(port: number, extraEnv: Record<string, string> = {}): ChildProcess {
    const url = `http://127.0.0.1:${port}`;
    const child = spawn("node", ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)], {
      env: { ...process.env, REDIS_PREFIX: prefix, APP_URL: url, NEXTAUTH_URL: url, ...extraEnv },
      stdio: ["ignore", log, log],
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

  return { prefix, startWorker, startWeb, killHard, killAll };
}

/** Waits until the web process on `port` answers its health check with 200 (PostgreSQL and Redis up). */
export async function waitForWeb(port: number, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const status = await fetch(`http://127.0.0.1:${port}/api/health`, { signal: AbortSignal.timeout(5_000) }).then(
      (r) => r.status,
      () => null,
    );
    if (status === 200) return;
    if (Date.now() > deadline) throw new Error(`the web process on port ${port} did not become healthy within ${timeoutMs} ms (last answer ${status})`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Resolves when the process has exited, with its exit code or the signal that ended it. */
export function waitForExit(child: ChildProcess, timeoutMs: number): Promise<{ code: number | null; signal: NodeJS.Signals | null }> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve({ code: child.exitCode, signal: child.signalCode });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`process ${child.pid} still running after ${timeoutMs} ms`)), timeoutMs);
    child.once("exit", (code, signal) => {
      clearTimeout(timer);
      resolve({ code, signal });
    });
  });
}

/** The ports test-faults.sh hands the drills that start web processes (the caller's port block). */
export const drillPorts = {
  web: Number(process.env.SAGLINE_TEST_APP_PORT ?? 3793),
  spare: Number(process.env.SAGLINE_TEST_SPARE_PORT ?? 3799),
  partner: Number(process.env.SAGLINE_TEST_PARTNER_PORT ?? 3795),
};

export type DrillScheduleInput = {
  markPrefix: string;
  memberCount: number;
  label: string;
  /** Members per chunk (100 unless set; production's 2,000 for the fairness drill). */
  chunkSize?: number;
  organizationId?: string;
  /** The members, when not the default simply supported beams. */
  members?: unknown[];
};

/**
 * Submits a drill schedule of simply supported beams (marks `${markPrefix}-0`, ...) straight to the
 * intake, in 100-member chunks on the drill's queue prefix. Both are set before submit-schedule is
 * first imported, because it reads the chunk size and the queues read the prefix when they load
 * (so one test file uses one chunk size). Returns the schedule id.
 */
export async function submitDrillSchedule(drill: { prefix: string }, input: DrillScheduleInput): Promise<string> {
  process.env.REDIS_PREFIX = drill.prefix;
  process.env.CHECK_CHUNK_SIZE = String(input.chunkSize ?? 100);
  const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
  const members = input.members ?? createDrillBeams(input.markPrefix, input.memberCount);
  const doc = createScheduleDoc(members, `${input.label} ${drill.prefix}`);
  return (await submitSchedule({ organizationId: input.organizationId ?? demoOrganizations.engineering.id, source: "api-json", doc })).id;
}

export function createDrillBeams(markPrefix: string, memberCount: number) {
  return Array.from({ length: memberCount }, (_, i) => createBeam(`${markPrefix}-${i}`, 3 + (i % 7), 5 + (i % 5)));
}

export async function getScheduleProgress(id: string) {
  // Progress as the chunks record it (the schedule's own totals are written when it ends).
  const [row] = await getSql()`select status, chunk_count from schedules where id = ${id}`;
  const totals = await getChunkTotals(getSql(), id);
  return { status: row!.status as string, chunk_count: row!.chunk_count as number, chunks_done: totals.chunks_done, checked_count: totals.checked_count };
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

/** Waits for the schedule to reach a final state; resolves with the status and the seconds it took from `sinceMs`. */
export async function waitForFinalState(id: string, timeoutMs: number) {
  const progress = await waitForProgress(id, (p) => p.status === "completed" || p.status === "failed", timeoutMs);
  const [row] = await getSql()`
    select extract(epoch from completed_at - created_at)::float8 as seconds, extract(epoch from completed_at)::float8 * 1000 as completed_ms from schedules where id = ${id}`;
  return { ...progress, seconds: row!.seconds as number, completedAtMs: row!.completed_ms as number };
}

/** Exactly one outcome per member and one row per member and check. */
export async function countResults(id: string) {
  const sql = getSql();
  const [outcomes] = await sql`select count(*)::int as n, count(distinct member_index)::int as d from member_outcomes where schedule_id = ${id}`;
  const [checks] = await sql`select count(*)::int as n, count(distinct (member_index, check_key))::int as d from member_checks where schedule_id = ${id}`;
  return { outcomes, checks };
}
