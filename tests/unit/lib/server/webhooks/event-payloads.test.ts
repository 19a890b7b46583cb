import { readFileSync } from "node:fs";

import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";

import { createResultDownloadLinks } from "@/lib/server/schedules/result-download-link";
import { buildScheduleCompletedEvent, RESULT_ROWS_CAP, type ResultRow } from "@/lib/server/webhooks/events/schedule-completed";
import { buildMemberDispositionedEvent, buildScheduleFailedEvent, buildWebhookTestEvent } from "@/lib/server/webhooks/events/simple-events";

const ajv = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true });
addFormats(ajv);
function schemaFor(type: string) {
  const id = `https://sagline.example/api-schemas/v1/events/${type}.schema.json`;
  const compiled = ajv.getSchema(id);
  if (compiled) return compiled;
  const file = new URL(`../../../../../api-schemas/v1/events/${type}.schema.json`, import.meta.url);
  return ajv.compile(JSON.parse(readFileSync(file, "utf8")));
}

function expectValid(type: string, payload: unknown) {
  const validate = schemaFor(type);
  // JSON round trip: what the receiver parses is what must conform.
  const valid = validate(JSON.parse(JSON.stringify(payload)));
  expect(validate.errors ?? [], type).toEqual([]);
  expect(valid).toBe(true);
}

const occurredAt = new Date("2026-12-01T10:00:00Z");
const schedule = {
  id: "sch_lumenbrook2",
  name: "Lumenbrook Depot level 2 beams",
  reference: "BHS-2026-114-L2",
  completedAt: new Date("2026-12-01T10:00:00Z"),
  memberCount: 3,
  checkedCount: 3,
  passCount: 2,
  failCount: 1,
  errorCount: 0,
};
const download = createResultDownloadLinks({ organizationId: "org_lumenbrook", scheduleId: schedule.id, occurredAt, appUrl: "http://127.0.0.1:3790", secret: "a-test-secret-of-at-least-32-characters!" });

function rows(n: number): ResultRow[] {
  return Array.from({ length: n }, (_, i) => ({ mark: `B${i + 1}`, governingCheck: "live, span 1", utilization: 0.5, factorOfSafety: 2, limitRatio: 360, achievedRatio: 720, status: "pass" as const }));
}

