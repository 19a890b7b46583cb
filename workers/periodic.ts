import { purgeExpiredRows } from "@/lib/server/maintenance/purge-expired-rows";
import { sendReviewDigests } from "@/lib/server/review/send-review-digests";
import { reconcileSchedules } from "@/lib/server/schedules/reconcile-schedules";
import { dispatchOutboxUntilEmpty, reconcileDeliveries } from "@/lib/server/webhooks/dispatch-outbox";

/**
 * Periodic tasks of a worker process (reconciliation, outbox dispatch), each a function that is
 * safe to run concurrently in several processes. Returns a stop function.
 */
export type PeriodicTask = { name: string; everyMs: number; run: () => Promise<void> };

export const periodicTasks: PeriodicTask[] = [
  { name: "reconcile-schedules", everyMs: Number(process.env.RECONCILE_EVERY_MS ?? 10_000), run: async () => void (await reconcileSchedules()) },
  // Webhooks: fan the outbox out every second; re-queue overdue delivery attempts (Redis lost them).
  { name: "dispatch-outbox", everyMs: Number(process.env.OUTBOX_DISPATCH_EVERY_MS ?? 1_000), run: async () => void (await dispatchOutboxUntilEmpty()) },
  // Old sign-in throttles, Idempotency-Keys and reset links: their rows would otherwise grow forever.
  { name: "purge-expired-rows", everyMs: Number(process.env.PURGE_EVERY_MS ?? 600_000), run: async () => void (await purgeExpiredRows()) },
  // Review digests: immediate ones on the next run after a schedule completes with failures, daily ones after the daily hour.
  { name: "send-review-digests", everyMs: Number(process.env.DIGEST_EVERY_MS ?? 10_000), run: async () => void (await sendReviewDigests()) },
  { name: "reconcile-deliveries", everyMs: Number(process.env.DELIVERY_RECONCILE_EVERY_MS ?? 15_000), run: async () => void (await reconcileDeliveries()) },
];

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
