// One engine thread: parses and checks chunks of members off the worker's main thread, so the
// event loop stays free to renew BullMQ job locks and to write results while the engine runs.
import { parentPort } from "node:worker_threads";

import { checkMembers } from "@/lib/server/schedules/check-chunk";
import { warmUpScheduleChecks } from "@/lib/server/schedules/warm-up";

import type { EngineTask, EngineReply } from "./engine-messages";

if (!parentPort) throw new Error("engine-thread.ts runs only as a worker thread");
const port = parentPort;

// Each thread warms its own copy of the engine (the main thread no longer runs it). ENGINE_WARM_UP=0
// skips it where start-up time matters more than the first chunk's speed (the kill drill).
function warmUp() {
  try {
    const started = performance.now();
    warmUpScheduleChecks();
    console.log(`[worker] engine thread warmed up in ${Math.round(performance.now() - started)} ms`);
  } catch (error) {
    console.error("[worker] engine thread warm-up failed", error);
  }
}
if (process.env.ENGINE_WARM_UP !== "0") warmUp();

port.on("message", (task: EngineTask) => {
  let reply: EngineReply;
  try {
    reply = { taskId: task.taskId, ok: true, outcomes: checkMembers(task.header, task.firstMember, JSON.parse(task.membersJson) as unknown[], task.criteria) };
  } catch (error) {
    reply = { taskId: task.taskId, ok: false, message: error instanceof Error ? error.message : String(error) };
  }
  port.postMessage(reply);
});
port.postMessage({ ready: true });
