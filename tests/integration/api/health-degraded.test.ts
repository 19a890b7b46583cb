// A second web process whose Redis address points at a closed port: health must say so with 503.
import { spawn, type ChildProcess } from "node:child_process";

import { afterAll, beforeAll, describe, expect, it } from "vitest";

const port = Number(process.env.SAGLINE_TEST_SPARE_PORT ?? 3799);
let server: ChildProcess;

async function waitForServer(url: string): Promise<void> {
  for (let i = 0; i < 150; i += 1) {
    try {
      await fetch(url);
      return;
    } catch {
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  throw new Error("server did not start");
}

beforeAll(async () => {
  server = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, REDIS_URL: "redis://127.0.0.1:1/0", APP_URL: `http://127.0.0.1:${port}` },
    stdio: "ignore",
    detached: true,
  });
  await waitForServer(`http://127.0.0.1:${port}/sign-in`);
});

afterAll(() => {
  if (server.pid) process.kill(-server.pid, "SIGTERM");
});

describe("GET /api/health with Redis unreachable", () => {
  it("answers 503 and names Redis as down", async () => {
    const response = await fetch(`http://127.0.0.1:${port}/api/health`);
    expect(response.status).toBe(503);
    expect(await response.json()).toEqual({ status: "degraded", components: { web: "up", postgres: "up", redis: "down" } });
  });
});
