// bench:pipeline: POST a generated 100,000-member schedule (invented scenario), time it from the
// POST to the last result stored, read the peak resident memory of the web and worker processes,
// and time a raw PostgreSQL COPY of the same result rows (read back afterwards) for comparison. Run it through
// `npm run bench:pipeline`, which starts the services it needs.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";

import { closeDb, getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { copyRows } from "@/lib/server/copy-rows";

const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 100_000);
const appUrl = process.env.APP_URL!;
const runDir = process.env.SAGLINE_RUN_DIR!;

function createMember(i: number) {
  // Tollgate Wharf (invented): steel floor beams on a grid, spans 3 to 9 m, a fifth of them two-span.
  const spanM = 3 + (i % 13) * 0.5;
  const twoSpan = i % 5 === 0;
  return {
    mark: `TW-${String(i).padStart(6, "0")}`,
    category: "floor_beam",
    quantity: 1,
    material: "steel-s355",
    section: { shape: "i_plate", bf: 150, tf: 10.7, d: 300, tw: 7.1 },
    spans: twoSpan ? [spanM, spanM] : [spanM],
    supports: twoSpan ? ["pinned", "roller", "roller"] : ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 2 + (i % 4) },
      { case: "live", type: "uniform", w: 4 + (i % 6) },
    ],
  };
}

function groupPeakRssMb(pidFile: string): number {
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

const CHECK_COLUMNS = ["schedule_id", "member_index", "check_key", "combination_id", "span_index", "span_kind", "deflection_mm", "at_mm", "allowed_mm", "utilization", "factor_of_safety", "pass"] as const;
type CheckRow = readonly (string | number | boolean | null)[];

/** The check rows the pipeline stored, read back after the run (untimed), in member order. */
async function readStoredChecks(scheduleId: string): Promise<CheckRow[]> {
  const rows = await getSql().unsafe(`select ${CHECK_COLUMNS.join(", ")} from member_checks where schedule_id = $1 order by member_index, check_key`, [scheduleId]);
  return rows.map((r) => CHECK_COLUMNS.map((column) => r[column] as string | number | boolean | null));
}

/**
 * The same rows, values and all, written by one plain COPY (the same copyRows path the workers
 * use) into a logged table shaped like member_checks (same primary key): the floor for storing
 * this schedule's results.
 */
async function timeRawCopy(rows: CheckRow[]): Promise<number> {
  const sql = getSql();
  await sql`drop table if exists bench_raw_copy`;
  await sql`create table bench_raw_copy (like member_checks including all)`;
  const start = performance.now();
  await sql.begin((tx) => copyRows(tx, "bench_raw_copy", CHECK_COLUMNS, rows));
  const seconds = (performance.now() - start) / 1000;
  await sql`drop table bench_raw_copy`;
  return seconds;
}

const { secret } = await createApiKey({ organizationId: demoOrganizations.engineering.id, name: "bench", scopes: ["schedules:write", "results:read"], createdBy: { commandLine: true } });
const body = JSON.stringify({
  format: "sagline.schedule/v1",
  name: "Tollgate Wharf, all levels (benchmark)",
  units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" },
  limits: { preset: "ibc-2021-floor" },
  members: Array.from({ length: MEMBERS }, (_, i) => createMember(i)),
});
// The first schedule the freshly started server sees: no warm-up POST beforehand.
console.log(`posting ${MEMBERS} members (${(body.length / 1e6).toFixed(1)} MB JSON)`);

const start = performance.now();
const response = await fetch(`${appUrl}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${secret}`, "content-type": "application/json" }, body });
if (response.status !== 202) throw new Error(`POST answered ${response.status}: ${(await response.text()).slice(0, 500)}`);
const { id } = (await response.json()) as { id: string };
const accepted = (performance.now() - start) / 1000;
const sql = getSql();
for (;;) {
  const [row] = await sql`select status, checked_count from schedules where id = ${id}`;
  if (row?.status === "completed" || row?.status === "failed") break;
  await new Promise((r) => setTimeout(r, 50));
}
const seconds = (performance.now() - start) / 1000;
const [counts] = await sql`select count(*)::int as n from member_checks where schedule_id = ${id}`;
const resultRows = counts!.n as number;
// Median of three: one COPY of about a second is at the mercy of whatever else the machine does.
const copyRuns: number[] = [];
const storedChecks = await readStoredChecks(id);
if (storedChecks.length !== resultRows) throw new Error(`read back ${storedChecks.length} check rows of ${resultRows}`);
for (let run = 0; run < 3; run++) copyRuns.push(await timeRawCopy(storedChecks));
const copySeconds = [...copyRuns].sort((x, y) => x - y)[1]!;
const webRss = groupPeakRssMb("web.pid");
const workerRss = Math.max(groupPeakRssMb("worker.pid"), groupPeakRssMb("worker-2.pid"));
await closeDb();
console.log(`accepted (202) after ${accepted.toFixed(2)} s; all ${MEMBERS} members checked and ${resultRows} check rows stored after ${seconds.toFixed(2)} s`);
console.log(`raw COPY of ${resultRows} result rows: ${copyRuns.map((x) => x.toFixed(2)).join(", ")} s (median ${copySeconds.toFixed(2)} s)`);
console.log(`bench:pipeline members=${MEMBERS} seconds=${seconds.toFixed(2)} copy_seconds=${copySeconds.toFixed(2)} ratio=${(seconds / copySeconds).toFixed(1)} web_rss_mb=${webRss} worker_rss_mb=${workerRss}`);
