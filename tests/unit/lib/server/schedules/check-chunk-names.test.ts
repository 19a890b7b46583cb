import { describe, expect, it } from "vitest";

import { checkMembers, checkRows, outcomeRows } from "@/lib/server/schedules/check-chunk";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

const header = { format: SCHEDULE_FORMAT, name: "Invented overhang test", units: { system: "SI", length: "m", distributedLoad: "kN/m" }, profile: { preset: "ibc-2021-floor" } };

// A 4 m span with a long 2.5 m left overhang under live load: the overhang tip governs (common
// practice: a long back-span overhang deflects more than its span).
const member = {
  mark: "C1",
  category: "floor_beam",
  quantity: 1,
  material: "steel-s355",
  section: { shape: "rectangle", b: 100, h: 200 },
  spans: [4],
  overhangs: { left: 2.5 },
  supports: ["pinned", "roller"],
  loads: [{ case: "live", type: "uniform", w: 3 }],
};

describe("stored check names", () => {
  it("number spans as the user wrote them and name the overhang as an overhang", () => {
    const outcomes = checkMembers(header, 0, [member]);
    const names = [...checkRows("sch_test", outcomes)].map((row) => row[2]);
    expect(names).toEqual(expect.arrayContaining(["live, left overhang", "live, span 1"]));
    expect(names.some((name) => name.includes("@") || name.includes("span 2"))).toBe(false);
    const [outcome] = [...outcomeRows("sch_test", outcomes)];
    expect(outcome?.[5]).toBe("live, left overhang");
  });
});
