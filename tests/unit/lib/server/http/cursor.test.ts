import { describe, expect, it } from "vitest";

import { DomainError } from "@/lib/server/errors";
import { decodeCursor, encodeCursor, isIndexCursor, isScheduleCursor } from "@/lib/server/http/cursor";

const crafted = (value: unknown) => Buffer.from(JSON.stringify(value)).toString("base64url");

describe("crafted cursors are a 400 naming the cursor, never reach the database", () => {
  it.each([
    ["a year PostgreSQL cannot hold", isScheduleCursor, { createdAt: "+275760-09-13T00:00:00.000Z", id: "sch_a" }],
    ["a bare number as the time", isScheduleCursor, { createdAt: "1", id: "sch_a" }],
    ["a NUL in the id", isScheduleCursor, { createdAt: "2026-01-01T00:00:00.000Z", id: "sch_\u0000" }],
    ["SQL in the id", isScheduleCursor, { createdAt: "2026-01-01T00:00:00.000Z", id: "sch_a' or 1=1--" }],
    ["another kind of id", isScheduleCursor, { createdAt: "2026-01-01T00:00:00.000Z", id: "key_abc" }],
    ["an index beyond any integer column", isIndexCursor, { after: 1e300 }],
    ["a negative index", isIndexCursor, { after: -5 }],
    ["an array", isIndexCursor, [1]],
  ] as const)("%s", (_label, isValid, value) => {
    const decode = () => decodeCursor(crafted(value), isValid as (v: unknown) => v is unknown);
    expect(decode).toThrow(DomainError);
    try {
      decode();
    } catch (error) {
      expect((error as DomainError).code).toBe("bad_request");
      expect((error as DomainError).errors[0]?.pointer).toBe("/query/cursor");
    }
  });

  it("a cursor longer than any this API writes", () => {
    expect(() => decodeCursor("A".repeat(10_000), isIndexCursor)).toThrow(DomainError);
  });

  it("accepts the cursors the API writes", () => {
    const position = { createdAt: new Date("2026-03-04T05:06:07.089Z").toISOString(), id: "sch_0a1b2c3d4e5f6g7h" };
    expect(decodeCursor(encodeCursor(position), isScheduleCursor)).toEqual(position);
    expect(decodeCursor(encodeCursor({ after: 41 }), isIndexCursor)).toEqual({ after: 41 });
  });
});
