// bench:dashboard: seeds one 100,000-member checked schedule (invented scenario) by COPY, then
// measures the server's response time (p95 over repeated GETs, signed in as the demo engineer) for
// the results page (first page, sorted by utilization, a page deep in the list), a filtered query,
// a mark search, the review queue and a member's page. It also times the COPY of the outcome rows
// into tables with and without the results indexes, the write cost those indexes add. Run it
// through `npm run bench:dashboard`, which starts the services it needs. Not a timed test.
import { closeDb, getSql } from "@/db/client";
import { findPagePosition } from "@/db/queries/results";
import { demoOrganizations, demoUsers } from "@/db/seed-data";
import { copyRows } from "@/lib/server/copy-rows";
import { createId } from "@/lib/server/ids";
import { checkMembers, checkRows, OUTCOME_INPUT_COLUMNS, outcomeRows, type Outcome } from "@/lib/server/schedules/check-chunk";
import { encodeResultCursor } from "@/lib/server/schedules/result-query";
import { parseSchedule } from "@/lib/engine/intake";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 100_000);
const RUNS = Number(process.env.BENCH_RUNS ?? 40);
const WARM_UP = 5;
const CHUNK = 2000;
const appUrl = process.env.APP_URL!;

/** Lumenbrook Depot, Hall B (invented): floor beams on a grid, spans 3 to 9 m, a fifth two-span, loads varied so some fail. */
function createMember(i: number) {
  const spanM = 3 + (i % 13) * 0.5;
  const twoSpan = i % 5 === 0;
  return {
    ...createBeam(`HB-${String(i).padStart(6, "0")}`, spanM),
    category: i % 7 === 0 ? "roof_beam" : "floor_beam",
    spans: twoSpan ? [spanM, spanM] : [spanM],
    supports: twoSpan ? ["pinned", "roller", "roller"] : ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 2 + (i % 4) },
      { case: "live", type: "uniform", w: 4 + (i % 6) },
    ],
  };
}
// The member varies with i mod 13, 5, 7, 4 and 6: checking one period of them covers every member.
const PERIOD = 13 * 5 * 7 * 4 * 3;

const sql = getSql();
const members = Array.from({ length: MEMBERS }, (_, i) => createMember(i));
const doc = createScheduleDoc(members.slice(0, PERIOD), "Lumenbrook Depot, Hall B, every level (benchmark)");
const { members: _unused, ...header } = doc;
void _unused;
const parsed = parseSchedule(doc);
if (!parsed.ok) throw new Error(`the generated schedule does not parse: ${parsed.issues[0]?.path}: ${parsed.issues[0]?.message}`);
const period = checkMembers(header, 0, members.slice(0, PERIOD));
const outcomes: Outcome[] = members.map((m, i) => ({ ...period[i % PERIOD]!, index: i, mark: m.mark }));
const passCount = outcomes.filter((o) => o.result?.pass).length;
const errorCount = outcomes.filter((o) => o.error !== null).length;
const failCount = MEMBERS - passCount - errorCount;

const OUTCOME_COLUMNS = ["schedule_id", "member_index", "mark", "category", "pass", "governing_check", "utilization", "factor_of_safety", "limit_ratio", "achieved_ratio", "detail", ...OUTCOME_INPUT_COLUMNS];
const CHECK_COLUMNS = ["schedule_id", "member_index", "check_key", "combination_id", "span_index", "span_kind", "deflection_mm", "at_mm", "allowed_mm", "utilization", "factor_of_safety", "pass", "limit_ratio", "achieved_ratio"];

const organizationId = demoOrganizations.engineering.id;
const scheduleId = createId("sch");
const chunkCount = Math.ceil(MEMBERS / CHUNK);
await sql.begin(async (tx) => {
  await tx`
    insert into schedules (id, organization_id, name, reference, status, source, profile, header, member_count, chunk_count, chunks_done, checked_count, pass_count, fail_count, error_count, queued_at, completed_at)
    values (${scheduleId}, ${organizationId}, ${doc.name}, 'HB-BENCH', 'completed', 'api-json', ${JSON.stringify(parsed.schedule.profile)}::jsonb, ${JSON.stringify(header)}::jsonb,
      ${MEMBERS}, ${chunkCount}, ${chunkCount}, ${MEMBERS}, ${passCount}, ${failCount}, ${errorCount}, now(), now())`;
  for (let c = 0; c < chunkCount; c++) {
    const part = members.slice(c * CHUNK, (c + 1) * CHUNK);
    await tx`
      insert into schedule_chunks (schedule_id, chunk_index, first_member, member_count, marks, members, done_at, pass_count, fail_count, error_count)
      values (${scheduleId}, ${c}, ${c * CHUNK}, ${part.length}, ${tx.array(part.map((m) => m.mark))}, ${JSON.stringify(part)}, now(), 0, 0, 0)`;
  }
});

