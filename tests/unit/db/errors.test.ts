// Which failures count as "PostgreSQL is away" (503 with Retry-After) rather than a defect (500).
import { describe, expect, it } from "vitest";

import { isDatabaseUnavailableError } from "@/db/errors";

const withCode = (code: string) => Object.assign(new Error(`failed: ${code}`), { code });

describe("isDatabaseUnavailableError", () => {
  it.each(["ECONNREFUSED", "ECONNRESET", "CONNECTION_CLOSED", "CONNECTION_ENDED", "CONNECTION_DESTROYED", "CONNECT_TIMEOUT", "57P01", "57P03", "08006", "08001", "53300"])("%s is unavailable", (code) => {
    expect(isDatabaseUnavailableError(withCode(code))).toBe(true);
  });

  it.each(["23505", "22P02", "42P01", "40001", "ENOENT", "invalid_input"])("%s is not", (code) => {
    expect(isDatabaseUnavailableError(withCode(code))).toBe(false);
  });

  it("finds the driver's error under a query error's cause and inside an AggregateError", () => {
    expect(isDatabaseUnavailableError(new Error("Failed query: select 1", { cause: withCode("ECONNREFUSED") }))).toBe(true);
    expect(isDatabaseUnavailableError(new AggregateError([withCode("ECONNREFUSED"), withCode("ECONNREFUSED")]))).toBe(true);
    expect(isDatabaseUnavailableError(new Error("Failed query", { cause: withCode("23505") }))).toBe(false);
  });

  it("is false for anything that is not an error object, and ends on a cause cycle", () => {
    for (const value of [null, undefined, "ECONNREFUSED", 42]) expect(isDatabaseUnavailableError(value)).toBe(false);
    const cyclic = new Error("a") as Error & { cause?: unknown };
    cyclic.cause = cyclic;
    expect(isDatabaseUnavailableError(cyclic)).toBe(false);
  });
});
