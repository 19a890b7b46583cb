import { describe, expect, it } from "vitest";

import { DomainError } from "@/lib/server/errors";
import { readQueueQuery, toQueueSearchParams } from "@/lib/server/review/queue-filters";

describe("readQueueQuery", () => {
  it("defaults to members awaiting review, highest utilization first; empty parameters mean any", () => {
    expect(readQueueQuery(new URLSearchParams("category=&scheduleId="))).toEqual({ state: "awaiting_review", sort: "utilization" });
  });

  it("reads every filter", () => {
    const query = readQueueQuery(new URLSearchParams("state=member_to_be_revised&scheduleId=sch_abc1&projectId=prj_x&category=lintel&governingCheck=live@0&utilizationAbove=1.25&sort=age"));
    expect(query).toEqual({ state: "member_to_be_revised", scheduleId: "sch_abc1", projectId: "prj_x", category: "lintel", governingCheck: "live@0", utilizationAbove: 1.25, sort: "age" });
    expect(readQueueQuery(toQueueSearchParams(query))).toEqual(query);
  });

  it.each([
    ["utilizationAbove=lots", "/query/utilizationAbove"],
    ["utilizationAbove=-1", "/query/utilizationAbove"],
    ["sort=mark", "/query/sort"],
    ["state=approved", "/query/state"],
    ["scheduleId=not-an-id", "/query/scheduleId"],
    [`category=${"x".repeat(121)}`, "/query/category"],
  ])("refuses %s naming the parameter, never widening the selection", (search, pointer) => {
    try {
      readQueueQuery(new URLSearchParams(search));
      expect.unreachable("a bad parameter must be refused");
    } catch (error) {
      expect(error).toBeInstanceOf(DomainError);
      expect((error as DomainError).code).toBe("bad_request");
      expect((error as DomainError).errors[0]?.pointer).toBe(pointer);
    }
  });
});
