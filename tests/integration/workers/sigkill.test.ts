// RELIABILITY figure 2: a worker killed with SIGKILL at random points, 20 times, during one
// schedule. The schedule completes with exactly one result per member and check.
import { afterAll, describe, expect, it } from "vitest";

import { demoOrganizations } from "@/db/seed-data";
import { countResults, createDrill, getScheduleProgress, waitForProgress } from "@/tests/helpers/drill";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

const drill = createDrill("kill");
const MEMBERS = 12_000;
const KILLS = 20;

afterAll(() => drill.killAll());

describe("workers killed with SIGKILL", () => {
  it("lose and double nothing", { timeout: 300_000 }, async () => {
    // This test's jobs live under their own queue prefix, so only the workers it starts (and kills) see them.
    process.env.REDIS_PREFIX = drill.prefix;
    process.env.CHECK_CHUNK_SIZE = "100";
    const { submitSchedule } = await import("@/lib/server/schedules/submit-schedule");
    const members = Array.from({ length: MEMBERS }, (_, i) => createBeam(`K-${i}`, 3 + (i % 7), 5 + (i % 5)));
    const { id } = await submitSchedule({ organizationId: demoOrganizations.engineering.id, source: "api-json", doc: createScheduleDoc(members, `Kill drill ${drill.prefix}`) });

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
