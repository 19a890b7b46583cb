// RELIABILITY figure 12: a web or worker process killed with SIGKILL is restarted by
// docker-local/supervise.sh, the crash is logged with its cause, and stop ends everything.
// The processes here are this test's own (a spare port, a private queue prefix), started with the
// same start_supervised the start and test scripts use, so the shared test server is not touched.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

import { afterAll, describe, expect, it } from "vitest";

import { createDrill, submitDrillSchedule, waitForProgress } from "@/tests/helpers/drill";
import { isAlive, readPid, runLocalFunction, waitFor } from "@/tests/helpers/local-scripts";

const port = Number(process.env.SAGLINE_TEST_SPARE_PORT ?? 3799);
const runDir = mkdtempSync(join(tmpdir(), "sagline-supervise-"));
const drill = createDrill("supervise");
const started: string[] = [];

afterAll(async () => {
  for (const name of started) await runLocalFunction(["stop_process", name, runDir]).catch(() => undefined);
  rmSync(runDir, { recursive: true, force: true });
});

async function startSupervised(name: string, env: NodeJS.ProcessEnv, command: string[]) {
  await runLocalFunction(["start_supervised", name, runDir, join(runDir, `${name}.log`), ...command], env);
  started.push(name);
}

async function isHealthy(): Promise<true | undefined> {
  const response = await fetch(`http://127.0.0.1:${port}/api/health`, { signal: AbortSignal.timeout(5000) });
  return response.status === 200 ? true : undefined;
}

const newChildPid = (name: string, previous?: number) => () => {
  const pid = readPid(join(runDir, `${name}.child.pid`));
  return pid !== undefined && pid !== previous ? pid : undefined;
};

const crashLog = () => readFileSync(join(runDir, "crashes.log"), "utf8");

describe("supervised processes", () => {
  it("restarts the web process after SIGKILL and it answers health again", { timeout: 300_000 }, async () => {
    const env = { ...process.env, APP_URL: `http://127.0.0.1:${port}`, START_PORT: String(port) };
    await startSupervised("web", env, ["node", "node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)]);
    await waitFor("the supervised web process to answer health", isHealthy, 120_000);
    const first = await waitFor("the web child pid", newChildPid("web"), 10_000);

    process.kill(first, "SIGKILL");
    const second = await waitFor("a restarted web process", newChildPid("web", first), 60_000);
    await waitFor("the restarted web process to answer health", isHealthy, 120_000);

    expect(isAlive(first)).toBe(false);
    expect(isAlive(second)).toBe(true);
    expect(crashLog()).toContain(`web: pid ${first} was killed by SIGKILL`);
    expect(readFileSync(join(runDir, "web.log"), "utf8")).toMatch(/restarting in \d+ s \(restart 1\)/);
  });

  it("restarts a worker after SIGKILL and the new one consumes a job", { timeout: 300_000 }, async () => {
    const env = { ...process.env, REDIS_PREFIX: drill.prefix, RECONCILE_AFTER_SECONDS: "3", RECONCILE_EVERY_MS: "1000" };
    await startSupervised("worker", env, ["node", "--import", "tsx", "workers/index.ts"]);
    const first = await waitFor("the worker child pid", newChildPid("worker"), 10_000);
    await waitFor("the worker to start", () => (readFileSync(join(runDir, "worker.log"), "utf8").includes("started, concurrency") ? true : undefined), 120_000);

    process.kill(first, "SIGKILL");
    const second = await waitFor("a restarted worker", newChildPid("worker", first), 60_000);
    expect(crashLog()).toContain(`worker: pid ${first} was killed by SIGKILL`);

    // Only this test's worker listens on the drill's queue prefix, so the restarted one did the work.
    const id = await submitDrillSchedule(drill, { markPrefix: "SV", memberCount: 20, label: "Supervision drill" });
    const final = await waitForProgress(id, (p) => p.status === "completed", 180_000);
    expect(final.checked_count).toBe(20);
    expect(isAlive(second)).toBe(true);
  });

  it("stop ends the supervisors and their processes", { timeout: 120_000 }, async () => {
    const children = started.map((name) => readPid(join(runDir, `${name}.child.pid`))!);
    const supervisors = started.map((name) => readPid(join(runDir, `${name}.pid`))!);
    for (const name of started.splice(0)) await runLocalFunction(["stop_process", name, runDir]);
    for (const pid of [...children, ...supervisors]) expect(isAlive(pid), `pid ${pid}`).toBe(false);
    await expect(isHealthy()).rejects.toThrow();
  });
});
