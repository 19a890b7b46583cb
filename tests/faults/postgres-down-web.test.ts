// PostgreSQL stopped while a web process of the built app is serving: submissions and result reads
// answer 503 problem+json with Retry-After (never 500, no stack or SQL in the body), and once
// PostgreSQL is back the same requests succeed from the same web process, never restarted. The
// submission refused during the outage stored nothing: sent again with its Idempotency-Key it is
// stored once, as a first answer, and completes. A signed-in engineer's dashboard page shows the
// calm notice (app/error.tsx) in place of a bare error page, and the page serves again once it is back.
import { execFileSync } from "node:child_process";

import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { createTestKey } from "@/tests/helpers/api-keys";
import { launchBrowser } from "@/tests/helpers/browser";
import { createTestMember } from "@/tests/helpers/people";
import { createScheduleBody, getWithKey, postSchedule, type PostAnswer } from "@/tests/helpers/api-posts";
import { countResults, createDrill, drillPorts, waitForFinalState, waitForWeb } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("pgweb");
const MEMBERS = 20;
const WEB_START_MS = 120_000;
/** PostgreSQL started again to the first successful answer of each request (stated in README). */
const RECOVER_WITHIN_MS = 30_000;
/** PostgreSQL back to the refused submission's completion (stated in README). */
const FINISH_WITHIN_MS = 90_000;
const url = `http://127.0.0.1:${drillPorts.web}`;
const database = new URL(process.env.DATABASE_URL!).pathname.slice(1);
let apiKey: string;
let pgStopped = false;
let browser: Browser | undefined;

function stopPostgres() {
  execFileSync("bash", ["docker-local/postgres.sh", "stop"], { stdio: "ignore" });
  pgStopped = true;
}

function startPostgres() {
  // The same script test-faults.sh started the cluster with: same data folder, port and options.
  execFileSync("bash", ["docker-local/postgres.sh", "start", database], { stdio: "ignore" });
  pgStopped = false;
}

beforeAll(async () => {
  apiKey = await createTestKey(["schedules:write", "results:read"]);
  drill.startWorker({ ENGINE_WARM_UP: "0" });
});

afterAll(async () => {
  if (pgStopped) startPostgres();
  await browser?.close();
  drill.killAll();
  await closeQueues();
});

