import { describe, expect, it } from "vitest";

import { DEFAULT_AFTER_SIGN_IN, toSameOriginPath } from "@/lib/server/auth/safe-callback";

const origin = "https://app.sagline.test";

describe("toSameOriginPath", () => {
  it.each([
    ["/schedules", "/schedules"],
    ["/schedules/sch_abc?status=fail#m-3", "/schedules/sch_abc?status=fail#m-3"],
    [`${origin}/review`, "/review"],
    ["/people/../review", "/review"],
  ])("keeps the path of our own %s", (raw, expected) => {
    expect(toSameOriginPath(raw, origin)).toBe(expected);
  });

  // Each of these is read by some browser as another host (or as script), directly or after one decoding.
  it.each([
    "/\\evil.example",
    "/\\/evil.example",
    "\\\\evil.example",
    "/\t/evil.example",
    "/\n/evil.example",
    "/%09/evil.example",
    "/%0a/evil.example",
    "/%5cevil.example",
    "/%5C%5Cevil.example",
    "/%2F/evil.example",
    "/%2f%2fevil.example",
    "//evil.example",
    "///evil.example",
    "https://evil.example",
    "https://evil.example/schedules",
    `${origin}.evil.example/x`,
    `${origin}@evil.example/`,
    "http://app.sagline.test/review",
    "javascript:alert(1)",
    "JaVaScRiPt:alert(1)",
    "data:text/html,<script>alert(1)</script>",
    "evil.example",
    "%2F%2Fevil.example",
    "/%E0%A4%A",
    "",
    "/" + "a".repeat(3000),
  ])("refuses %j", (raw) => {
    expect(toSameOriginPath(raw, origin)).toBe(DEFAULT_AFTER_SIGN_IN);
  });

  it("refuses values that are not strings", () => {
    expect(toSameOriginPath(undefined, origin)).toBe(DEFAULT_AFTER_SIGN_IN);
    expect(toSameOriginPath(["/a", "/b"], origin)).toBe(DEFAULT_AFTER_SIGN_IN);
  });
});
