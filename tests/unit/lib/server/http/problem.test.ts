// toProblem: a database that cannot be reached answers 503 with Retry-After, and says nothing of it.
import { describe, expect, it, vi } from "vitest";

import { DATABASE_RETRY_AFTER_SECONDS, toProblem } from "@/lib/server/http/problem";

describe("toProblem with PostgreSQL away", () => {
  it("answers 503 problem+json with Retry-After and no internals", async () => {
    vi.spyOn(console, "warn").mockImplementation(() => {});
    const driverError = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:54329"), { code: "ECONNREFUSED" });
    const response = toProblem(new Error('Failed query: select "id" from "api_keys"', { cause: driverError }), "/api/v1/schedules");
    expect(response.status).toBe(503);
    expect(response.headers.get("content-type")).toBe("application/problem+json");
    expect(response.headers.get("retry-after")).toBe(String(DATABASE_RETRY_AFTER_SECONDS));
    const text = await response.text();
    expect(JSON.parse(text)).toMatchObject({ type: "https://sagline.dev/problems/unavailable", title: "Service unavailable", status: 503, instance: "/api/v1/schedules" });
    expect(text).not.toMatch(/ECONNREFUSED|54329|select|api_keys/);
  });

  it("still answers 500 for any other failure", () => {
    vi.spyOn(console, "error").mockImplementation(() => {});
    expect(toProblem(Object.assign(new Error("duplicate key"), { code: "23505" })).status).toBe(500);
  });
});