/** A 503 as the API promises it: problem+json, Retry-After, and nothing of the server's insides. */
function expectUnavailable(answer: PostAnswer, path: string) {
  expect({ path, status: answer.status, contentType: answer.contentType }).toEqual({ path, status: 503, contentType: "application/problem+json" });
  expect(Number(answer.retryAfter)).toBeGreaterThan(0);
  expect(answer.body).toMatchObject({ type: "https://sagline.dev/problems/unavailable", title: "Service unavailable", status: 503 });
  expect(answer.text).not.toMatch(/ECONNREFUSED|CONNECTION_|\bselect\b|\binsert\b|\bfrom "|api_keys|127\.0\.0\.1|:\d{4,5}\b|\.js:\d+|\n\s+at /i);
}

/** An engineer signed in to the drill's web process through the sign-in form, in Debian's chromium. */
async function signInEngineer(browser: Browser): Promise<Page> {
  const person = await createTestMember("engineer");
  const page = await browser.newPage();
  await page.goto(`${url}/sign-in`);
  const form = page.getByRole("form", { name: "Sign in" });
  await form.getByLabel("E-mail").fill(person.email);
  await form.getByLabel("Password").fill(person.password);
  await form.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((address) => address.pathname === "/schedules");
  return page;
}

/** Presses the notice's "Try again" until the schedules page is back in place of it; returns the presses. */
async function retryUntilServed(page: Page): Promise<number> {
  const deadline = Date.now() + RECOVER_WITHIN_MS;
  for (let presses = 1; ; presses++) {
    await page.getByRole("button", { name: "Try again" }).click();
    const served = await page
      .getByRole("heading", { name: "Schedules", level: 1 })
      .waitFor({ timeout: 2_000 })
      .then(
        () => true,
        () => false,
      );
    if (served) {
      expect(await page.getByText("Sagline could not open this page just now").count()).toBe(0);
      return presses;
    }
    if (Date.now() > deadline) throw new Error(`the schedules page did not come back within ${RECOVER_WITHIN_MS} ms of PostgreSQL starting (${presses} presses)`);
  }
}

/** Repeats the request until it succeeds; every answer on the way is the 503 or the success, never a 500. */
async function waitForSuccess(what: string, send: () => Promise<PostAnswer>, okStatus: number) {
  const deadline = Date.now() + RECOVER_WITHIN_MS;
  const seen: number[] = [];
  for (;;) {
    const answer = await send();
    seen.push(answer.status);
    if (answer.status === okStatus) return { answer, seen };
    if (answer.status !== 503 || Date.now() > deadline) throw new Error(`${what}: answers ${seen.join(", ")}; last ${answer.text.slice(0, 300)}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe("PostgreSQL stopped under a serving web process", () => {
  it("answers 503 with Retry-After while it is down, and serves again once it is back, without a restart", { timeout: 300_000 }, async () => {
    const web = drill.startWeb(drillPorts.web);
    await waitForWeb(drillPorts.web, WEB_START_MS);
    const before = await postSchedule(url, apiKey, `pg-before-${drill.prefix}`, createScheduleBody(`Outage drill before ${drill.prefix}`, MEMBERS));
    expect(before.status).toBe(202);
    const earlier = before.body!.id!;
    expect((await waitForFinalState(earlier, FINISH_WITHIN_MS)).status).toBe("completed");
    const resultsPath = `/api/v1/schedules/${earlier}/results`;
    const resultsBefore = await getWithKey(url, apiKey, resultsPath);
    expect(resultsBefore.status).toBe(200);

    const name = `Outage drill ${drill.prefix}`;
    const key = `pg-during-${drill.prefix}`;
    const body = createScheduleBody(name, MEMBERS);
    browser = await launchBrowser();
    const engineer = await signInEngineer(browser);
    stopPostgres();
    // The fault hit: PostgreSQL refuses connections, and the web process's own health check says so.
    await expect(getSql()`select 1`).rejects.toThrow();
    const health = await fetch(`${url}/api/health`);
    expect(health.status).toBe(503);
    expect(await health.json()).toMatchObject({ components: { postgres: "down" } });

    const during = {
      post: await postSchedule(url, apiKey, key, body),
      results: await getWithKey(url, apiKey, resultsPath),
      schedule: await getWithKey(url, apiKey, `/api/v1/schedules/${earlier}`),
      list: await getWithKey(url, apiKey, "/api/v1/schedules"),
    };
    console.log(`[postgres-down-web] while down: ${Object.entries(during).map(([k, a]) => `${k} ${a.status} (Retry-After ${a.retryAfter})`).join(", ")}`);
    for (const [what, answer] of Object.entries(during)) expectUnavailable(answer, what);
    // The dashboard: an error status for monitors, and for the engineer our notice with a retry, nothing internal.
    const page = await engineer.goto(`${url}/schedules`);
    console.log(`[postgres-down-web] while down: dashboard page /schedules ${page?.status()}`);
    expect(page?.status()).toBeGreaterThanOrEqual(500);
    const notice = engineer.getByRole("alert").filter({ hasText: "Sagline could not open this page just now" });
    await notice.waitFor({ timeout: 30_000 });
    expect(await engineer.locator("body").innerText()).not.toMatch(/ECONNREFUSED|CONNECTION_|\bselect\b|\binsert\b|api_keys|127\.0\.0\.1:\d|\.js:\d+|\n\s+at /i);

    const backAtMs = Date.now();
    startPostgres();
    const posted = await waitForSuccess("the submission", () => postSchedule(url, apiKey, key, body), 202);
    const results = await waitForSuccess("the results", () => getWithKey(url, apiKey, resultsPath), 200);
    const dashboardPresses = await retryUntilServed(engineer);
    const recoveredMs = Date.now() - backAtMs;
    console.log(`[postgres-down-web] back: submission ${posted.seen.join(", ")}, results ${results.seen.join(", ")}, dashboard after ${dashboardPresses} "Try again"; all served ${recoveredMs} ms after PostgreSQL started`);
    expect(recoveredMs).toBeLessThanOrEqual(RECOVER_WITHIN_MS);
    // The same process served before, during and after: it was never restarted.
    expect(web.exitCode).toBeNull();
    expect(web.signalCode).toBeNull();
    expect(results.answer.text).toBe(resultsBefore.text);
    // Nothing was stored during the outage: the same key now runs for the first time, once.
    expect(posted.answer.replayed).toBe(false);
    const id = posted.answer.body!.id!;
    const rows = await getSql()`select id from schedules where name = ${name}`;
    expect(rows.map((r) => r.id)).toEqual([id]);

    const final = await waitForFinalState(id, FINISH_WITHIN_MS);
    expect(final.status).toBe("completed");
    expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
    console.log(`[postgres-down-web] the refused submission, sent again, completed ${((final.completedAtMs - backAtMs) / 1000).toFixed(1)} s after PostgreSQL started`);
    drill.killHard(web);
  });
});
