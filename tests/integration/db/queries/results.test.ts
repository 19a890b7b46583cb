// db/queries/results.ts against PostgreSQL: every ordering pages through every member exactly once,
// forwards and backwards, in the order computed here; filters, mark prefixes, counts and page jumps.
import { beforeAll, describe, expect, it } from "vitest";

import { countResults, findPagePosition, getSortKey, listResultPage, RESULT_SORTS, type ResultPosition, type ResultQueryFilters, type ResultSort } from "@/db/queries/results";
import { createFixtureMembers, insertResultsFixture, sortFixture, type FixtureMember } from "@/tests/helpers/results-fixture";

const PAGE = 25;
let members: FixtureMember[];
let scheduleId: string;

beforeAll(async () => {
  members = createFixtureMembers(260);
  scheduleId = await insertResultsFixture(members);
});

async function walk(sort: ResultSort, filters: ResultQueryFilters, back = false): Promise<number[][]> {
  const pages: number[][] = [];
  let position: ResultPosition | undefined;
  for (let guard = 0; guard < 100; guard++) {
    const { rows, hasMore } = await listResultPage(scheduleId, { sort, filters, limit: PAGE, position });
    pages.push(rows.map((r) => r.memberIndex));
    if (!hasMore) break;
    const edge = back ? rows[0]! : rows.at(-1)!;
    position = { sort, key: getSortKey(edge, sort), index: edge.memberIndex, back, page: pages.length + 1 };
    if (back) break;
  }
  return pages;
}

describe("listResultPage", () => {
  it.each(RESULT_SORTS)("pages through every member once in %s order", async (sort) => {
    const pages = await walk(sort, {});
    expect(pages.flat()).toEqual(sortFixture(members, sort).map((m) => m.memberIndex));
    expect(pages.slice(0, -1).every((p) => p.length === PAGE)).toBe(true);
  });

  it.each(RESULT_SORTS)("reads the previous page of %s order back from a page's first row", async (sort) => {
    const expected = sortFixture(members, sort).map((m) => m.memberIndex);
    // the page that starts at row 100: its previous page is rows 75 to 99
    const first = members[expected[100]!]!;
    const position: ResultPosition = { sort, key: sort === "mark" ? first.mark.toLowerCase() : sort === "category" ? first.category : sort === "utilization" ? first.utilization : first.memberIndex, index: first.memberIndex, back: true, page: 4 };
    const { rows, hasMore } = await listResultPage(scheduleId, { sort, filters: {}, limit: PAGE, position });
    expect(rows.map((r) => r.memberIndex)).toEqual(expected.slice(75, 100));
    expect(hasMore).toBe(true);
  });

  const filterCases: [string, ResultQueryFilters, (m: FixtureMember) => boolean][] = [
    ["failures only", { status: "fail" }, (m) => !m.pass && !m.error],
    ["errors only", { status: "error" }, (m) => m.error],
    ["passes only", { status: "pass" }, (m) => m.pass],
    ["a category", { category: "lintel" }, (m) => m.category === "lintel"],
    ["utilization above 0.9", { utilizationAbove: 0.9 }, (m) => m.utilization !== null && m.utilization > 0.9],
    ["awaiting review", { awaitingReview: true }, (m) => !m.pass && m.awaitingReview],
    ["a mark prefix, any case", { markPrefix: "B-00" }, (m) => m.mark.toLowerCase().startsWith("b-00")],
    // % and _ are ordinary characters in a prefix, not wildcards
    ["a prefix with LIKE wildcards", { markPrefix: "b_%" }, (m) => m.mark.startsWith("b_%")],
    ["a prefix nothing has", { markPrefix: "zz" }, () => false],
    ["failures of a category above 1.2", { status: "fail", category: "roof_beam", utilizationAbove: 1.2 }, (m) => !m.pass && !m.error && m.category === "roof_beam" && (m.utilization ?? 0) > 1.2],
  ];

  it.each(filterCases)("filters %s, in utilization order, with its count", async (_name, filters, keep) => {
    const expected = sortFixture(members.filter(keep), "utilization").map((m) => m.memberIndex);
    expect((await walk("utilization", filters)).flat()).toEqual(expected);
    expect(await countResults(scheduleId, filters)).toBe(expected.length);
  });

  it("joins the review state and the stored inputs", async () => {
    const { rows } = await listResultPage(scheduleId, { sort: "schedule", filters: { status: "fail", awaitingReview: true }, limit: 1 });
    expect(rows[0]).toMatchObject({ status: "fail", review: { state: "awaiting_review" }, section: "W 250x25 (invented)", spansMm: [6000], quantity: 1 });
  });
});

describe("findPagePosition", () => {
  it.each(RESULT_SORTS)("jumps to the same page a walk reaches in %s order", async (sort) => {
    const pages = await walk(sort, { status: "pass" });
    const position = await findPagePosition(scheduleId, { sort, filters: { status: "pass" }, limit: PAGE, page: 4 });
    const { rows } = await listResultPage(scheduleId, { sort, filters: { status: "pass" }, limit: PAGE, position });
    expect(rows.map((r) => r.memberIndex)).toEqual(pages[3]);
    expect(await findPagePosition(scheduleId, { sort, filters: {}, limit: PAGE, page: 1000 })).toBeUndefined();
  });
});
