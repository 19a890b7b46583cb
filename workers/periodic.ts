/**
 * Periodic tasks of a worker process (reconciliation, outbox dispatch), each a function that is
 * safe to run concurrently in several processes. Returns a stop function.
 */
export type PeriodicTask = { name: string; everyMs: number; run: () => Promise<void> };

export const periodicTasks: PeriodicTask[] = [];

export function startPeriodicTasks(): () => void {
  const timers = periodicTasks.map((task) => {
    let running = false;
    return setInterval(() => {
      if (running) return;
      running = true;
      task
        .run()
        .catch((error: Error) => console.error(`[worker] ${task.name}: ${error.message}`))
        .finally(() => {
          running = false;
        });
    }, task.everyMs);
  });
  return () => timers.forEach(clearInterval);
}
