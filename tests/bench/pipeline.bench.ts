// bench:pipeline: POST a generated 100,000-member schedule (invented scenario), time it from the
// POST to the last result stored, read the peak resident memory (VmHWM) of the largest process in
// the web group and of the largest process in the worker groups (the largest process, not a sum),
// time a raw PostgreSQL COPY of the same result rows, outcomes and checks (read back
// afterwards), for comparison, and print where the time went (stages from PostgreSQL's
// timestamps, the intake steps repeated in this process). Targets: 6 s, ratio 2.0. Run it through `npm run bench:pipeline`, which starts the services
// it needs.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";

import { closeDb, getSql } from "@/db/client";
import { copyRows } from "@/lib/server/copy-rows";
import { readScheduleJson } from "@/lib/server/schedules/read-schedule-body";
import { CHUNK_SIZE, prepareSchedule } from "@/lib/server/schedules/submit-schedule";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 100_000);
const appUrl = process.env.APP_URL!;
const runDir = process.env.SAGLINE_RUN_DIR!;

function createMember(i: number) {
  // Tollgate Wharf (invented): steel floor beams on a grid, spans 3 to 9 m, a fifth of them two-span.
  const spanM = 3 + (i % 13) * 0.5;
  const twoSpan = i % 5 === 0;
  // The shared test beam, with its spans, supports and loads varied; overriding keeps its key order.
  return {
    ...createBeam(`TW-${String(i).padStart(6, "0")}`, spanM),
    spans: twoSpan ? [spanM, spanM] : [spanM],
    supports: twoSpan ? ["pinned", "roller", "roller"] : ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 2 + (i % 4) },
      { case: "live", type: "uniform", w: 4 + (i % 6) },
    ],
  };
}

/** The peak resident memory (VmHWM) of the largest single process in the pid file's process group, in MB. */
function getLargestProcessPeakRssMb(pidFile: string): number {
  const leader = readFileSync(join(runDir, pidFile), "utf8").trim();
  const pids = execFileSync("ps", ["-o", "pid=", "-g", leader], { encoding: "utf8" }).split("\n").map((s) => s.trim()).filter(Boolean);
  let peakKb = 0;
  for (const pid of pids) {
    try {
      const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
      if (match) peakKb = Math.max(peakKb, Number(match[1]));
    } catch {
      // the process ended meanwhile
    }
  }
  return Math.round(peakKb / 1024);
}

type Row = readonly (string | number | boolean | null)[];
interface ResultTable {
  table: "member_outcomes" | "member_checks";
  columns: readonly string[];
  order: string;
}

// Every result row the pipeline writes: one outcome per member, one row per member and check.
const RESULT_TABLES: ResultTable[] = [
  { table: "member_outcomes", columns: ["schedule_id", "member_index", "mark", "category", "pass", "governing_check", "utilization", "factor_of_safety", "limit_ratio", "achieved_ratio", "detail"], order: "member_index" },
  {
    table: "member_checks",
    columns: ["schedule_id", "member_index", "check_key", "combination_id", "span_index", "span_kind", "deflection_mm", "at_mm", "allowed_mm", "utilization", "factor_of_safety", "pass", "limit_ratio", "achieved_ratio"],
    order: "member_index, check_key",
  },
];

/** The rows the pipeline stored in one result table, read back after the run (untimed). */
async function readStoredRows(scheduleId: string, { table, columns, order }: ResultTable): Promise<Row[]> {
  // detail is json: read it as its text, as the workers wrote it
  const list = columns.map((column) => (column === "detail" ? "detail::text as detail" : column)).join(", ");
  const rows = await getSql().unsafe(`select ${list} from ${table} where schedule_id = $1 order by ${order}`, [scheduleId]);
  return rows.map((r) => columns.map((column) => r[column] as string | number | boolean | null));
}

/**
 * The same rows, values and all, written by plain COPY (the same copyRows path the workers use)
 * into logged tables shaped like the result tables (same keys and indexes): the floor for
 * storing this schedule's results. Seconds per table.
 */
async function timeRawCopy(stored: { table: ResultTable; rows: Row[] }[]): Promise<number[]> {
  const sql = getSql();
  const seconds: number[] = [];
  for (const { table, rows } of stored) {
    const copy = `bench_raw_${table.table}`;
    await sql.unsafe(`drop table if exists ${copy}; create table ${copy} (like ${table.table} including all)`);
    const start = performance.now();
    await sql.begin((tx) => copyRows(tx, copy, table.columns, rows));
    seconds.push((performance.now() - start) / 1000);
    await sql.unsafe(`drop table ${copy}`);
  }
  return seconds;
}

/**
 * Where the time went, from PostgreSQL's own timestamps (same machine, same clock): the store
 * transaction's start (created_at, after the body was read and checked), the first and last chunk
 * done, and completion. Seconds from `postStartMs`.
 */
