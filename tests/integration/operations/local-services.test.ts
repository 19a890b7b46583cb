// The local service scripts on a busy machine: a port taken by a second checkout or a stranger is
// named with the variable that moves it, and a checkout the postgres user cannot enter keeps its
// cluster outside it.
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import { createServer, type AddressInfo, type Server } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { runCommand, runLocalFunction } from "@/tests/helpers/local-scripts";

const otherCheckout = mkdtempSync(join(tmpdir(), "sagline-other-checkout-"));
// Reachable by the postgres user, as an ordinary clone in a shared folder would be.
chmodSync(otherCheckout, 0o755);
let stranger: Server;
let strangerPort: number;

beforeAll(async () => {
  // A program that accepts connections and never answers.
  stranger = createServer(() => {});
  await new Promise<void>((resolve) => stranger.listen(0, "127.0.0.1", resolve));
  strangerPort = (stranger.address() as AddressInfo).port;
});

afterAll(async () => {
  await runCommand("bash", ["docker-local/postgres.sh", "stop"], { ...process.env, SAGLINE_LOCAL_DIR: otherCheckout });
  stranger.close();
  rmSync(otherCheckout, { recursive: true, force: true });
});

const testPgPort = () => new URL(process.env.DATABASE_URL!).port;
const testRedisPort = () => new URL(process.env.REDIS_URL!).port;

describe("a port already taken", () => {
  it("PostgreSQL: by another checkout's cluster", { timeout: 120_000 }, async () => {
    const { code, stderr } = await runCommand("bash", ["docker-local/postgres.sh", "start", "sagline"], { ...process.env, SAGLINE_LOCAL_DIR: otherCheckout, SAGLINE_PG_PORT: testPgPort() });
    expect(code).toBe(1);
    expect(stderr).toContain(`PostgreSQL: port ${testPgPort()} on 127.0.0.1 is taken by another program`);
    expect(stderr).toContain("Set SAGLINE_PG_PORT to a free port");
    expect(stderr).not.toContain("pg_ctl: could not start server");
  });

  it("Redis: by another checkout's Redis, which is neither used nor stopped", { timeout: 60_000 }, async () => {
    const env = { ...process.env, SAGLINE_LOCAL_DIR: otherCheckout, SAGLINE_REDIS_PORT: testRedisPort() };
    const { code, stderr } = await runCommand("bash", ["docker-local/redis.sh", "start"], env);
    expect(code).toBe(1);
    expect(stderr).toMatch(new RegExp(`Redis: port ${testRedisPort()} on 127.0.0.1 is taken by another Redis \\(data folder /.+\\)`));
    expect(stderr).toContain("Set SAGLINE_REDIS_PORT to a free port");
    const stopped = await runCommand("bash", ["docker-local/redis.sh", "stop"], env);
    expect(stopped.stdout).toContain("is not this checkout's; left running");
  });

  it("Redis: by a program that is not Redis", { timeout: 60_000 }, async () => {
    const { code, stderr } = await runCommand("bash", ["docker-local/redis.sh", "start"], { ...process.env, SAGLINE_LOCAL_DIR: otherCheckout, SAGLINE_REDIS_PORT: String(strangerPort) });
    expect(code).toBe(1);
    expect(stderr).toContain(`Redis: port ${strangerPort} on 127.0.0.1 is taken by another program`);
  });

  it("the web app: names the port variable", { timeout: 60_000 }, async () => {
    const env = { ...process.env, START_PORT: String(strangerPort), START_PORT_VAR: "SAGLINE_APP_PORT" };
    const run = runLocalFunction(["start_process", "web", join(otherCheckout, "run"), join(otherCheckout, "web.log"), "sleep", "60"], env);
    await expect(run).rejects.toMatchObject({ stderr: expect.stringContaining(`web: port ${strangerPort} on 127.0.0.1 is taken`) });
    await expect(run).rejects.toMatchObject({ stderr: expect.stringContaining("Set SAGLINE_APP_PORT to a free port") });
  });
});

describe.runIf(process.getuid?.() === 0)("where the cluster lives, as root", () => {
  it("inside the checkout when the postgres user can enter it, outside when it cannot", async () => {
    const reachable = await runLocalFunction(["resolve_pg_dir"], { ...process.env, SAGLINE_LOCAL_DIR: join(otherCheckout, ".local") });
    expect(reachable.stdout.trim()).toBe(join(otherCheckout, ".local", "postgres"));

    const privateHome = mkdtempSync(join(tmpdir(), "sagline-private-home-"));
    try {
      const unreachable = await runLocalFunction(["resolve_pg_dir"], { ...process.env, SAGLINE_LOCAL_DIR: join(privateHome, "clone", ".local") });
      expect(unreachable.stdout.trim()).toMatch(/^\/var\/lib\/sagline\/[0-9a-f]{12}\/postgres$/);
    } finally {
      rmSync(privateHome, { recursive: true, force: true });
    }
  });
});
