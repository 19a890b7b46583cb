import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { getSchedule } from "@/db/queries/schedules";
import { requirePage } from "@/lib/server/auth/guards";
import { getMemberReport } from "@/lib/server/schedules/get-member-report";

import { DispositionPanel } from "../../../../review/_components/disposition-panel";
import { PageHeader } from "../../../../_components/page-header";
import { categoryLabels, formatCheckKey, formatRatio } from "../../../_components/format";
import { MemberChecksTable } from "../../../_components/member-checks-table";
import { MemberFrequency, MemberSuggestion } from "../../../_components/member-findings";
import { MemberInputs } from "../../../_components/member-inputs";
import { MemberRotations } from "../../../_components/member-rotations";
import { MemberNotes } from "../../../_components/member-notes";
import { OutcomeLabel } from "../../../_components/outcome-label";
import { ShapeDiagram } from "../../../_components/shape-diagram";

export const metadata: Metadata = { title: "Member" };

type MemberPageProps = { params: Promise<{ scheduleId: string; mark: string }> };


// Next passes the segment percent-encoded; a malformed escape is simply a mark that does not exist.
function decodeMark(segment: string): string | null {
  try {
    return decodeURIComponent(segment);
  } catch {
    return null;
  }
}

/** Bare numbers above are in the schedule's default units; say which, so no value is read without its unit. */
function ScheduleUnits({ units }: { units: unknown }) {
  if (typeof units !== "object" || units === null) return null;
  const entries = Object.entries(units as Record<string, unknown>).filter(([, v]) => typeof v === "string");
  if (entries.length === 0) return null;
  return (
    <p className="mt-3 border-t border-rule pt-2 text-xs text-ink-soft">
      Numbers without a unit are in the schedule&apos;s units: {entries.map(([k, v]) => `${k} ${String(v)}`).join(", ")}.
    </p>
  );
}

export default async function MemberPage({ params }: MemberPageProps) {
  const { scheduleId, mark: markSegment } = await params;
  const context = await requirePage("/schedules/[scheduleId]/members/[mark]", `/schedules/${encodeURIComponent(scheduleId)}/members/${markSegment}`);
  const schedule = await getSchedule(context.active!.organizationId, scheduleId);
  const mark = decodeMark(markSegment);
  if (!schedule || mark === null) notFound();
  const report = await getMemberReport(schedule.id, mark);
  if (!report) notFound();
  const { status, checks, shape, rotations } = report;
  const nodesMm = [...new Set(rotations.map((r) => r.atMm))];

  return (
    <>
      <p className="mb-2 text-xs [overflow-wrap:anywhere]">
        <Link href="/schedules" className="text-action underline">
          Schedules
        </Link>
        {" / "}
        <Link href={`/schedules/${schedule.id}`} className="text-action underline">
          {schedule.name}
        </Link>
      </p>
      {/* Marks and names may be long unbroken strings: let them wrap anywhere rather than widen the page. */}
      <div className="[&_h1]:[overflow-wrap:anywhere] [&_p]:[overflow-wrap:anywhere]">
        <PageHeader title={`Member ${report.mark}`} lead={`${categoryLabels[report.category] ?? report.category} · checked against ${schedule.profile.label}`}>
          <span className="text-base">
            <OutcomeLabel status={status} />
          </span>
        </PageHeader>
      </div>
      <SafetyCaution />

      <div className="mt-6 grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-6">
          {report.error ? (
            <section aria-labelledby="error-heading" className="rounded border border-caution/40 bg-caution-bg p-3 text-caution">
              <h2 id="error-heading" className="font-semibold">
                This member could not be checked
              </h2>
              <p className="mt-1 [overflow-wrap:anywhere]">{report.error}</p>
            </section>
          ) : null}
          {status === "pending" ? <p className="text-ink-soft">The workers have not checked this member yet.</p> : null}
          <MemberNotes notes={report.notes} />

          <section aria-labelledby="checks-heading">
            <h2 id="checks-heading" className="mb-2 font-semibold">
              Checks
            </h2>
            <p className="mb-2 text-ink-soft">
              Governing: {formatCheckKey(report.governingCheck)} · utilization {formatRatio(report.utilization)} · factor of safety{" "}
              {formatRatio(report.factorOfSafety)}
            </p>
            {report.governingCheck === "frequency" ? (
              <p className="mb-2 text-ink-soft">The first frequency governs: its utilization (minimum / first frequency) is higher than any deflection check's below.</p>
            ) : null}
            <MemberChecksTable checks={checks} governingKey={report.governingCheck} />
          </section>

          <section aria-labelledby="shape-heading">
            <h2 id="shape-heading" className="mb-2 font-semibold">
              Deflected shape
            </h2>
            <ShapeDiagram shape={shape} nodesMm={nodesMm} />
          </section>

          <section aria-labelledby="rotations-heading">
            <h2 id="rotations-heading" className="mb-2 font-semibold">
              Rotations at the nodes
            </h2>
            <MemberRotations rotations={rotations} />
          </section>
        </div>

        <aside className="min-w-0 space-y-6">
          <DispositionPanel organizationId={context.active!.organizationId} scheduleId={schedule.id} mark={report.mark} />
          <MemberSuggestion status={status} suggestion={report.suggestion} />
          <MemberFrequency frequency={report.frequency} />
          <section aria-labelledby="inputs-heading" className="rounded border border-rule bg-sheet p-4">
            <h2 id="inputs-heading" className="mb-2 font-semibold">
              Inputs as submitted
            </h2>
            <MemberInputs input={report.input} />
            <ScheduleUnits units={report.units} />
          </section>
        </aside>
      </div>
    </>
  );
}
