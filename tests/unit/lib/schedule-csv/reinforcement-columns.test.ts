/** CSV columns for reinforced concrete: tee outline, reinforcement, ACI creep without a ratio, errors on the row and column. */
import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";
import { mapIssueToCsvRow, parseScheduleCsv } from "@/lib/schedule-csv";

const HEADER = "mark,category,quantity,material,creep,section,bf [mm],hf [mm],bw [mm],h [mm],tension_steel [mm^2],effective_depth [mm],compression_steel [mm^2],compression_depth [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m]";

function parse(rows: string[]) {
  const result = parseScheduleCsv([HEADER, ...rows].join("\n"), { name: "Invented RC frame", profile: { preset: "aci-318-19-floor" } });
  if (!result.ok) throw new Error(JSON.stringify(result.errors));
  return { result, parsed: parseSchedule(result.doc) };
}

describe("reinforced concrete columns", () => {
  it("maps a tee with tension and compression steel and ACI-12 creep to the engine's reinforced span", () => {
    const { result, parsed } = parse(["RB1,floor_beam,1,concrete-fc30,ACI-12,tee,1200,100,300,600,2000,530,400,60,7.5,pinned roller,18,12"]);
    const members = result.doc.members as Record<string, unknown>[];
    expect(members[0]?.section).toEqual({ shape: "tee", bf: { value: 1200, unit: "mm" }, hf: { value: 100, unit: "mm" }, bw: { value: 300, unit: "mm" }, h: { value: 600, unit: "mm" } });
    expect(members[0]?.creep).toEqual({ method: "aci", durationMonths: 12 });
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const member = parsed.schedule.members[0]!;
    expect(member.spans[0]?.reinforcedConcrete).toMatchObject({ flangeWidthMm: 1200, tensionSteelMm2: 2000, effectiveDepthMm: 530, compressionSteelMm2: 400, compressionDepthMm: 60 });
    // ACI 318-19 24.2.4.1.1 (from memory): lambda = 1.4 / (1 + 50 x 400 / (1200 x 530))
    expect(member.materialCreepFactor).toBeCloseTo(1.4 / (1 + (50 * 400) / (1200 * 530)), 12);
  });

  it("top_steel and top_depth give the steel for hogging regions", () => {
    const header = `${HEADER},top_steel [mm^2],top_depth [mm]`;
    const result = parseScheduleCsv([header, "RB1,floor_beam,1,concrete-fc30,,tee,1200,100,300,600,2000,530,,,7.5,roller fixed,18,12,2454,545"].join("\n"), { name: "Invented RC frame", profile: { preset: "aci-318-19-floor" } });
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const parsed = parseSchedule(result.doc);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    expect(parsed.schedule.members[0]!.spans[0]?.reinforcedConcrete).toMatchObject({ topSteelMm2: 2454, topEffectiveDepthMm: 545 });
  });

  it("a row that can hog without top_steel is refused on its row, naming the cause", () => {
    const { result, parsed } = parse(["RB3,floor_beam,1,concrete-fc30,,tee,1200,100,300,600,2000,530,,,7.5,fixed roller,18,12"]);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    const [error] = parsed.issues.map((issue) => mapIssueToCsvRow(issue, result.places));
    // the column the row needs, though the file has none
    expect(error).toMatchObject({ row: 2, column: "top_steel" });
    expect(error!.message).toMatch(/^is required because it has a fixed end: .*CSV columns top_steel and top_depth$/);
  });

  it("an effective depth beyond h is an error on that row's effective_depth column", () => {
    const { result, parsed } = parse([
      "RB1,floor_beam,1,concrete-fc30,,tee,1200,100,300,600,2000,530,,,7.5,pinned roller,18,12",
      "RB2,floor_beam,1,concrete-fc30,,tee,1200,100,300,600,2000,650,,,7.5,pinned roller,18,12",
    ]);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    const errors = parsed.issues.map((issue) => mapIssueToCsvRow(issue, result.places));
    expect(errors).toEqual([
      expect.objectContaining({ row: 3, column: "effective_depth [mm]", message: "effective depth d (650 mm) must be less than the section depth h (600 mm) (members[1].spans[0])" }),
    ]);
  });
});
