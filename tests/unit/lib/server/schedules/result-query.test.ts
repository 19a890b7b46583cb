// The results query reader: sorts, filters and cursors are accepted only in the exact shapes
// Sagline writes; anything else is a named problem, never a guess and never a database error.
import { describe, expect, it } from "vitest";

import { getPrefixUpperBound } from "@/db/queries/results";
import { decodeResultCursor, encodeResultCursor, readResultQuery } from "@/lib/server/schedules/result-query";

const b64 = (value: unknown) => Buffer.from(typeof value === "string" ? value : JSON.stringify(value)).toString("base64url");
const query = (params: Record<string, string>) => new URLSearchParams(params);

describe("result cursors", () => {
  it.each([
    { sort: "utilization", key: 1.25, index: 4, back: false, page: 3 },
    { sort: "utilization", key: null, index: 9, back: true, page: 2 },
    { sort: "mark", key: "b-0001", index: 1, back: false, page: 2 },
    { sort: "category", key: "lintel", index: 0, back: true, page: 5 },
    { sort: "schedule", key: 49, index: 49, back: false, page: 2 },
    { sort: "schedule", key: 49, index: 49, back: true, page: 1 },
  ] as const)("round-trips %o", (position) => {
    expect(decodeResultCursor(encodeResultCursor(position))).toEqual(position);
  });

  it("still reads the schedule-order cursors earlier releases issued", () => {
    expect(decodeResultCursor(b64({ after: 49 }))).toEqual({ sort: "schedule", key: 49, index: 49, back: false, page: 2 });
  });

  it.each([
    ["not base64url JSON", "!!!"],
    ["JSON that is not an object", b64("[1,2]")],
    ["a number", b64("42")],
    ["an unknown sort", b64({ s: "weight", k: 1, i: 0, b: 0, p: 2 })],
    ["an extra field", b64({ s: "mark", k: "a", i: 0, b: 0, p: 2, x: 1 })],
    ["a fractional index", b64({ s: "mark", k: "a", i: 1.5, b: 0, p: 2 })],
    ["an index past int4", b64({ s: "mark", k: "a", i: 2 ** 31, b: 0, p: 2 })],
    ["a string utilization", b64({ s: "utilization", k: "1", i: 0, b: 0, p: 2 })],
    ["an enormous utilization", b64({ s: "utilization", k: 1e300, i: 0, b: 0, p: 2 })],
    ["a mark with a NUL", b64({ s: "mark", k: "a\u0000", i: 0, b: 0, p: 2 })],
    ["a lone surrogate", b64({ s: "mark", k: "\ud800", i: 0, b: 0, p: 2 })],
    ["an overlong mark", b64({ s: "mark", k: "m".repeat(300), i: 0, b: 0, p: 2 })],
    ["an unknown category", b64({ s: "category", k: "girder", i: 0, b: 0, p: 2 })],
    ["a direction that is not 0 or 1", b64({ s: "mark", k: "a", i: 0, b: true, p: 2 })],
    ["page 0", b64({ s: "mark", k: "a", i: 0, b: 0, p: 0 })],
    ["a schedule key that is not its index", b64({ s: "schedule", k: 5, i: 6, b: 0, p: 2 })],
    ["a legacy cursor with a negative index", b64({ after: -2 })],
    ["an overlong cursor", "A".repeat(600)],
  ])("refuses %s", (_name, text) => {
    expect(decodeResultCursor(text)).toBeNull();
  });
});

describe("readResultQuery", () => {
  it("reads every filter and the sort", () => {
    const { query: q, problems } = readResultQuery(query({ sort: "mark", status: "fail", category: "lintel", review: "awaiting", utilizationAbove: "0.9", mark: "  B-1 " }));
    expect(problems).toEqual([]);
    expect(q).toEqual({ sort: "mark", filters: { status: "fail", category: "lintel", awaitingReview: true, utilizationAbove: 0.9, markPrefix: "B-1" } });
  });

  it.each([
    ["sort", "weight"],
    ["status", "maybe"],
    ["category", "girder"],
    ["review", "yes"],
    ["utilizationAbove", "1e400"],
    ["utilizationAbove", "0x10"],
    ["mark", "m".repeat(65)],
    ["cursor", "not-a-cursor"],
    ["page", "0"],
    ["page", "2.5"],
  ])("names %s=%s as not accepted", (name, value) => {
    const { problems } = readResultQuery(query({ [name]: value }));
    expect(problems.map((p) => p.pointer)).toEqual([`/query/${name}`]);
  });

  it("refuses a cursor of another ordering", () => {
    const cursor = encodeResultCursor({ sort: "mark", key: "a", index: 0, back: false, page: 2 });
    expect(readResultQuery(query({ sort: "utilization", cursor })).problems).toEqual([{ pointer: "/query/cursor", message: "belongs to the mark ordering, not utilization" }]);
  });
});

describe("getPrefixUpperBound", () => {
  it("is the prefix with its last code point raised", () => {
    expect(getPrefixUpperBound("b-1")).toBe("b-2");
    expect(getPrefixUpperBound("a\u{10ffff}")).toBe("b");
    expect(getPrefixUpperBound("\u{10ffff}")).toBeNull();
    expect(getPrefixUpperBound("a\ud7ff")).toBe("a\ue000");
  });
});