describe("event payloads conform to their published JSON Schemas", () => {
  it("schedule.completed with every row", () => {
    const event = buildScheduleCompletedEvent({
      schedule,
      rows: [
        { mark: "B1", governingCheck: "live, span 1", utilization: 0.82, factorOfSafety: 1.22, limitRatio: 360, achievedRatio: 439, status: "pass" as const },
        { mark: "B2", governingCheck: "total, span 2", utilization: 1.31, factorOfSafety: 0.76, limitRatio: 240, achievedRatio: 183, status: "fail" as const },
        { mark: "C1", governingCheck: null, utilization: null, factorOfSafety: Number.POSITIVE_INFINITY, limitRatio: null, achievedRatio: null, status: "pass" as const },
        // fails on frequency alone: the frequency governs, with no deflection figures
        { mark: "F1", governingCheck: "frequency", utilization: 1.25, factorOfSafety: 0.8, limitRatio: null, achievedRatio: null, status: "fail" as const },
      ],
      appUrl: "http://127.0.0.1:3790",
      occurredAt,
      download,
    });
    expectValid("schedule.completed", event);
    expect(event.data.truncated).toBe(false);
    expect(event.data.rows).toHaveLength(4);
    // failing rows first, in member order, then the passing ones
    expect(event.data.rows.map((r) => r.mark)).toEqual(["B2", "F1", "B1", "C1"]);
    expect(event.data.rows[1]).toMatchObject({ status: "fail", governingCheck: "frequency", utilization: 1.25, limitRatio: null });
    expect(event.data.rows[2]).toMatchObject({ status: "pass", limitRatio: 360, achievedRatio: 439 });
    // JSON cannot carry Infinity; a non-finite factor of safety is sent as null.
    expect(event.data.rows[3]!.factorOfSafety).toBeNull();
    expect(event.data.download.csv).toMatch(/^http:\/\/127\.0\.0\.1:3790\/api\/v1\/result-downloads\/[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+$/);
    expect(event.data.download.expiresAt).toBe("2026-12-08T10:00:00.000Z");
    expect(event.data.resultsUrl).toBe("http://127.0.0.1:3790/api/v1/schedules/sch_lumenbrook2/results");
    expect(event.data.counts).toEqual({ members: 3, checked: 3, pass: 2, fail: 1, error: 0 });
  });

  it("schedule.completed carries a member's engine notes, and only when it has some", () => {
    const event = buildScheduleCompletedEvent({
      schedule,
      rows: [
        { mark: "C1", governingCheck: "live, span 1", utilization: 0.5, factorOfSafety: 2, status: "pass", limitRatio: 360, achievedRatio: 720, notes: ["gross section: cracking not included"] },
        { mark: "B1", governingCheck: "live, span 1", utilization: 0.5, factorOfSafety: 2, status: "pass", limitRatio: 360, achievedRatio: 720, notes: [] },
      ],
      appUrl: "http://127.0.0.1:3790",
      occurredAt,
      download,
    });
    expectValid("schedule.completed", event);
    expect(event.data.rows[0]!.notes).toEqual(["gross section: cracking not included"]);
    expect("notes" in event.data.rows[1]!).toBe(false);
  });

  it("schedule.completed beyond the row cap is truncated and points at the results", () => {
    const big = { ...schedule, memberCount: RESULT_ROWS_CAP + 500, checkedCount: RESULT_ROWS_CAP + 500, passCount: RESULT_ROWS_CAP + 500, failCount: 0 };
    const event = buildScheduleCompletedEvent({ schedule: big, rows: rows(RESULT_ROWS_CAP + 1), appUrl: "https://sagline.example", occurredAt, download });
    expectValid("schedule.completed", event);
    expect(event.data.rows).toHaveLength(1_000);
    expect(event.data.truncated).toBe(true);
    expect(event.data.rowLimit).toBe(1_000);
  });

  it("schedule.completed keeps every failing and errored row when passing rows fill the cap", () => {
    const errored: ResultRow = { mark: "E1", status: "error", governingCheck: null, utilization: null, factorOfSafety: null, limitRatio: null, achievedRatio: null, failureReason: "the member is a mechanism" };
    const failing: ResultRow = { mark: "F9", status: "fail", governingCheck: "live, span 1", utilization: 1.4, factorOfSafety: 0.71, limitRatio: 360, achievedRatio: 257 };
    const big = { ...schedule, memberCount: RESULT_ROWS_CAP + 3, checkedCount: RESULT_ROWS_CAP + 3, passCount: RESULT_ROWS_CAP + 1, failCount: 1, errorCount: 1 };
    const event = buildScheduleCompletedEvent({ schedule: big, rows: [...rows(RESULT_ROWS_CAP - 1), errored, failing, ...rows(2)], appUrl: "https://sagline.example", occurredAt, download });
    expectValid("schedule.completed", event);
    expect(event.data.rows.slice(0, 2)).toEqual([
      { ...errored, governingCheck: null },
      { ...failing, status: "fail" },
    ]);
    expect(event.data.rows.slice(2).every((r) => r.status === "pass")).toBe(true);
    expect(event.data.truncated).toBe(true);
    expect(event.data.counts).toMatchObject({ pass: RESULT_ROWS_CAP + 1, fail: 1, error: 1 });
  });

  it("a row count at exactly the cap is not truncated", () => {
    const exact = { ...schedule, memberCount: RESULT_ROWS_CAP };
    const event = buildScheduleCompletedEvent({ schedule: exact, rows: rows(RESULT_ROWS_CAP), appUrl: "https://sagline.example", occurredAt, download });
    expect(event.data.truncated).toBe(false);
  });

  const dispositioned = {
    dispositionId: "dsp_41",
    scheduleId: "sch_x1",
    reference: "LBD-HB-S03",
    mark: "B12/3",
    disposition: "information_requested" as const,
    by: "Invented Engineer",
    note: null,
    decidedAt: "2026-03-02T09:15:00.000Z",
    bulkId: null,
  };

  it("schedule.failed, member.dispositioned and webhook.test", () => {
    expectValid("schedule.failed", buildScheduleFailedEvent({ scheduleId: "sch_x1", name: null, reason: "The schedule has no members.", occurredAt }));
    expectValid(
      "member.dispositioned",
      buildMemberDispositionedEvent({
        ...dispositioned,
        disposition: "accepted_with_justification",
        note: "Within the span/240 total limit after site measurement.",
        occurredAt,
        appUrl: "https://sagline.example",
      }),
    );
    const revised = buildMemberDispositionedEvent({ ...dispositioned, disposition: "member_to_be_revised", bulkId: "bulk_7k2m", occurredAt, appUrl: "https://sagline.example" });
    expectValid("member.dispositioned", revised);
    expect(revised.data.memberUrl).toBe("https://sagline.example/api/v1/schedules/sch_x1/members/B12%2F3");
    expectValid("webhook.test", buildWebhookTestEvent({ endpointId: "wh_7k2m", occurredAt }));
  });

  it("the schemas reject what the builders must never send", () => {
    const completed = schemaFor("schedule.completed");
    const event = JSON.parse(JSON.stringify(buildScheduleCompletedEvent({ schedule, rows: rows(1), appUrl: "https://sagline.example", occurredAt, download })));
    expect(completed({ ...event, data: { ...event.data, secret: "whsec_x" } })).toBe(false);
    expect(completed({ ...event, type: "schedule.failed" })).toBe(false);
    expect(completed({ ...event, data: { ...event.data, rows: [{ mark: "B1", status: "passed" }] } })).toBe(false);
    expect(() => buildMemberDispositionedEvent({ ...dispositioned, mark: "", occurredAt, appUrl: "https://sagline.example" })).toThrow();
    // @ts-expect-error: a disposition outside Sagline's three kinds must not be sent
    expect(() => buildMemberDispositionedEvent({ ...dispositioned, disposition: "accepted-as-is", occurredAt, appUrl: "https://sagline.example" })).toThrow();
    const event2 = JSON.parse(JSON.stringify(buildMemberDispositionedEvent({ ...dispositioned, occurredAt, appUrl: "https://sagline.example" })));
    expect(schemaFor("member.dispositioned")({ ...event2, data: { ...event2.data, email: "a@b.example" } })).toBe(false);
  });
});
