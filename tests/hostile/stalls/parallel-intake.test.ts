// Issue 13 (RELIABILITY figure 11): six valid submissions of the largest allowed body at once.
// The web process reads as many at a time as its intake budget allows (SCHEDULE_INTAKE_MEMORY_MB,
// 512 by default: two of 64 MB) and answers the rest 503 with Retry-After and a problem body,
// before reading them; nothing of a refused one is stored, and the process's resident memory,
// sampled throughout, stays under the bound README states.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { MAX_SCHEDULE_BODY_BYTES } from "@/lib/server/schedules/intake-gate";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

/** README, "What we promise and how we test it": the web process's resident memory bound. */
const WEB_RSS_BOUND_MB = 1024;
const SUBMISSIONS = 6;

/** A valid schedule body just under the body limit: members with notes at their longest. */
function buildLargestBody(name: string): Uint8Array<ArrayBuffer> {
  const note = "Invented note for the intake budget test; ".repeat(60).slice(0, 2000);
  const members = [];
  let bytes = 0;
  for (let i = 0; bytes < MAX_SCHEDULE_BODY_BYTES - 2 * 1024 * 1024; i++) {
    const member = { ...createBeam(`KS-${i}`, 3 + (i % 9) * 0.5), notes: note };
    bytes += JSON.stringify(member).length + 1;
    members.push(member);
  }
  return new TextEncoder().encode(JSON.stringify(createScheduleDoc(members, name)));
}

/** The pid of the process listening on the app's port (the web process itself, not its supervisor). */
function findWebPid(): number {
  const port = new URL(APP_URL).port;
  const out = execFileSync("ss", ["-Hltnp", `sport = :${port}`], { encoding: "utf8" });
  const match = /pid=(\d+)/.exec(out);
  if (!match) throw new Error(`no process found listening on port ${port}: ${out}`);
  return Number(match[1]);
}

const readRssMb = (pid: number) => Number(/VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1] ?? 0) / 1024;

describe("six of the largest submissions at once", () => {
  it("accepts what the budget allows, answers the rest 503 with Retry-After, and stays under the memory bound", async () => {
    const key = await createTestKey();
    const runName = `Kestrel Sidings (invented) ${Date.now()}`;
    const bodies = Array.from({ length: SUBMISSIONS }, (_, i) => buildLargestBody(`${runName} #${i}`));
    expect(bodies[0]!.byteLength).toBeLessThanOrEqual(MAX_SCHEDULE_BODY_BYTES);
    const pid = findWebPid();
    let peakRssMb = readRssMb(pid);
    const sampler = setInterval(() => (peakRssMb = Math.max(peakRssMb, readRssMb(pid))), 100);
    const answers = await Promise.all(
      bodies.map(async (body) => {
        const response = await fetch(`${APP_URL}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${key}`, "content-type": "application/json" }, body });
        return { status: response.status, retryAfter: response.headers.get("retry-after"), type: response.headers.get("content-type"), body: (await response.json()) as Record<string, unknown> };
      }),
    );
    clearInterval(sampler);
    peakRssMb = Math.max(peakRssMb, readRssMb(pid));
    const summary = `statuses ${answers.map((a) => a.status).join(", ")}; web peak RSS ${peakRssMb.toFixed(0)} MB (bound ${WEB_RSS_BOUND_MB} MB), bodies ${(bodies[0]!.byteLength / 1e6).toFixed(1)} MB`;
    console.info(summary);

    const accepted = answers.filter((a) => a.status === 202);
    const refused = answers.filter((a) => a.status === 503);
    expect(accepted.length + refused.length, summary).toBe(SUBMISSIONS);
    expect(accepted.length, summary).toBeGreaterThanOrEqual(1);
    expect(refused.length, summary).toBeGreaterThanOrEqual(1);
    for (const answer of refused) {
      expect(answer.type).toContain("application/problem+json");
      expect(Number(answer.retryAfter)).toBeGreaterThan(0);
      expect(answer.body).toMatchObject({ type: "https://sagline.dev/problems/unavailable", status: 503, title: "Service unavailable" });
    }
    // Nothing of a refused submission was stored.
    const [stored] = await getSql()`select count(*)::int as n from schedules where name like ${`${runName} #%`}`;
    expect(stored!.n, summary).toBe(accepted.length);
    expect(peakRssMb, summary).toBeLessThan(WEB_RSS_BOUND_MB);
  });
});
