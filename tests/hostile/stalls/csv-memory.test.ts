// Issue 10, stall 3 (RELIABILITY figure 11): reading a CSV body keeps memory within twice the
// body's size plus a constant, measured in a fresh process (csv-memory-probe.ts) for bodies that
// keep nothing but the body itself: 17 MB of blank lines (it ran the web process out of memory
// before), an endless quoted cell, and rows that all fail. Valid rows also keep their members,
// which the 100,000-row limit caps; that figure is printed here (garbage included) and bounded,
// live, from body to chunk texts, in intake-memory.test.ts.
import { execFile } from "node:child_process";
import { fileURLToPath } from "node:url";
import { promisify } from "node:util";

import { describe, expect, it } from "vitest";

const probe = fileURLToPath(new URL("./csv-memory-probe.ts", import.meta.url));
const CONSTANT_BYTES = 32 * 1024 * 1024;

async function runProbe(kind: string, bytes: number) {
  const { stdout } = await promisify(execFile)(process.execPath, ["--expose-gc", "--import", "tsx", probe, kind, String(bytes)], { maxBuffer: 1024 * 1024 });
  return JSON.parse(stdout.trim().split("\n").at(-1)!) as { bodyBytes: number; peakBytes: number; ok: boolean; code: string | null; errorCount: number };
}

describe("memory while reading a CSV body", () => {
  it.each([
    ["blank-lines", "too_many_rows"],
    ["open-quote", "row_too_long"],
    ["bad-rows", "invalid_number"],
  ])("%s (17 MB): refused with %s, peak at most 2x the body plus 32 MiB", async (kind, code) => {
    const result = await runProbe(kind, 17_000_000);
    expect(result.code).toBe(code);
    expect(result.peakBytes, JSON.stringify(result)).toBeLessThanOrEqual(2 * result.bodyBytes + CONSTANT_BYTES);
  });

  it("valid rows: the members kept for intake, reported", async () => {
    const result = await runProbe("good-rows", 4_000_000);
    expect(result.ok).toBe(true);
    console.info(`valid rows: ${result.bodyBytes} body bytes, peak ${result.peakBytes} bytes (${(result.peakBytes / result.bodyBytes).toFixed(1)}x)`);
  });
});
