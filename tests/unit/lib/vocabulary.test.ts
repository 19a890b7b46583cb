import { describe, expect, it } from "vitest";

import { DELIMITERS, formatCheckName, formatOutcomeCount, getOutcome, getSpanLabel, isDelimiterName, nameDeflectionCheck, OUTCOMES, SCHEDULE_FORMAT } from "@/lib/vocabulary";

describe("lib/vocabulary", () => {
  it("names spans as written and overhangs as overhangs, from the public path", () => {
    expect(getSpanLabel("members[3].spans[0]", 1)).toBe("span 1");
    expect(getSpanLabel("members[3].spans[1]", 2)).toBe("span 2");
    expect(getSpanLabel("members[3].overhangs.left", 0)).toBe("left overhang");
    expect(getSpanLabel("members[3].overhangs.right", 3)).toBe("right overhang");
    // no origin: the engine's own order, counted from 1
    expect(getSpanLabel(undefined, 0)).toBe("span 1");
  });

  it("writes a check name one way", () => {
    expect(formatCheckName("live", "span 1")).toBe("live, span 1");
    const origins = ["members[0].overhangs.left", "members[0].spans[0]", "members[0].spans[1]"];
    expect(nameDeflectionCheck("total", 0, origins)).toBe("total, left overhang");
    expect(nameDeflectionCheck("total", 1, origins)).toBe("total, span 1");
    expect(nameDeflectionCheck("total", 2, origins)).toBe("total, span 2");
  });

  it("keeps an errored member apart from a failed one", () => {
    expect(OUTCOMES).toEqual(["pass", "fail", "error"]);
    expect(getOutcome({ pass: true })).toBe("pass");
    expect(getOutcome({ pass: false, error: null })).toBe("fail");
    expect(getOutcome({ pass: false, error: "a mechanism" })).toBe("error");
    expect(formatOutcomeCount(1200, "fail")).toBe("1,200 fail");
  });

  it("takes delimiters by name only", () => {
    expect(isDelimiterName("semicolon")).toBe(true);
    expect(isDelimiterName(";")).toBe(false);
    expect(isDelimiterName("toString")).toBe(false);
    expect(DELIMITERS.tab).toBe("\t");
  });

  it("exports the one schedule format string", () => {
    expect(SCHEDULE_FORMAT).toBe("sagline.schedule/v2");
  });
});
