// A fixed pool of engine threads, one per check job the process runs at once (CHECK_CONCURRENCY),
// so the configured concurrency is real parallelism on the cores rather than jobs taking turns on
// one event loop. A thread that dies fails only its own task (the job retries) and is replaced.
import { Worker } from "node:worker_threads";

import type { ScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";
import type { Outcome } from "@/lib/server/schedules/check-chunk";

import type { EngineReply, EngineTask } from "./engine-messages";

type Pending = { task: EngineTask; resolve: (outcomes: Outcome[]) => void; reject: (error: Error) => void };
type Slot = { thread: Worker; busy: Pending | null; ready: boolean };

const threadUrl = new URL("./engine-thread-entry.mjs", import.meta.url);
/** Threads that die before they are ready, in a row, before the pool stops replacing them. */
const MAX_FAILED_STARTS = 3;

export type EnginePool = {
  checkMembers: (header: Record<string, unknown>, firstMember: number, membersJson: string, criteria: ScheduleCriteria | null) => Promise<Outcome[]>;
  close: () => Promise<void>;
};

export function createEnginePool(size: number): EnginePool {
  const slots: Slot[] = [];
  const waiting: Pending[] = [];
  let nextTaskId = 1;
  let closed = false;
  let failedStarts = 0;
  let broken: Error | null = null;

  function dispatch() {
    for (const slot of slots) {
      if (slot.busy || waiting.length === 0) continue;
      const pending = waiting.shift()!;
      slot.busy = pending;
      slot.thread.postMessage(pending.task);
    }
  }

  function spawn(): Slot {
    const slot: Slot = { thread: new Worker(threadUrl), busy: null, ready: false };
    slot.thread.on("message", (message: EngineReply | { ready: true }) => {
      if ("ready" in message) {
        slot.ready = true;
        failedStarts = 0;
        return;
      }
      const pending = slot.busy;
      slot.busy = null;
      if (pending && pending.task.taskId === message.taskId) {
        if (message.ok) pending.resolve(message.outcomes);
        else pending.reject(new Error(message.message));
      }
      dispatch();
    });
    slot.thread.on("error", (error) => console.error(`[worker] engine thread: ${error.message}`));
    slot.thread.on("exit", (code) => {
      const pending = slot.busy;
      slot.busy = null;
      pending?.reject(new Error(`engine thread exited with code ${code}`));
      const index = slots.indexOf(slot);
      if (index >= 0) slots.splice(index, 1);
      if (!slot.ready) failedStarts += 1;
      if (closed) return;
      if (failedStarts >= MAX_FAILED_STARTS) {
        // Jobs then fail and retry later (or in another process) instead of waiting forever.
        broken = new Error(`engine threads do not start (exit code ${code})`);
        for (const waiter of waiting.splice(0)) waiter.reject(broken);
        return;
      }
      slots.push(spawn());
      dispatch();
    });
    return slot;
  }

  for (let i = 0; i < Math.max(1, size); i++) slots.push(spawn());

  return {
    checkMembers(header, firstMember, membersJson, criteria) {
      if (closed) return Promise.reject(new Error("engine pool closed"));
      if (broken) return Promise.reject(broken);
      return new Promise<Outcome[]>((resolve, reject) => {
        waiting.push({ task: { taskId: nextTaskId++, header, firstMember, membersJson, criteria }, resolve, reject });
        dispatch();
      });
    },
    async close() {
      closed = true;
      for (const pending of waiting.splice(0)) pending.reject(new Error("engine pool closed"));
      await Promise.all(slots.map((slot) => slot.thread.terminate()));
    },
  };
}
