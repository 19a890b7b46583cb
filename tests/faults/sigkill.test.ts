// RELIABILITY figure 2: a worker killed with SIGKILL at random points, 20 times, during one
// 20,000-member schedule (200 chunks of 100). Each kill lands while the schedule is unfinished and
// after the worker has stored at least one chunk since it started, so every kill interrupts real
// work; then the schedule completes with exactly one result per member and check.
import { afterAll, describe, expect, it } from "vitest";

import { countResults, createDrill, getScheduleProgress, submitDrillSchedule, waitForFinalState, waitForProgress } from "@/tests/helpers/drill";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("kill");
const MEMBERS = 20_000;
const KILLS = 20;
/** After the last kill, a fresh worker finishes the rest within this (stated in README). */
const FINISH_WITHIN_MS = 240_000;

afterAll(async () => {
  drill.killAll();
  await closeQueues();
});

describe("workers killed with SIGKILL", () => {
  it("lose and double nothing", { timeout: 900_000 }, async () => {
    // This test's jobs live under their own queue prefix, so only the workers it starts (and kills) see them.
    const id = await submitDrillSchedule(drill, { markPrefix: "K", memberCount: MEMBERS, label: "Kill drill" });
    const killedAt: { chunksDone: number; status: string }[] = [];
    while (killedAt.length < KILLS) {
      const before = (await getScheduleProgress(id)).chunks_done;
      // No engine warm-up: under load it costs about 10 s a start, 20 starts here.
      const victim = drill.startWorker({ ENGINE_WARM_UP: "0" });
      // This worker is running chunks: wait for one more chunk stored, then kill it at a random point.
      await waitForProgress(id, (p) => p.chunks_done > before || p.status === "completed", 120_000);
      await new Promise((r) => setTimeout(r, Math.random() * 600));
      const at = await getScheduleProgress(id);
      drill.killHard(victim);
      killedAt.push({ chunksDone: at.chunks_done, status: at.status });
    }
    // Every kill hit an unfinished schedule (the fault landed mid-schedule, not after it).
    expect(killedAt.filter((k) => k.status === "completed")).toEqual([]);
    expect(killedAt.every((k) => k.chunksDone < MEMBERS / 100)).toBe(true);

    drill.startWorker();
    const final = await waitForFinalState(id, FINISH_WITHIN_MS);
    drill.killAll();
    console.log(`[sigkill] ${KILLS} kills at chunks ${killedAt.map((k) => k.chunksDone).join(",")}; completed ${final.seconds.toFixed(1)} s after submission`);

    expect(final.status).toBe("completed");
    expect(final.chunks_done).toBe(final.chunk_count);
    expect(final.checked_count).toBe(MEMBERS);
    // The IBC floor preset has two combinations (live; dead + live) on one span: two checks each.
    expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
  });
});