async function readStageTimes(scheduleId: string, postStartMs: number) {
  const [row] = await getSql()`
    select extract(epoch from s.created_at) * 1000 as stored_ms, extract(epoch from s.completed_at) * 1000 as completed_ms,
      (select extract(epoch from min(done_at)) * 1000 from schedule_chunks where schedule_id = s.id) as first_done_ms,
      (select extract(epoch from max(done_at)) * 1000 from schedule_chunks where schedule_id = s.id) as last_done_ms
    from schedules s where s.id = ${scheduleId}`;
  const at = (ms: unknown) => (Number(ms) - postStartMs) / 1000;
  return { storing: at(row!.stored_ms), firstChunkDone: at(row!.first_done_ms), lastChunkDone: at(row!.last_done_ms), completed: at(row!.completed_ms) };
}

/** The web process's intake work on this body, repeated in this process (untimed in the run): seconds per step. */
function timeIntakeSteps(bodyBytes: Uint8Array) {
  const lap = (() => {
    let last = performance.now();
    return () => {
      const now = performance.now();
      const seconds = (now - last) / 1000;
      last = now;
      return seconds;
    };
  })();
  const doc = readScheduleJson(bodyBytes, "body");
  const schema = lap();
  const prepared = prepareSchedule({ doc });
  const intake = lap();
  for (let first = 0; first < prepared.members.count; first += CHUNK_SIZE) prepared.members.chunkText(first, Math.min(first + CHUNK_SIZE, prepared.members.count));
  return { schema, intake, chunkTexts: lap() };
}

const median = (values: number[]) => [...values].sort((x, y) => x - y)[Math.floor(values.length / 2)]!;

const secret = await createTestKey(["schedules:write", "results:read"]);
const body = JSON.stringify(
  createScheduleDoc(
    Array.from({ length: MEMBERS }, (_, i) => createMember(i)),
    "Tollgate Wharf, all levels (benchmark)",
  ),
);
// The first schedule the freshly started server sees: no warm-up POST beforehand.
console.log(`posting ${MEMBERS} members (${(body.length / 1e6).toFixed(1)} MB JSON)`);

const start = performance.now();
const postStartMs = Date.now();
const response = await fetch(`${appUrl}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${secret}`, "content-type": "application/json" }, body });
if (response.status !== 202) throw new Error(`POST answered ${response.status}: ${(await response.text()).slice(0, 500)}`);
const { id } = (await response.json()) as { id: string };
const accepted = (performance.now() - start) / 1000;
const sql = getSql();
for (;;) {
  const [row] = await sql`select status from schedules where id = ${id}`;
  if (row?.status === "failed") throw new Error(`schedule ${id} failed after ${((performance.now() - start) / 1000).toFixed(2)} s; see the worker logs`);
  if (row?.status === "completed") break;
  await new Promise((r) => setTimeout(r, 50));
}
const seconds = (performance.now() - start) / 1000;
const stages = await readStageTimes(id, postStartMs);
const intakeSteps = timeIntakeSteps(new TextEncoder().encode(body));
const stored = [];
for (const table of RESULT_TABLES) stored.push({ table, rows: await readStoredRows(id, table) });
const [outcomeRows, checkRows] = stored.map((s) => s.rows.length) as [number, number];
if (outcomeRows !== MEMBERS) throw new Error(`read back ${outcomeRows} outcome rows for ${MEMBERS} members`);
// Median of three: one COPY of about a second is at the mercy of whatever else the machine does.
const copyRuns: number[][] = [];
for (let run = 0; run < 3; run++) copyRuns.push(await timeRawCopy(stored));
const copySeconds = median(copyRuns.map((run) => run[0]! + run[1]!));
const checksOnlySeconds = median(copyRuns.map((run) => run[1]!));
const webRss = getLargestProcessPeakRssMb("web.pid");
const workerRss = Math.max(getLargestProcessPeakRssMb("worker.pid"), getLargestProcessPeakRssMb("worker-2.pid"));
await closeDb();
console.log(`accepted (202) after ${accepted.toFixed(2)} s; all ${MEMBERS} members checked, ${outcomeRows} outcome and ${checkRows} check rows stored after ${seconds.toFixed(2)} s`);
console.log(
  `raw COPY of the same ${outcomeRows + checkRows} result rows: ${copyRuns.map((run) => (run[0]! + run[1]!).toFixed(2)).join(", ")} s (median ${copySeconds.toFixed(2)} s); ` +
    `of the ${checkRows} check rows alone: median ${checksOnlySeconds.toFixed(2)} s, pipeline ratio to the check rows' COPY ${(seconds / checksOnlySeconds).toFixed(1)}`,
);
console.log(
  `stages from the POST: body read and checked, store began ${stages.storing.toFixed(2)} s (this process, same body: JSON Schema ${intakeSteps.schema.toFixed(2)} s, ` +
    `intake and member checks ${intakeSteps.intake.toFixed(2)} s, chunk texts ${intakeSteps.chunkTexts.toFixed(2)} s); 202 ${accepted.toFixed(2)} s; ` +
    `first chunk done ${stages.firstChunkDone.toFixed(2)} s; last chunk done ${stages.lastChunkDone.toFixed(2)} s; completed ${stages.completed.toFixed(2)} s`,
);
console.log(`bench:pipeline members=${MEMBERS} seconds=${seconds.toFixed(2)} copy_seconds=${copySeconds.toFixed(2)} ratio=${(seconds / copySeconds).toFixed(1)} web_rss_mb=${webRss} worker_rss_mb=${workerRss}`);
