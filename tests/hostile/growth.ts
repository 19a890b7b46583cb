/**
 * Growth checks for RELIABILITY figure 11: the cost of some work at n and at 10n, compared as a
 * ratio (never an absolute limit). CPU time of this process, the least of a few runs, so other
 * processes on the machine count as little as possible.
 */
export function measureCpuMs(run: () => void, runs = 3): number {
  let least = Number.POSITIVE_INFINITY;
  for (let i = 0; i < runs; i++) {
    const start = process.cpuUsage();
    run();
    const used = process.cpuUsage(start);
    least = Math.min(least, (used.user + used.system) / 1000);
  }
  return least;
}

export async function measureCpuMsAsync(run: () => Promise<void>, runs = 3): Promise<number> {
  let least = Number.POSITIVE_INFINITY;
  for (let i = 0; i < runs; i++) {
    const start = process.cpuUsage();
    await run();
    const used = process.cpuUsage(start);
    least = Math.min(least, (used.user + used.system) / 1000);
  }
  return least;
}

/** The ratio of the larger run to the smaller; a floor on the small one keeps timer noise out. */
export function growthRatio(smallMs: number, largeMs: number, floorMs = 5): number {
  return largeMs / Math.max(smallMs, floorMs);
}
