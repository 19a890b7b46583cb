import { expect } from "vitest";

/** What an answer must never show: internals, SQL, and the secrets the test process knows. */
function listLeaks(extraSecrets: readonly string[]): string[] {
  const fromEnv = [process.env.DATABASE_URL, process.env.NEXTAUTH_SECRET, process.env.REDIS_URL].filter((v): v is string => typeof v === "string" && v.length >= 8);
  return [...extraSecrets, ...fromEnv, "node_modules", "    at ", "postgres", "SELECT ", "select ", "syntax error", "ECONNREFUSED", "TypeError", "ReferenceError"];
}

/** A 4xx RFC 9457 problem whose status matches the HTTP status, with nothing leaked. */
export function assertSafeProblem(response: { status: number; text: string; headers: Record<string, string>; body: unknown }, secrets: readonly string[] = []): void {
  const context = `${response.status} ${response.text.slice(0, 300)}`;
  expect(response.status, context).toBeGreaterThanOrEqual(400);
  expect(response.status, context).toBeLessThan(500);
  expect(response.headers["content-type"], context).toContain("application/problem+json");
  const body = response.body as { status?: unknown; type?: unknown; title?: unknown };
  expect(body.status, context).toBe(response.status);
  expect(typeof body.type, context).toBe("string");
  expect(typeof body.title, context).toBe("string");
  for (const leak of listLeaks(secrets)) expect(response.text, `leaks ${leak.slice(0, 12)}...`).not.toContain(leak);
}
