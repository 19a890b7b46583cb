import Link from "next/link";

import { getScheduleProfileVersion } from "@/lib/server/criteria/recheck-schedule";

import { RecheckButton } from "./recheck-button";

export type ProfileVersionNoticeProps = { organizationId: string; scheduleId: string; canRecheck: boolean };

/**
 * On a schedule's page: the organization profile version it was checked against, the schedule it
 * rechecks or the rechecks made of it, and, once the profile has a newer version, the recheck.
 * Nothing for a schedule checked against a preset or its own limits.
 */
export async function ProfileVersionNotice({ organizationId, scheduleId, canRecheck }: ProfileVersionNoticeProps) {
  const info = await getScheduleProfileVersion(organizationId, scheduleId);
  if (info === null) return null;
  const newer = info.currentVersion !== null && info.currentVersion > info.version;
  return (
    <aside aria-label="Limit profile version" className="mt-3 space-y-2 rounded border border-rule bg-sheet px-3 py-2 text-sm">
      <p>
        Checked against limit profile{" "}
        <Link href={`/settings/limit-profiles/${info.profileId}`} className="text-action underline">
          {info.currentLabel ?? info.profileId}
        </Link>
        , version {info.version}
        {info.currentVersion === null ? " (the profile has since been removed)" : newer ? `; the profile is at version ${info.currentVersion} now. These results stay as they were checked.` : " (current)."}
      </p>
      {info.recheckOfScheduleId ? (
        <p className="text-xs text-ink-soft">
          A recheck of{" "}
          <Link href={`/schedules/${info.recheckOfScheduleId}`} className="underline">
            {info.recheckOfScheduleId}
          </Link>
          .
        </p>
      ) : null}
      {info.recheckedByScheduleIds.length > 0 ? (
        <p className="text-xs text-ink-soft">
          Rechecked as{" "}
          {info.recheckedByScheduleIds.map((id, index) => (
            <span key={id}>
              {index > 0 ? ", " : ""}
              <Link href={`/schedules/${id}`} className="underline">
                {id}
              </Link>
            </span>
          ))}
          .
        </p>
      ) : null}
      {newer && canRecheck ? <RecheckButton scheduleId={scheduleId} version={info.currentVersion!} /> : null}
    </aside>
  );
}
