// Issue 10 (RELIABILITY figure 11): a valid schedule body costs at most twice its size plus a
// constant until it is stored, JSON and CSV alike, at 10,000 and at 100,000 members; measured in
// a fresh process (intake-memory-probe.ts) that collects garbage before the baseline. Before the
// compact member form, the member objects alone took about 11x the body.
import { execFile } from "node:child_process";
import { fileURLToPath } from "node:url";
import { promisify } from "node:util";

import { describe, expect, it } from "vitest";

const probe = fileURLToPath(new URL("./intake-memory-probe.ts", import.meta.url));
// The constant covers the per-member bookkeeping (marks, rows and lines, the duplicate-mark index)
// up to the 100,000-member cap, about 400 bytes a member.
const CONSTANT_BYTES = 64 * 1024 * 1024;

async function runProbe(kind: string, members: number) {
  const { stdout } = await promisify(execFile)(process.execPath, ["--expose-gc", "--import", "tsx", probe, kind, String(members)], { maxBuffer: 1024 * 1024 });
  return JSON.parse(stdout.trim().split("\n").at(-1)!) as { members: number; bodyBytes: number; peakBytes: number; chunkChars: number };
}

describe("memory from a valid body to its chunk texts", () => {
  it.each([
    ["json", 10_000],
    ["json", 100_000],
    ["csv", 10_000],
    ["csv", 100_000],
  ])("%s, %i members: peak at most 2x the body plus 64 MiB", async (kind, members) => {
    const result = await runProbe(kind, members);
    console.info(`${kind} ${members} members: ${result.bodyBytes} body bytes, peak ${result.peakBytes} bytes (${(result.peakBytes / result.bodyBytes).toFixed(2)}x)`);
    expect(result.members).toBe(members);
    expect(result.chunkChars).toBeGreaterThan(0);
    expect(result.peakBytes, JSON.stringify(result)).toBeLessThanOrEqual(2 * result.bodyBytes + CONSTANT_BYTES);
  });
});
