/** Intake of the pattern-loading fields: a load's `fixed` mark and the profile switches. */
import { describe, expect, it } from "vitest";

import { createDoc, formatIssues, parseIssues, parseOk } from "./helpers";

describe("pattern-loading fields", () => {
  it("a load marked fixed reads as fixed; unmarked loads carry no mark", () => {
    const schedule = parseOk(createDoc({ loads: [{ case: "live", type: "uniform", w: 2, fixed: true }, { case: "live", type: "point", at: 1, P: 3 }] }));
    expect(schedule.members[0]!.loads.map((load) => load.fixed)).toEqual([true, undefined]);
  });

  it("fixed must be a boolean, named by its field", () => {
    const issues = formatIssues(parseIssues(createDoc({ loads: [{ case: "live", type: "uniform", w: 2, fixed: "yes" }] })));
    expect(issues.join("\n")).toContain("members[0].loads[0].fixed");
  });

  it("overrides and custom profiles take patternLoads and variableCases", () => {
    const edited = parseOk(createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { patternLoads: false } } }));
    expect(edited.profile.patternLoads).toBe(false);
    const custom = parseOk(
      createDoc(
        { loads: [{ case: "crowd", type: "uniform", w: 2 }] },
        { profile: { custom: { id: "stand", label: "Stand", source: "project brief (invented)", cantileverSpanMultiplier: 2, variableCases: ["crowd"], combinations: [{ id: "c", label: "Crowd", factors: { crowd: 1 }, limitRatio: 360 }] } } },
      ),
    );
    expect(custom.profile.variableCases).toEqual(["crowd"]);
    expect(custom.profile.patternLoads).toBeUndefined();
  });

  it("bad switches are refused on their own fields", () => {
    const issues = formatIssues(parseIssues(createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { patternLoads: 1, variableCases: ["Crowd"] } } }))).join("\n");
    expect(issues).toContain("profile.overrides.patternLoads");
    expect(issues).toContain("profile.overrides.variableCases[0]");
  });
});
