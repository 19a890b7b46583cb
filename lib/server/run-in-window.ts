/**
 * Runs `task(0) ... task(count - 1)` with at most `window` running at once, in index order of
 * starting; rejects with the first failure once the tasks already running have settled.
 */
export async function runInWindow(count: number, window: number, task: (index: number) => Promise<void>): Promise<void> {
  let next = 0;
  let failure: { error: unknown } | null = null;
  const lane = async () => {
    while (next < count && !failure) {
      const index = next++;
      try {
        await task(index);
      } catch (error) {
        failure ??= { error };
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(window, count) }, lane));
  if (failure) throw (failure as { error: unknown }).error;
}
