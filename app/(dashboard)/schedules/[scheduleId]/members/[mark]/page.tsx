import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { listMaterialIds } from "@/lib/engine/materials";
import type { UnitSystem } from "@/lib/engine/units";
import { requirePage } from "@/lib/server/auth/guards";
import { getRequestContext } from "@/lib/server/auth/request-context";
import { getMemberReport } from "@/lib/server/schedules/get-member-report";

import { DispositionPanel } from "../../../../review/_components/disposition-panel";
import { PageHeader } from "../../../../_components/page-header";
import { resolveDisplayUnits } from "../../../_components/display-units";
import { categoryLabels, formatCheckKey, formatRatio } from "../../../_components/format";
import { MemberChecksTable } from "../../../_components/member-checks-table";
import { MemberFrequency, MemberSuggestion } from "../../../_components/member-findings";
import { MemberInputs } from "../../../_components/member-inputs";
import { MemberNotes } from "../../../_components/member-notes";
import { MemberRotations } from "../../../_components/member-rotations";
import { MemberUsed } from "../../../_components/member-used";
import { MemberWhatIf } from "../../../_components/member-what-if";
import { OutcomeLabel } from "../../../_components/outcome-label";
import { ShapeDiagram } from "../../../_components/shape-diagram";
import { decodeMark, findSchedule } from "./find-member";

type MemberPageProps = { params: Promise<{ scheduleId: string; mark: string }> };

export async function generateMetadata({ params }: MemberPageProps): Promise<Metadata> {
  const { scheduleId, mark: markSegment } = await params;
  const mark = decodeMark(markSegment);
  const context = await getRequestContext();
  const schedule = context?.active ? await findSchedule(context.active.organizationId, scheduleId) : null;
  if (!schedule || mark === null) return { title: "Member" };
  return { title: `Member ${mark} · ${schedule.name}` };
}

function readUnitSystem(units: unknown): UnitSystem | null {
  const system = typeof units === "object" && units !== null ? (units as { system?: unknown }).system : undefined;
  return system === "US" || system === "SI" ? system : null;
}

export default async function MemberPage({ params }: MemberPageProps) {
  const { scheduleId, mark: markSegment } = await params;
  const context = await requirePage("/schedules/[scheduleId]/members/[mark]", `/schedules/${encodeURIComponent(scheduleId)}/members/${markSegment}`);
  const schedule = await findSchedule(context.active!.organizationId, scheduleId);
  const mark = decodeMark(markSegment);
  if (!schedule || mark === null) notFound();
  const report = await getMemberReport(schedule.id, mark, { model: true });
  if (!report) notFound();
  const { status, checks, shape, rotations, model = null } = report;
  const units = resolveDisplayUnits(model?.unitSystem ?? readUnitSystem(report.units), model?.unitDefaults ?? (report.units as Record<string, string> | null));
  const labels = Object.fromEntries((model?.combinations ?? []).map((c) => [c.id, c.label]));
  const currentIMm4 = model ? Math.max(...model.spans.map((span) => span.iMm4)) : null;
  const checked = status === "pass" || status === "fail";

  return (
    <>
      <p className="mb-2 text-xs [overflow-wrap:anywhere] print:hidden">
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
        <PageHeader title={`Member ${report.mark}`} lead={`${categoryLabels[report.category] ?? report.category} · ${schedule.name} · checked against ${schedule.profile.label}`}>
          <span className="text-base" data-testid="member-outcome">
            <OutcomeLabel status={status} />
          </span>
        </PageHeader>
      </div>
      <SafetyCaution />

      <div className="mt-6 space-y-6">
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

        <section aria-labelledby="result-heading" className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <div className="min-w-0 space-y-4">
            <div className="rounded border border-rule bg-sheet p-4">
              <h2 id="result-heading" className="mb-2 font-semibold">
                Result on record
              </h2>
              <p data-testid="record-summary">
                Governing: {formatCheckKey(report.governingCheck)} · utilization {formatRatio(report.utilization)} · factor of safety {formatRatio(report.factorOfSafety)}
              </p>
              {report.governingCheck === "frequency" ? (
                <p className="mt-1 text-ink-soft">The first frequency governs: its utilization (minimum / first frequency) is higher than any deflection check&apos;s.</p>
              ) : null}
            </div>
            {checked ? <MemberSuggestion status={status} suggestion={report.suggestion} units={units} currentIMm4={currentIMm4} /> : null}
            <MemberFrequency frequency={report.frequency} />
            <DispositionPanel organizationId={context.active!.organizationId} scheduleId={schedule.id} mark={report.mark} />
          </div>
          <div className="min-w-0">
            {checked && model ? (
              <MemberWhatIf
                scheduleId={schedule.id}
                mark={report.mark}
                units={units}
                materialIds={listMaterialIds().filter((id) => !id.includes("<"))}
                record={{ pass: status === "pass", utilization: report.utilization, governingCheck: report.governingCheck, checks }}
              />
            ) : null}
          </div>
        </section>

        <section aria-labelledby="checks-heading">
          <h2 id="checks-heading" className="mb-2 font-semibold">
            Checks
          </h2>
          <MemberChecksTable checks={checks} governingKey={report.governingCheck} units={units} labels={labels} limits={model?.checkLimits ?? []} />
        </section>

        <section aria-labelledby="shape-heading" className="break-inside-avoid-page">
          <h2 id="shape-heading" className="mb-2 font-semibold">
            Diagrams
          </h2>
          <ShapeDiagram shape={shape} model={model} checks={checks} units={units} idPrefix="record" />
        </section>

        <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <section aria-labelledby="used-heading" className="min-w-0 rounded border border-rule bg-sheet p-4">
            <h2 id="used-heading" className="mb-2 font-semibold">
              What was used
            </h2>
            {model ? <MemberUsed model={model} units={units} /> : <p className="text-ink-soft">The engine could not read this member again, so what it used is not shown.</p>}
          </section>
          <section aria-labelledby="inputs-heading" className="min-w-0 rounded border border-rule bg-sheet p-4">
            <h2 id="inputs-heading" className="mb-2 font-semibold">
              Inputs as submitted
            </h2>
            <MemberInputs input={report.input} units={units} />
          </section>
        </div>

        <section aria-labelledby="rotations-heading">
          <h2 id="rotations-heading" className="mb-2 font-semibold">
            Rotations at the nodes
          </h2>
          <MemberRotations rotations={rotations} />
        </section>
      </div>
    </>
  );
}
