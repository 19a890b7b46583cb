// Keyset pages on the schedules list and on a schedule's results table, following the links the pages render.
import { beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { signInAs, type Agent } from "@/tests/helpers/app";

import { BEAM_HEADER, beamRow, toCsv, uploadCsv, waitForSchedule } from "./upload-helpers";

const LIST_PAGE = 25;
const RESULTS_PAGE = 50;

let submitter: Agent;
beforeAll(async () => {
  submitter = await signInAs("submitter");
});

function linkAfter(html: string, label: string): string | null {
  const match = new RegExp(`href="([^"]+)"[^>]*>${label}<`).exec(html);
  return match ? match[1]!.replaceAll("&amp;", "&") : null;
}

describe("the results table", () => {
  it("pages through every member once, in schedule order, keeping the filter", async () => {
    const marks = Array.from({ length: 120 }, (_, i) => `PAGE-${String(i + 1).padStart(3, "0")}`);
    const created = await uploadCsv(submitter, toCsv([BEAM_HEADER, ...marks.map((m) => beamRow(m, 200, 600))]), { name: "Pagination" });
    expect(created.status).toBe(202);
    await waitForSchedule(submitter, created.body.id);

    const seen: string[] = [];
    let url: string | null = `/schedules/${created.body.id}?status=pass`;
    let pages = 0;
    while (url) {
      const response = await submitter.get(url);
      expect(response.status).toBe(200);
      const onPage = [...response.text.matchAll(/>(PAGE-\d{3})<\/a>/g)].map((m) => m[1]!);
      expect(onPage.length).toBeLessThanOrEqual(RESULTS_PAGE);
      seen.push(...onPage);
      url = linkAfter(response.text, `Next ${RESULTS_PAGE} members`);
      if (url) expect(url).toContain("status=pass");
      pages++;
    }
    expect(pages).toBe(Math.ceil(marks.length / RESULTS_PAGE));
    expect(seen).toEqual(marks);
  });
});

describe("the schedules list", () => {
  it("shows the newest first, 25 a page, each schedule exactly once", async () => {
    const [row] = await getSql()`select count(*)::int as n from schedules where organization_id = ${demoOrganizations.engineering.id}`;
    for (let i = row!.n as number; i <= LIST_PAGE; i++) {
      expect((await uploadCsv(submitter, toCsv([BEAM_HEADER, beamRow("LIST-1", 200, 600)]), { name: `List page filler ${i}` })).status).toBe(202);
    }
    const expected = await getSql()`select id from schedules where organization_id = ${demoOrganizations.engineering.id} order by created_at desc, id desc`;
    const seen: string[] = [];
    let url: string | null = "/schedules";
    while (url) {
      const response = await submitter.get(url);
      expect(response.status).toBe(200);
      const onPage = [...response.text.matchAll(/href="\/schedules\/(sch_[0-9a-z]+)"/g)].map((m) => m[1]!);
      expect(onPage.length).toBeLessThanOrEqual(LIST_PAGE);
      seen.push(...onPage);
      url = linkAfter(response.text, "Older schedules");
    }
    expect(seen).toEqual(expected.map((r) => r.id));
  });
});
