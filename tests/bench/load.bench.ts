// bench:load: 20 concurrent submitters each POST 1,000-member schedules (invented scenario) for
// 60 s while an engineer's results page is read once a second; then waits (bounded) for the
// schedules to finish. Reports schedules completed, POST latency and time to completion
// percentiles, the page's p95 and errors. Run it through `npm run bench:load`; not a test.
import { closeDb, getSql } from "@/db/client";
import { demoUsers } from "@/db/seed-data";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

const SUBMITTERS = Number(process.env.BENCH_SUBMITTERS ?? 20);
const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 1000);
const DURATION_MS = Number(process.env.BENCH_DURATION_S ?? 60) * 1000;
/** How long, after the last POST, the schedules get to finish before the unfinished are counted. */
const GRACE_MS = Number(process.env.BENCH_GRACE_S ?? 300) * 1000;
const appUrl = process.env.APP_URL!;

function percentile(values: number[], p: number): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

/** Signs the demo engineer in through next-auth's credentials endpoint; returns the session cookie header. */
async function signInEngineer(): Promise<string> {
  const engineer = demoUsers.find((u) => u.role === "engineer")!;
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = new Map<string, string>();
  const keep = (response: Response) => {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const at = pair!.indexOf("=");
      jar.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
  };
  keep(csrf);
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const response = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", origin: appUrl, cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email: engineer.email, password: engineer.password, json: "true" }),
  });
  keep(response);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`engineer sign-in failed: ${response.status}`);
  return cookie();
}

const members = Array.from({ length: MEMBERS }, (_, i) => createBeam(`QL-${String(i).padStart(4, "0")}`, 3 + (i % 13) * 0.5, 4 + (i % 6)));
const body = JSON.stringify(createScheduleDoc(members, "Quarrel Lane Annex, level 2 (invented)"));
const postLatencyMs: number[] = [];
const submitted: { id: string; postedAtMs: number }[] = [];
const pageMs: number[] = [];
let errors = 0;
const errorKinds = new Map<string, number>();
const countError = (kind: string) => {
  errors += 1;
  errorKinds.set(kind, (errorKinds.get(kind) ?? 0) + 1);
};

const keys = await Promise.all(Array.from({ length: SUBMITTERS }, () => createTestKey()));
const cookie = await signInEngineer();
const endAt = Date.now() + DURATION_MS;

async function submitter(key: string) {
  while (Date.now() < endAt) {
    const started = Date.now();
    try {
      const response = await fetch(`${appUrl}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${key}`, "content-type": "application/json" }, body });
      const answer = (await response.json()) as { id?: string };
      postLatencyMs.push(Date.now() - started);
      if (response.status !== 202 && response.status !== 201) countError(`POST ${response.status}`);
      else if (answer.id) submitted.push({ id: answer.id, postedAtMs: started });
    } catch (error) {
      countError(`POST ${(error as Error).message}`);
    }
  }
}

async function readResultsPage() {
  while (Date.now() < endAt) {
    const next = Date.now() + 1000;
    const target = submitted[0]?.id;
    if (target) {
      const started = Date.now();
      try {
        const response = await fetch(`${appUrl}/schedules/${target}`, { headers: { cookie }, redirect: "manual" });
        await response.text();
        pageMs.push(Date.now() - started);
        if (response.status !== 200) countError(`page ${response.status}`);
      } catch (error) {
        countError(`page ${(error as Error).message}`);
      }
    }
    await new Promise((r) => setTimeout(r, Math.max(0, next - Date.now())));
  }
}

await Promise.all([...keys.map((key) => submitter(key)), readResultsPage()]);
console.log(`bench:load ${submitted.length} schedules accepted in ${DURATION_MS / 1000} s; waiting up to ${GRACE_MS / 1000} s for them to finish`);

const sql = getSql();
const ids = submitted.map((s) => s.id);
const waitUntil = Date.now() + GRACE_MS;
for (;;) {
  const [row] = await sql`select count(*)::int as open from schedules where id = any(${ids}) and status not in ('completed', 'failed')`;
  if ((row!.open as number) === 0 || Date.now() > waitUntil) break;
  await new Promise((r) => setTimeout(r, 1000));
}
const finished = await sql`select id, status, extract(epoch from completed_at)::float8 * 1000 as completed_ms from schedules where id = any(${ids})`;
const postedAt = new Map(submitted.map((s) => [s.id, s.postedAtMs]));
const completeS: number[] = [];
let unfinished = 0;
for (const row of finished) {
  if (row.status === "completed") completeS.push(((row.completed_ms as number) - postedAt.get(row.id as string)!) / 1000);
  else if (row.status === "failed") countError("schedule failed");
  else unfinished += 1;
}
if (unfinished > 0) countError(`unfinished after grace`);
for (const [kind, n] of errorKinds) console.log(`bench:load error ${kind}: ${n}`);
const fmt = (v: number) => Math.round(v);
console.log(`bench:load POST latency ms p50=${fmt(percentile(postLatencyMs, 50))} p95=${fmt(percentile(postLatencyMs, 95))} p99=${fmt(percentile(postLatencyMs, 99))} (${postLatencyMs.length} POSTs)`);
console.log(`bench:load time to completion s p50=${percentile(completeS, 50).toFixed(1)} p95=${percentile(completeS, 95).toFixed(1)} p99=${percentile(completeS, 99).toFixed(1)}; unfinished=${unfinished}`);
console.log(`bench:load results page ms p50=${fmt(percentile(pageMs, 50))} p95=${fmt(percentile(pageMs, 95))} (${pageMs.length} reads)`);
await closeDb();
console.log(`bench:load schedules=${completeS.length} post_p95_ms=${fmt(percentile(postLatencyMs, 95))} complete_p95_s=${fmt(percentile(completeS, 95))} page_p95_ms=${fmt(percentile(pageMs, 95))} errors=${errors}`);
