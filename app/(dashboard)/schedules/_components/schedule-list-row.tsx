import Link from "next/link";

import type { ScheduleRow } from "@/db/queries/schedules";

import { ProgressBar } from "./progress-bar";
import { StatusBadge } from "./status-badge";

export type ScheduleListRowProps = { schedule: ScheduleRow; submitted: string };

export function ScheduleListRow({ schedule: s, submitted }: ScheduleListRowProps) {
  return (
    <tr className="border-t border-rule align-top">
      <td className="max-w-xs px-3 py-2">
        <Link href={`/schedules/${s.id}`} className="font-medium text-action underline-offset-2 hover:underline [overflow-wrap:anywhere]">
          {s.name}
        </Link>
        {s.reference ? <span className="block text-xs text-ink-soft [overflow-wrap:anywhere]">{s.reference}</span> : null}
      </td>
      <td className="px-3 py-2">
        <StatusBadge status={s.status} />
      </td>
      <td className="px-3 py-2">
        <ProgressBar checked={s.checkedCount} members={s.memberCount} label={`Progress of ${s.name}`} />
      </td>
      <td className="px-3 py-2 text-right">{s.passCount.toLocaleString("en-GB")}</td>
      <td className={`px-3 py-2 text-right ${s.failCount > 0 ? "font-semibold text-fail" : ""}`}>{s.failCount.toLocaleString("en-GB")}</td>
      <td className={`px-3 py-2 text-right ${s.errorCount > 0 ? "font-semibold text-caution" : ""}`}>{s.errorCount.toLocaleString("en-GB")}</td>
      <td className="whitespace-nowrap px-3 py-2 text-ink-soft">{submitted}</td>
    </tr>
  );
}
