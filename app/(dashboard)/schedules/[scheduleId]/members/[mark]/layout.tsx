import { notFound } from "next/navigation";
import type { ReactNode } from "react";

import { getMemberResult } from "@/db/queries/schedules";
import { requirePage } from "@/lib/server/auth/guards";

import { decodeMark, findSchedule } from "./find-member";

type MemberLayoutProps = { children: ReactNode; params: Promise<{ scheduleId: string; mark: string }> };

/**
 * Access and existence are decided here, above the route's loading boundary: a redirect to sign-in,
 * the 403 page or a 404 keeps its status code, while the page's engine re-run streams in behind
 * loading.tsx.
 */
export default async function MemberLayout({ children, params }: MemberLayoutProps) {
  const { scheduleId, mark: markSegment } = await params;
  const context = await requirePage("/schedules/[scheduleId]/members/[mark]", `/schedules/${encodeURIComponent(scheduleId)}/members/${markSegment}`);
  const schedule = await findSchedule(context.active!.organizationId, scheduleId);
  const mark = decodeMark(markSegment);
  if (!schedule || mark === null || !(await getMemberResult(schedule.id, mark))) notFound();
  return <>{children}</>;
}
