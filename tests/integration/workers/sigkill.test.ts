// RELIABILITY figure 2: a worker killed with SIGKILL at random points, 20 times, during one
// schedule. The schedule completes with exactly one result per member and check.
import { afterAll, describe, expect, it } from "vitest";

import { countResults, createDrill, getScheduleProgress, submitDrillSchedule, waitForProgress } from "@/tests/helpers/drill";

const drill = createDrill("kill");
const MEMBERS = 12_000;
const KILLS = 20;

afterAll(() => drill.killAll());

describe("workers killed with SIGKILL", () => {
  it("lose and double nothing", { timeout: 300_000 }, async () => {
    // This test's jobs live under their own queue prefix, so only the workers it starts (and kills) see them.
    const id = await submitDrillSchedule(drill, { markPrefix: "K", memberCount: MEMBERS, label: "Kill drill" });

    let kills = 0;
    let victim = drill.startWorker();
    drill.startWorker();
    while (kills < KILLS) {
      await new Promise((r) => setTimeout(r, 300 + Math.random() * 900));
      if ((await getScheduleProgress(id)).status === "completed") break;
      drill.killHard(victim);
      kills += 1;
      victim = drill.startWorker();
    }
    const final = await waitForProgress(id, (p) => p.status === "completed", 240_000);
    drill.killAll();

    expect(final.chunks_done).toBe(final.chunk_count);
    expect(final.checked_count).toBe(MEMBERS);
    // Most kills must have landed while work was still going on, or the drill proved little.
    expect(kills).toBeGreaterThanOrEqual(10);
    // The IBC floor preset has two combinations (live; dead + live) on one span: two checks each.
    expect(await countResults(id)).toEqual({ outcomes: { n: MEMBERS, d: MEMBERS }, checks: { n: MEMBERS * 2, d: MEMBERS * 2 } });
  });
});
