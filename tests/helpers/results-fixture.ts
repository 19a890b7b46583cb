// A checked schedule written straight into the result tables (no worker): members with chosen
// utilizations, marks, categories and review states, so orderings and filters can be checked
// against a list computed here. Invented marks; the figures are not engineering results.
import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { copyRows } from "@/lib/server/copy-rows";
import { createId } from "@/lib/server/ids";

export interface FixtureMember {
  memberIndex: number;
  mark: string;
  category: string;
  utilization: number | null;
  pass: boolean;
  error: boolean;
  awaitingReview: boolean;
}

const CATEGORIES = ["floor_beam", "roof_beam", "lintel", "cantilever"];

/** n members: utilization repeats every 37 (ties), every 23rd an error, marks in mixed case with LIKE wildcards in some. */
export function createFixtureMembers(n: number): FixtureMember[] {
  return Array.from({ length: n }, (_, i) => {
    const error = i % 23 === 7;
    const utilization = error ? null : Math.round(((i * 17) % 37) * 4) / 100;
    const pass = !error && (utilization ?? 0) <= 1;
    const mark = i % 11 === 3 ? `b_%${i}` : i % 2 === 0 ? `B-${String(i).padStart(4, "0")}` : `b-${String(i).padStart(4, "0")}`;
    return { memberIndex: i, mark, category: CATEGORIES[i % CATEGORIES.length]!, utilization, pass, error, awaitingReview: !pass && i % 3 !== 0 };
  });
}


async function writeOutcomes(tx: TransactionSql, id: string, members: FixtureMember[]): Promise<void> {
  await copyRows(
    tx,
    "member_outcomes",
    ["schedule_id", "member_index", "mark", "category", "pass", "governing_check", "utilization", "detail", "section", "material", "quantity", "spans_mm"],
    members.map((m) => [
      id,
      m.memberIndex,
      m.mark,
      m.category,
      m.pass,
      m.error ? null : "live@0",
      m.utilization,
      m.error ? JSON.stringify({ frequency: null, suggestion: null, error: "spans: invented error" }) : null,
      "W 250x25 (invented)",
      "steel-s355",
      1,
      "{6000}",
    ]),
  );
  const reviewed = members.filter((m) => !m.pass);
  if (reviewed.length === 0) return;
  await copyRows(
    tx,
    "member_reviews",
    ["schedule_id", "member_index", "organization_id", "mark", "category", "outcome", "utilization", "state"],
    reviewed.map((m) => [id, m.memberIndex, demoOrganizations.engineering.id, m.mark, m.category, m.error ? "error" : "fail", m.utilization, m.awaitingReview ? "awaiting_review" : "member_to_be_revised"]),
  );
}

function countOutcomes(members: FixtureMember[]) {
  const pass = members.filter((m) => m.pass).length;
  const errors = members.filter((m) => m.error).length;
  return { pass, fail: members.length - pass - errors, errors };
}

/**
 * Writes the members as one schedule of the demo engineering organization; returns its id. A
 * running one (`memberCount` above the members given) holds them as its first done chunk, the way
 * workers leave it, so its live counts come from its chunks; appendFixtureChunk adds the next.
 */
export async function insertResultsFixture(members: FixtureMember[], options: { name?: string; memberCount?: number } = {}): Promise<string> {
  const sql = getSql();
  const id = createId("sch");
  const name = options.name ?? "Results fixture, Lumenbrook Depot Hall B (invented)";
  const memberCount = options.memberCount ?? members.length;
  const running = memberCount > members.length;
  const counts = countOutcomes(members);
  const header = { format: "sagline.schedule/v2", name, units: { system: "SI" }, profile: { preset: "ibc-2021-floor" } };
  await sql.begin(async (tx) => {
    await tx`
      insert into schedules (id, organization_id, name, status, source, profile, header, member_count, chunk_count, chunks_done, checked_count, pass_count, fail_count, error_count, completed_at)
      values (${id}, ${demoOrganizations.engineering.id}, ${name}, ${running ? "checking" : "completed"}, 'api-json', ${JSON.stringify({ id: "ibc-2021-floor", label: "Fixture limits", source: "fixture" })}::jsonb,
        ${JSON.stringify(header)}::jsonb, ${memberCount}, ${running ? 2 : 0}, 0, ${members.length}, ${counts.pass}, ${counts.fail}, ${counts.errors}, case when ${running} then null else now() end)`;
    await writeOutcomes(tx, id, members);
  });
  if (running) await appendFixtureChunk(id, 0, members, { outcomesWritten: true });
  return id;
}

/** Stores a chunk's members as done, outcomes and counts in one transaction, as checkChunk commits them. */
export async function appendFixtureChunk(scheduleId: string, chunkIndex: number, members: FixtureMember[], options: { outcomesWritten?: boolean } = {}): Promise<void> {
  const counts = countOutcomes(members);
  await getSql().begin(async (tx) => {
    if (!options.outcomesWritten) await writeOutcomes(tx, scheduleId, members);
    await tx`
      insert into schedule_chunks (schedule_id, chunk_index, first_member, member_count, marks, members, done_at, pass_count, fail_count, error_count)
      values (${scheduleId}, ${chunkIndex}, ${members[0]?.memberIndex ?? 0}, ${members.length}, ${tx.array(members.map((m) => m.mark))}, '[]', now(), ${counts.pass}, ${counts.fail}, ${counts.errors})`;
  });
}

function compareCodePoints(a: string, b: string): number {
  const left = [...a];
  const right = [...b];
  for (let i = 0; i < Math.min(left.length, right.length); i++) {
    const d = left[i]!.codePointAt(0)! - right[i]!.codePointAt(0)!;
    if (d !== 0) return d;
  }
  return left.length - right.length;
}

/** The expected order of each sort, written independently of the SQL. */
export function sortFixture(members: FixtureMember[], sort: "schedule" | "utilization" | "mark" | "category"): FixtureMember[] {
  const key = (m: FixtureMember) => m.memberIndex;
  return [...members].sort((a, b) => {
    let d = 0;
    if (sort === "utilization") d = (a.utilization === null ? Infinity : -a.utilization) - (b.utilization === null ? Infinity : -b.utilization);
    if (sort === "mark") d = compareCodePoints(a.mark.toLowerCase(), b.mark.toLowerCase());
    if (sort === "category") d = a.category < b.category ? -1 : a.category > b.category ? 1 : 0;
    if (Number.isNaN(d)) d = 0;
    return d !== 0 ? d : key(a) - key(b);
  });
}
