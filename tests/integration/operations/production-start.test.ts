// npm run start:production against the real test database: it refuses the demo's settings and the
// demo's credentials before starting anything, and on an empty database it starts, seeds nothing
// and answers health. The started processes are this test's own (spare port, private run folder).
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

import postgres from "postgres";
import { afterAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoApiKey } from "@/db/seed-data";
import { hashPassword } from "@/lib/server/auth/passwords";
import { findDemoDataProblems } from "@/lib/server/operations/production-readiness";
import { runCommand, runLocalFunction, waitFor, withoutVariables } from "@/tests/helpers/local-scripts";

const port = Number(process.env.SAGLINE_TEST_SPARE_PORT ?? 3799);
const runDir = mkdtempSync(join(tmpdir(), "sagline-production-"));
// The test settings minus everything that makes them the local demo's, plus a real-looking mail host.
const productionEnv: NodeJS.ProcessEnv = {
  ...withoutVariables(process.env, ["SAGLINE_FAKES", "WEBHOOK_ALLOWLIST", "SMTP_HOST", "MAIL_UI_URL", "MAIL_DIR"]),
  SMTP_HOST: "smtp.mail-relay.example",
  // Stated explicitly, as a production start requires (0: no proxy in front).
  TRUSTED_PROXY_COUNT: "0",
  SAGLINE_APP_PORT: String(port),
  APP_URL: `http://127.0.0.1:${port}`,
  NEXTAUTH_URL: `http://127.0.0.1:${port}`,
  SAGLINE_RUN_DIR: join(runDir, "run"),
  SAGLINE_LOG_DIR: join(runDir, "logs"),
  // The build npm test made; the same sources, so start:production reuses it.
  SAGLINE_DIST_DIR: process.env.SAGLINE_DIST_DIR ?? ".next-test",
};

const startProduction = (env: NodeJS.ProcessEnv) => runCommand("bash", ["docker-local/start-production.sh"], env);
const stopProduction = (env: NodeJS.ProcessEnv) => runCommand("bash", ["docker-local/stop-production.sh"], env);

async function isHealthy(): Promise<true | undefined> {
  const response = await fetch(`http://127.0.0.1:${port}/api/health`, { signal: AbortSignal.timeout(5000) });
  return response.status === 200 ? true : undefined;
}

function expectNothingStarted() {
  expect(readdirSync(productionEnv.SAGLINE_RUN_DIR!, { withFileTypes: true }).filter((f) => f.name.endsWith(".pid"))).toEqual([]);
}

afterAll(async () => {
  await stopProduction(productionEnv);
  rmSync(runDir, { recursive: true, force: true });
});

describe("npm run start:production refuses", () => {
  it("while the demo key is active and demo accounts keep demo passwords (the seeded test database)", { timeout: 180_000 }, async () => {
    const { code, stderr } = await startProduction(productionEnv);
    expect(code).toBe(1);
    expect(stderr).toContain("refusing to start in production");
    expect(stderr).toContain(`the demo API key ${demoApiKey.id}`);
    expect(stderr).toMatch(/the account \S+@(fernhollow|ostrovel)\.example still has a demo password/);
    expectNothingStarted();
  });

  it.each([
    ["the local fakes", { SAGLINE_FAKES: "1" }, "SAGLINE_FAKES=1 turns on the local fakes"],
    ["a loopback webhook allowlist", { WEBHOOK_ALLOWLIST: "127.0.0.1:3792" }, "WEBHOOK_ALLOWLIST lets webhooks reach this machine (127.0.0.1:3792)"],
    ["no SMTP host", { SMTP_HOST: "" }, "SMTP_HOST is not set"],
    ["the local SMTP capture as mail host", { SMTP_HOST: "127.0.0.1" }, "SMTP_HOST=127.0.0.1 is this machine"],
    ["no stated proxy count", { TRUSTED_PROXY_COUNT: undefined }, "TRUSTED_PROXY_COUNT is not set: set it to the number of proxies"],
    ["an empty proxy count", { TRUSTED_PROXY_COUNT: "" }, "TRUSTED_PROXY_COUNT is not set"],
  ])("%s", { timeout: 180_000 }, async (_what, overrides, message) => {
    const { code, stderr } = await startProduction({ ...productionEnv, ...overrides });
    expect(code).toBe(1);
    expect(stderr).toContain(message);
    expectNothingStarted();
  });
});

describe("the demo-credential check", () => {
  it("passes once the demo key is revoked and the demo passwords are changed", { timeout: 60_000 }, async () => {
    const before = await findDemoDataProblems(getSql());
    expect(before.filter((p) => p.includes(demoApiKey.id))).toHaveLength(1);
    expect(before.filter((p) => p.includes("still has a demo password")).length).toBeGreaterThan(0);
    const realHash = await hashPassword("an operator's own passphrase");
    const rollback = new Error("rollback");
    await expect(
      getSql().begin(async (tx) => {
        await tx`update users set password_hash = ${realHash} where id like 'usr\_demo%'`;
        await tx`update api_keys set revoked_at = now() where id = ${demoApiKey.id}`;
        expect(await findDemoDataProblems(tx)).toEqual([]);
        throw rollback;
      }),
    ).rejects.toBe(rollback);
  });
});

describe("npm run start:production on an empty database", () => {
  it("starts web and worker, seeds nothing, and stop:production ends them", { timeout: 300_000 }, async () => {
    const database = "sagline_test_production";
    await runLocalFunction(["bash", "docker-local/postgres.sh", "start", database]);
    const url = new URL(process.env.DATABASE_URL!);
    url.pathname = `/${database}`;
    const sql = postgres(url.toString(), { max: 1, onnotice: () => {} });
    try {
      await sql.unsafe("drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;");
      const env = { ...productionEnv, DATABASE_URL: url.toString(), REDIS_PREFIX: "sagline-production-test" };

      const started = await startProduction(env);
      expect(started.stderr + started.stdout).toContain("production checks passed");
      expect(started.code, started.stderr).toBe(0);
      await waitFor("the production web process to answer health", isHealthy, 60_000);

      const [counts] = await sql`select (select count(*)::int from organizations) as organizations, (select count(*)::int from users) as users, (select count(*)::int from api_keys) as keys`;
      expect(counts).toEqual({ organizations: 0, users: 0, keys: 0 });
      expect(started.stdout).not.toContain("Demo sign-ins");

      expect((await stopProduction(env)).code).toBe(0);
      await expect(isHealthy()).rejects.toThrow();
      expectNothingStarted();
    } finally {
      await sql.end({ timeout: 5 });
    }
  });
});
