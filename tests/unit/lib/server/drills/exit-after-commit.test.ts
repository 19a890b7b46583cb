// The crash hook arms only with the local fakes on, which a production start refuses.
import { describe, expect, it } from "vitest";

import { isExitAfterCommitArmed } from "@/lib/server/drills/exit-after-commit";

describe("isExitAfterCommitArmed", () => {
  it("arms with the variable at 1 and the fakes on", () => {
    expect(isExitAfterCommitArmed({ SAGLINE_DRILL_EXIT_AFTER_COMMIT: "1", SAGLINE_FAKES: "1" })).toBe(true);
  });

  it.each([
    [{ SAGLINE_DRILL_EXIT_AFTER_COMMIT: "1" }],
    [{ SAGLINE_DRILL_EXIT_AFTER_COMMIT: "1", SAGLINE_FAKES: "0" }],
    [{ SAGLINE_DRILL_EXIT_AFTER_COMMIT: "true", SAGLINE_FAKES: "1" }],
    [{ SAGLINE_FAKES: "1" }],
  ])("stays off for %j", (env) => {
    expect(isExitAfterCommitArmed(env)).toBe(false);
  });
});
