// Issue 10, stall 1 (RELIABILITY figure 11): listing the schema errors of a schedule whose
// members are all invalid grows linearly: 100,000 bad members cost at most 12x 10,000.
import { describe, expect, it } from "vitest";

import { MAX_LISTED_ERRORS } from "@/lib/server/schedules/issue-pointers";
import { findScheduleSchemaErrors } from "@/lib/server/schedules/validate-schedule-schema";
import { growthRatio, measureCpuMs } from "@/tests/hostile/growth";

const createBadDoc = (count: number) => ({
  format: "sagline.schedule/v2",
  name: "Invented stall test",
  units: { system: "SI" },
  profile: { preset: "ibc-2021-floor" },
  members: Array.from({ length: count }, () => ({})),
});

describe("schema errors of many invalid members", () => {
  it("lists at most MAX_LISTED_ERRORS and counts every invalid member", () => {
    const found = findScheduleSchemaErrors(createBadDoc(10_000));
    expect(found?.listed).toHaveLength(MAX_LISTED_ERRORS);
    expect(found?.listed[0]?.pointer).toMatch(/^\/members\/0/);
    // Each listed member contributes all its errors; every later member counts once.
    const listedMembers = new Set(found!.listed.map((e) => e.pointer!.split("/")[2])).size;
    expect(found?.total).toBeGreaterThanOrEqual(MAX_LISTED_ERRORS + (10_000 - listedMembers));
  });

  it("costs at most 12x the time for 10x the members", () => {
    const small = createBadDoc(10_000);
    const large = createBadDoc(100_000);
    findScheduleSchemaErrors(small); // compile outside the measurement
    const smallMs = measureCpuMs(() => void findScheduleSchemaErrors(small));
    const largeMs = measureCpuMs(() => void findScheduleSchemaErrors(large));
    const summary = `10,000 bad members: ${smallMs.toFixed(1)} ms CPU, 100,000: ${largeMs.toFixed(1)} ms CPU`;
    console.info(summary);
    expect(growthRatio(smallMs, largeMs), summary).toBeLessThanOrEqual(12);
  });

  it("keeps listing bounded inside one member with very many bad loads", () => {
    const doc = createBadDoc(1);
    doc.members = [{ loads: Array.from({ length: 200_000 }, () => ({ colour: "red" })) }];
    const found = findScheduleSchemaErrors(doc);
    expect(found?.listed.length).toBeGreaterThan(0);
    expect(found?.listed.length).toBeLessThanOrEqual(MAX_LISTED_ERRORS);
  });
});
