import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { listFailureRecord } from "@/db/queries/results";
import { getSchedule } from "@/db/queries/schedules";
import { requirePage } from "@/lib/server/auth/guards";
import { getRequestContext } from "@/lib/server/auth/request-context";
import { formatOutcomeCount } from "@/lib/vocabulary";

import { formatDateTime } from "../../../_components/format-date-time";
import { categoryLabels, formatCheckKey, formatRatio, formatSpanRatio, scheduleStatusLabels } from "../../_components/format";
import { OutcomeLabel } from "../../_components/outcome-label";
import { reviewStateLabels } from "../../_components/review-state-labels";

type RecordPageProps = { params: Promise<{ scheduleId: string }> };

/** Members a record lists; a larger set is named with its count and left to the CSV export. */
const RECORD_MEMBER_CAP = 5000;
const DISPOSITIONS_PER_MEMBER = 20;

export async function generateMetadata({ params }: RecordPageProps): Promise<Metadata> {
  const { scheduleId } = await params;
  const context = await getRequestContext();
  const schedule = context?.active ? await getSchedule(context.active.organizationId, scheduleId) : null;
  return { title: schedule ? `${schedule.name} · record` : "Schedule record" };
}

/** The printable record of a schedule: its summary, the members that did not pass and the decisions on them, with the caution. */
export default async function ScheduleRecordPage({ params }: RecordPageProps) {
  const { scheduleId } = await params;
  const context = await requirePage("/schedules/[scheduleId]/record", `/schedules/${encodeURIComponent(scheduleId)}/record`);
  const schedule = await getSchedule(context.active!.organizationId, scheduleId);
  if (!schedule) notFound();
  const failures = await listFailureRecord(schedule.id, { limit: RECORD_MEMBER_CAP, dispositionsPerMember: DISPOSITIONS_PER_MEMBER });
  const notPassing = schedule.failCount + schedule.errorCount;

  return (
    <article className="space-y-4 text-sm print:text-xs" data-testid="schedule-record">
      <p className="text-xs print:hidden">
        <Link href={`/schedules/${schedule.id}`} className="text-action underline">
          Back to the results
        </Link>
        {" · "}
        Print this page (Ctrl+P or ⌘P) for a paper or PDF record.
      </p>
      <header className="border-b border-rule pb-2">
        <h1 className="text-lg font-semibold [overflow-wrap:anywhere]">Serviceability record: {schedule.name}</h1>
        {schedule.reference ? <p className="text-ink-soft [overflow-wrap:anywhere]">Reference {schedule.reference}</p> : null}
      </header>
      <SafetyCaution />
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 sm:grid-cols-4">
        <dt className="font-medium">Status</dt>
        <dd>{scheduleStatusLabels[schedule.status] ?? schedule.status}</dd>
        <dt className="font-medium">Members</dt>
        <dd>
          {schedule.checkedCount.toLocaleString("en-GB")} of {schedule.memberCount.toLocaleString("en-GB")} checked
        </dd>
        <dt className="font-medium">Outcomes</dt>
        <dd>
          {formatOutcomeCount(schedule.passCount, "pass")} · {formatOutcomeCount(schedule.failCount, "fail")} · {formatOutcomeCount(schedule.errorCount, "error")}
        </dd>
        <dt className="font-medium">Limit profile</dt>
        <dd className="[overflow-wrap:anywhere]">
          {schedule.profile.label} ({schedule.profile.source})
        </dd>
        <dt className="font-medium">Submitted</dt>
        <dd>{formatDateTime(schedule.createdAt)}</dd>
        <dt className="font-medium">Finished</dt>
        <dd>{schedule.completedAt ? formatDateTime(schedule.completedAt) : "not yet"}</dd>
      </dl>

      <section aria-labelledby="record-failures">
        <h2 id="record-failures" className="mb-1 font-semibold">
          Members that did not pass, and the decisions on them
        </h2>
        {failures.length === 0 ? (
          <p>Every checked member passed.</p>
        ) : (
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="border-b border-rule text-xs uppercase tracking-wide">
                <th scope="col" className="py-1 pr-2">Mark</th>
                <th scope="col" className="py-1 pr-2">Category</th>
                <th scope="col" className="py-1 pr-2">Governing check</th>
                <th scope="col" className="py-1 pr-2 text-right">Utilization</th>
                <th scope="col" className="py-1 pr-2 text-right">
                  <span className="normal-case">l/N achieved (limit)</span>
                </th>
                <th scope="col" className="py-1 pr-2">Result</th>
                <th scope="col" className="py-1">Review and decisions</th>
              </tr>
            </thead>
            <tbody>
              {failures.map((f) => (
                <tr key={f.memberIndex} className="break-inside-avoid border-b border-rule align-top">
                  <th scope="row" className="py-1 pr-2 font-medium [overflow-wrap:anywhere]">{f.mark}</th>
                  <td className="py-1 pr-2">{categoryLabels[f.category] ?? f.category}</td>
                  <td className="py-1 pr-2">{formatCheckKey(f.governingCheck)}</td>
                  <td className="py-1 pr-2 text-right">{formatRatio(f.utilization)}</td>
                  <td className="py-1 pr-2 text-right whitespace-nowrap">{f.limitRatio === null ? "—" : `${formatSpanRatio(f.achievedRatio)} (${formatSpanRatio(f.limitRatio)})`}</td>
                  <td className="py-1 pr-2">
                    <OutcomeLabel status={f.status} />
                  </td>
                  <td className="py-1">
                    <p>{f.reviewState ? (reviewStateLabels[f.reviewState] ?? f.reviewState) : "No review recorded"}</p>
                    {f.dispositions.length > 0 ? (
                      <ol className="mt-0.5 list-decimal pl-4 text-xs">
                        {f.dispositions.map((d, i) => (
                          <li key={i} className="[overflow-wrap:anywhere]">
                            {reviewStateLabels[d.kind] ?? d.kind} · {d.decidedBy} · {formatDateTime(new Date(d.decidedAt))}
                            {d.justification ? <span className="block text-ink-soft">“{d.justification}”</span> : null}
                          </li>
                        ))}
                      </ol>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {notPassing > failures.length ? (
          <p className="mt-2 font-medium">
            This record lists the first {failures.length.toLocaleString("en-GB")} of {notPassing.toLocaleString("en-GB")} members that did not pass; the CSV export holds every member.
          </p>
        ) : null}
      </section>
      <footer className="border-t border-rule pt-2 text-xs">
        <SafetyCaution />
        <p className="mt-1 text-ink-soft">Printed from Sagline, schedule {schedule.id}.</p>
      </footer>
    </article>
  );
}