/** Seconds to COPY the outcome rows into `table`, in one transaction as the workers write them. */
async function timeOutcomeCopy(table: string, id: string): Promise<number> {
  const start = performance.now();
  await sql.begin((tx) => copyRows(tx, table, OUTCOME_COLUMNS, outcomeRows(id, outcomes)));
  return (performance.now() - start) / 1000;
}

// Write cost of the results indexes: the same rows into a table with only the earlier indexes.
await sql.unsafe(`drop table if exists bench_outcomes_before; create table bench_outcomes_before (like member_outcomes including defaults);
  alter table bench_outcomes_before add primary key (schedule_id, member_index);
  create index on bench_outcomes_before (schedule_id, member_index) where not pass`);
const beforeSeconds = await timeOutcomeCopy("bench_outcomes_before", scheduleId);
await sql.unsafe(`drop table bench_outcomes_before`);
const withSeconds = await timeOutcomeCopy("member_outcomes", scheduleId);
await sql.begin((tx) => copyRows(tx, "member_checks", CHECK_COLUMNS, checkRows(scheduleId, outcomes)));
await sql`
  insert into member_reviews (schedule_id, member_index, organization_id, mark, category, outcome, governing_check, utilization)
  select schedule_id, member_index, ${organizationId}, mark, category, case when (detail ->> 'error') is not null then 'error' else 'fail' end, governing_check, utilization
  from member_outcomes where schedule_id = ${scheduleId} and not pass`;
await sql`analyze member_outcomes`;
await sql`analyze member_checks`;
await sql`analyze member_reviews`;
console.log(`seeded ${MEMBERS} members (${passCount} pass, ${failCount} fail, ${errorCount} error) in schedule ${scheduleId}`);
console.log(`COPY of ${MEMBERS} outcome rows: ${beforeSeconds.toFixed(2)} s with the earlier indexes, ${withSeconds.toFixed(2)} s with the results indexes`);

/** Signs in as the demo engineer the way the sign-in form does; returns the session cookie header. */
async function signInAsEngineer(): Promise<string> {
  const user = demoUsers.find((u) => u.role === "engineer")!;
  const jar = new Map<string, string>();
  const keep = (response: Response) => {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const at = pair!.indexOf("=");
      jar.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const answer = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie(), origin: appUrl },
    body: new URLSearchParams({ csrfToken, email: user.email, password: user.password, json: "true" }),
  });
  keep(answer);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`the engineer could not sign in (status ${answer.status})`);
  return cookie();
}

const cookie = await signInAsEngineer();

async function timeGet(path: string): Promise<number> {
  const start = performance.now();
  const response = await fetch(`${appUrl}${path}`, { headers: { cookie }, redirect: "manual" });
  const text = await response.text();
  const ms = performance.now() - start;
  if (response.status !== 200) throw new Error(`GET ${path} answered ${response.status}: ${text.slice(0, 300)}`);
  return ms;
}

function p95(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(sorted.length * 0.95) - 1)]!;
}

const deep = await findPagePosition(scheduleId, { sort: "utilization", filters: {}, limit: 50, page: Math.floor(MEMBERS / 50) - 10 });
if (!deep) throw new Error("no deep position");
const base = `/schedules/${scheduleId}`;
const targets = {
  results: base,
  sorted: `${base}?sort=utilization`,
  deep: `${base}?sort=utilization&cursor=${encodeResultCursor(deep)}`,
  filtered: `${base}?status=fail&category=roof_beam&utilizationAbove=1.1`,
  search: `${base}?mark=hb-0987`,
  review: "/review",
  member: `${base}/members/HB-054321`,
};
const figures: Record<string, number> = {};
for (const [name, path] of Object.entries(targets)) {
  for (let i = 0; i < WARM_UP; i++) await timeGet(path);
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) times.push(await timeGet(path));
  figures[name] = Math.round(p95(times));
  console.log(`${name}: GET ${path.replace(/cursor=[^&]+/, "cursor=…")} p95 ${figures[name]} ms, median ${Math.round([...times].sort((a, b) => a - b)[Math.floor(times.length / 2)]!)} ms over ${RUNS}`);
}
await closeDb();
console.log(
  `bench:dashboard results_p95_ms=${figures.results} sorted_p95_ms=${figures.sorted} deep_p95_ms=${figures.deep} filtered_p95_ms=${figures.filtered} search_p95_ms=${figures.search} review_p95_ms=${figures.review} member_p95_ms=${figures.member}`,
);
