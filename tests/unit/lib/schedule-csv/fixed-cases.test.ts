/** The fixed_cases column: the named cases' loads in the row are never patterned. */
import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";
import { parseScheduleCsv } from "@/lib/schedule-csv";

const HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],span_2 [m],supports,dead_uniform [kN/m],live_uniform [kN/m],fixed_cases";
const options = { name: "Fixed loads (invented)", profile: { preset: "ibc-2021-floor" } };

describe("fixed_cases", () => {
  it("marks the row's loads of the named cases fixed, and intake keeps the mark", () => {
    const result = parseScheduleCsv(`${HEADER}\nT1,floor_beam,1,steel-s355,rectangle,100,300,4,4,pinned roller roller,1,2,live\n`, options);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const parsed = parseSchedule(result.doc);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    expect(parsed.schedule.members[0]!.loads.map((load) => [load.loadCase, load.fixed])).toEqual([
      ["dead", undefined],
      ["live", true],
    ]);
  });

  it("a case with no load in the row is an error naming the column", () => {
    const result = parseScheduleCsv(`${HEADER}\nT1,floor_beam,1,steel-s355,rectangle,100,300,4,4,pinned roller roller,1,2,snow\n`, options);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors).toEqual([expect.objectContaining({ row: 2, column: "fixed_cases", code: "not_applicable" })]);
  });
});
