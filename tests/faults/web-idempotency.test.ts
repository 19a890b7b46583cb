// RELIABILITY figure 1, and a web process killed between commit and response, against real web
// processes of the built app (next start) on the drill's ports, with a worker of the drill's own.
// 1. 100 concurrent POSTs of one schedule with one Idempotency-Key: exactly one schedule row;
//    every answer is the original 202 (same body) or a 409 problem; none is 5xx.
// 2. The web process dies by SIGKILL right after the schedule's transaction commits (the drill hook
//    SAGLINE_DRILL_EXIT_AFTER_COMMIT): the client gets no answer; the retry with the same key, to a
//    restarted web process, replays the first answer; one schedule row, and it completes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createScheduleBody, postSchedule, type PostAnswer } from "@/tests/helpers/api-posts";
import { countResults, createDrill, drillPorts, waitForExit, waitForFinalState, waitForWeb } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("webidem");
const MEMBERS = 200;
const DUPLICATES = 100;
/** A web process of the built app answers its health check within this. */
const WEB_START_MS = 120_000;
/** Every one of the 100 answers is back within this (stated in README). */
const ANSWERED_WITHIN_MS = 60_000;
/** Submission (or the fault) to the schedule's completion (stated in README). */
const FINISH_WITHIN_MS = 90_000;
let apiKey: string;

beforeAll(async () => {
  apiKey = await createTestKey(["schedules:write", "results:read"]);
  drill.startWorker({ ENGINE_WARM_UP: "0" });
});

afterAll(async () => {
  drill.killAll();
  await closeQueues();
});

async function countSchedulesNamed(name: string) {
  const rows = await getSql()`select id, status from schedules where name = ${name}`;
  return rows.map((r) => ({ id: r.id as string, status: r.status as string }));
}

async function readKeyState(key: string) {
  return (await getSql()`select state, response_status from idempotency_keys where key = ${key}`).map((r) => ({ state: r.state as string, status: r.response_status as number }));
}

async function expectCompletedOnce(id: string, sinceMs: number) {
  const final = await waitForFinalState(id, FINISH_WITHIN_MS);
  expect(final.status).toBe("completed");
  expect(final.completedAtMs).toBeGreaterThan(sinceMs);
  expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
  return final;
}

describe("the web process under duplicate and interrupted submissions", () => {
  it(`${DUPLICATES} concurrent POSTs with one Idempotency-Key store exactly one schedule`, { timeout: 300_000 }, async () => {
    const web = drill.startWeb(drillPorts.web);
    await waitForWeb(drillPorts.web, WEB_START_MS);
    const url = `http://127.0.0.1:${drillPorts.web}`;
    const name = `Duplicate drill ${drill.prefix}`;
    const key = `dup-${drill.prefix}`;
    const body = createScheduleBody(name, MEMBERS);

    const started = Date.now();
    const answers: PostAnswer[] = await Promise.all(Array.from({ length: DUPLICATES }, () => postSchedule(url, apiKey, key, body)));
    const answeredMs = Date.now() - started;
    const byStatus = answers.reduce<Record<number, number>>((counts, a) => ({ ...counts, [a.status]: (counts[a.status] ?? 0) + 1 }), {});
    console.log(`[web-idempotency] ${DUPLICATES} duplicates answered in ${answeredMs} ms: ${JSON.stringify(byStatus)}`);

    expect(answers.filter((a) => a.status >= 500)).toEqual([]);
    expect(answers.filter((a) => a.status !== 202 && a.status !== 409)).toEqual([]);
    // The fault hit: duplicates arrived while the first was still in flight (409), not one by one after it.
    const inFlight = answers.filter((a) => a.status === 409);
    expect(inFlight.length).toBeGreaterThan(0);
    for (const a of inFlight) {
      expect(a.contentType).toBe("application/problem+json");
      expect(a.body).toMatchObject({ type: "https://sagline.dev/problems/idempotency-in-flight", status: 409 });
      expect(Number(a.retryAfter)).toBeGreaterThan(0);
    }
    // One original answer; every other 202 is a replay of it, body for body.
    const accepted = answers.filter((a) => a.status === 202);
    const originals = accepted.filter((a) => !a.replayed);
    expect(originals).toHaveLength(1);
    for (const a of accepted) expect(a.body).toEqual(originals[0]!.body);
    const id = originals[0]!.body!.id!;

    expect(await countSchedulesNamed(name)).toEqual([{ id, status: expect.any(String) }]);
    expect(await readKeyState(key)).toEqual([{ state: "completed", status: 202 }]);
    // Once the first has finished, a late duplicate is a replay too.
    const late = await postSchedule(url, apiKey, key, body);
    expect({ status: late.status, replayed: late.replayed, body: late.body }).toEqual({ status: 202, replayed: true, body: originals[0]!.body });
    expect(answeredMs).toBeLessThanOrEqual(ANSWERED_WITHIN_MS);

    const final = await expectCompletedOnce(id, started);
    expect(await countSchedulesNamed(name)).toHaveLength(1);
    console.log(`[web-idempotency] the one schedule completed ${final.seconds.toFixed(1)} s after submission`);
    drill.killHard(web);
  });

  it("a web process killed between commit and response: the retry replays, one schedule, and it completes", { timeout: 300_000 }, async () => {
    const url = `http://127.0.0.1:${drillPorts.spare}`;
    const armed = drill.startWeb(drillPorts.spare, { SAGLINE_DRILL_EXIT_AFTER_COMMIT: "1" });
    await waitForWeb(drillPorts.spare, WEB_START_MS);
    const name = `Crash drill ${drill.prefix}`;
    const key = `crash-${drill.prefix}`;
    const body = createScheduleBody(name, MEMBERS);

    const started = Date.now();
    const first = await postSchedule(url, apiKey, key, body).then(
      (answer) => ({ answer, error: null }),
      (error: Error) => ({ answer: null, error }),
    );
    // The fault hit: no answer at all, the process died by SIGKILL, and its transaction had committed
    // (the schedule row and the completed key are there) with the schedule still unfinished.
    expect(first.answer).toBeNull();
    expect(await waitForExit(armed, 30_000)).toEqual({ code: null, signal: "SIGKILL" });
    const stored = await countSchedulesNamed(name);
    expect(stored).toHaveLength(1);
    expect(stored[0]!.status).not.toMatch(/completed|failed/);
    expect(await readKeyState(key)).toEqual([{ state: "completed", status: 202 }]);
    const faultAtMs = Date.now();
    drill.killHard(armed);

    const restarted = drill.startWeb(drillPorts.spare);
    await waitForWeb(drillPorts.spare, WEB_START_MS);
    const retry = await postSchedule(url, apiKey, key, body);
    console.log(`[web-idempotency] crash after commit: no answer (${first.error?.message}); retry answered ${retry.status}${retry.replayed ? " (replayed)" : ""} ${Date.now() - faultAtMs} ms after the fault`);
    expect(retry.status).toBe(202);
    expect(retry.replayed).toBe(true);
    expect(retry.body).toMatchObject({ id: stored[0]!.id, status: "queued", memberCount: MEMBERS });
    expect(await countSchedulesNamed(name)).toHaveLength(1);

    // The dead process never queued the chunks: the worker's reconciler finds them in PostgreSQL.
    const final = await expectCompletedOnce(stored[0]!.id, faultAtMs);
    expect(await countSchedulesNamed(name)).toHaveLength(1);
    console.log(`[web-idempotency] the crashed submission completed ${final.seconds.toFixed(1)} s after submission (${((final.completedAtMs - started) / 1000).toFixed(1)} s after the first POST)`);
    drill.killHard(restarted);
  });
});
