import { parseSchedule, type ParsedSchedule, type ParseScheduleOptions } from "@/lib/engine/intake";
import { SCHEDULE_FORMAT } from "@/lib/engine/intake/schedule-format";
import type { InputIssue } from "@/lib/engine/model";

/** A small valid SI schedule with one steel beam; tests change one thing at a time. */
export function createDoc(member: Record<string, unknown> = {}, root: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    format: SCHEDULE_FORMAT,
    name: "Test schedule",
    units: { system: "SI" },
    profile: { preset: "ibc-2021-floor" },
    members: [
      {
        mark: "B1",
        category: "floor_beam",
        quantity: 1,
        material: "steel-s355",
        section: { shape: "rectangle", b: 100, h: 200 },
        spans: [5],
        supports: ["pinned", "roller"],
        loads: [{ case: "live", type: "uniform", w: 2 }],
        ...member,
      },
    ],
    ...root,
  };
}

export function parseOk(doc: unknown, options?: ParseScheduleOptions): ParsedSchedule {
  const result = parseSchedule(doc, options);
  if (!result.ok) throw new Error(result.issues.map((i) => `${i.path}: ${i.message}`).join("\n"));
  return result.schedule;
}

export function parseIssues(doc: unknown, options?: ParseScheduleOptions): InputIssue[] {
  const result = parseSchedule(doc, options);
  if (result.ok) throw new Error("expected issues, the schedule parsed");
  return result.issues;
}

export function formatIssues(issues: InputIssue[]): string[] {
  return issues.map((i) => `${i.path}: ${i.message}`);
}
