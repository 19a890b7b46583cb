// Issue 10, stalls 2 and 3 (RELIABILITY figure 11): header cells are split without backtracking
// and capped; reading CSV rows grows linearly (10x the rows, at most 12x the time).
import { describe, expect, it } from "vitest";

import { createCsvRowMapper } from "@/lib/schedule-csv";
import { MAX_HEADER_CELL_CHARS, splitHeader } from "@/lib/schedule-csv/columns";
import { parseScheduleCsvBytes } from "@/lib/schedule-csv/parse-schedule-csv-stream";
import { growthRatio, measureCpuMs, measureCpuMsAsync } from "@/tests/hostile/growth";

const HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m]";
const options = { delimiter: "," as const, name: "Invented growth test", limits: { preset: "ibc-2021-floor" }, units: {} };

function buildCsv(rows: number, span: string): Uint8Array {
  const lines = [HEADER];
  for (let i = 0; i < rows; i++) lines.push(`B-${i},floor_beam,1,steel-s355,rectangle,100,200,${span},pinned roller,1`);
  return Buffer.from(lines.join("\r\n") + "\r\n");
}

describe("CSV header cells", () => {
  it("a + 4,000 spaces + b: split in linear time (10x the spaces, at most 12x the time)", () => {
    const cell = (spaces: number) => `a${" ".repeat(spaces)}b [m`; // no closing bracket: the worst case of the old pattern
    const small = cell(4_000);
    const large = cell(40_000);
    const smallMs = measureCpuMs(() => {
      for (let i = 0; i < 200; i++) splitHeader(small);
    });
    const largeMs = measureCpuMs(() => {
      for (let i = 0; i < 200; i++) splitHeader(large);
    });
    expect(splitHeader(small)).toBeNull();
    const summary = `header cell, 200 splits: 4,000 spaces ${smallMs.toFixed(1)} ms CPU, 40,000 spaces ${largeMs.toFixed(1)} ms CPU`;
    console.info(summary);
    expect(growthRatio(smallMs, largeMs, 2), summary).toBeLessThanOrEqual(12);
  });

  it("a header cell over the cap is refused naming its column", () => {
    const created = createCsvRowMapper(["mark", `a${" ".repeat(4_000)}b`]);
    expect(created.ok).toBe(false);
    if (created.ok) return;
    expect(created.errors[0]).toMatchObject({ row: 1, code: "header_too_long" });
    expect(created.errors[0]?.message).toContain(`column 2`);
    expect(created.errors[0]?.message).toContain(`at most ${MAX_HEADER_CELL_CHARS}`);
  });
});

describe("CSV rows", () => {
  it.each([
    ["valid rows", "3.5", 5_000],
    ["rows that all fail", "3,5", 10_000],
  ])("%s: 10x the rows cost at most 12x the time", async (label, span, rows) => {
    const small = buildCsv(rows, span);
    const large = buildCsv(10 * rows, span);
    // warm up both sizes outside the measurement: the first large read also grows the heap once
    await parseScheduleCsvBytes(small, options);
    await parseScheduleCsvBytes(large, options);
    const smallMs = await measureCpuMsAsync(async () => void (await parseScheduleCsvBytes(small, options)));
    const largeMs = await measureCpuMsAsync(async () => void (await parseScheduleCsvBytes(large, options)));
    const summary = `${label}: ${rows} rows ${smallMs.toFixed(1)} ms CPU, ${10 * rows} rows ${largeMs.toFixed(1)} ms CPU`;
    console.info(summary);
    expect(growthRatio(smallMs, largeMs), summary).toBeLessThanOrEqual(12);
  });
});
