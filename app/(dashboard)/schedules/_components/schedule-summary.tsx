import type { ReactNode } from "react";

import type { ScheduleRow } from "@/db/queries/schedules";
import { TERMS, formatOutcomeCount } from "@/lib/vocabulary";

import { formatDateTime } from "../../_components/format-date-time";
import { isScheduleFinished } from "./format";
import { LiveProgress } from "./live-progress";
import { ProgressBar } from "./progress-bar";
import { StatusBadge } from "./status-badge";

export type ScheduleSummaryProps = { schedule: ScheduleRow };

// One div per dt/dd pair, directly in the dl (a deeper wrapper breaks the list for screen readers).
function Item({ term, children, className = "" }: { term: string; children: ReactNode; className?: string }) {
  return (
    <div className={`min-w-0 ${className}`}>
      <dt className="text-xs font-medium uppercase tracking-wide text-ink-soft">{term}</dt>
      <dd className="mt-0.5 [overflow-wrap:anywhere]">{children}</dd>
    </div>
  );
}

const sourceLabels: Record<string, string> = { upload: "CSV upload", "api-csv": "API (CSV)", "api-json": "API (JSON)" };

export function ScheduleSummary({ schedule: s }: ScheduleSummaryProps) {
  const running = !isScheduleFinished(s.status);
  return (
    <section aria-label="Summary" className="mt-4 rounded border border-rule bg-sheet p-4">
      <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-4">
        <Item term="Status">
          <StatusBadge status={s.status} />
        </Item>
        <Item term="Progress">
          {running ? (
            <LiveProgress scheduleId={s.id} initial={{ status: s.status, checked: s.checkedCount, members: s.memberCount }} />
          ) : (
            <ProgressBar checked={s.checkedCount} members={s.memberCount} label="Members checked" />
          )}
        </Item>
        <Item term="Results">
          <span className="text-pass">{formatOutcomeCount(s.passCount, "pass")}</span>
          {" · "}
          <span className={s.failCount > 0 ? "font-semibold text-fail" : ""}>{formatOutcomeCount(s.failCount, "fail")}</span>
          {" · "}
          <span className={s.errorCount > 0 ? "font-semibold text-caution" : ""}>{formatOutcomeCount(s.errorCount, "error")}</span>
        </Item>
        <Item term="Submitted">
          {formatDateTime(s.createdAt)}
          <span className="block text-xs text-ink-soft">
            {sourceLabels[s.source] ?? s.source}
            {s.completedAt ? ` · finished ${formatDateTime(s.completedAt)}` : ""}
          </span>
        </Item>
        <Item term={TERMS.profile.label} className="sm:col-span-2 lg:col-span-4">
          <span className="font-medium">{s.profile.label}</span> <span className="text-ink-soft">({s.profile.id})</span>
          <span className="block text-xs text-ink-soft">Source: {s.profile.source}</span>
        </Item>
        {s.failureReason ? (
          <Item term={TERMS.failureReason.label} className="sm:col-span-2 lg:col-span-4">
            <span className="text-fail">{s.failureReason}</span>
          </Item>
        ) : null}
      </dl>
    </section>
  );
}
