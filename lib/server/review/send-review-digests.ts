import { getSql } from "@/db/client";
import { getEnv } from "@/lib/env";
import { sendMail } from "@/lib/server/mail/send-mail";

import { DEFAULT_DIGEST_FREQUENCY } from "./digest-preferences";
import { buildReviewDigestMail, type DigestSchedule } from "./digest-mail";

/** Schedules older than this are never put in a first digest (a new engineer is not sent the archive). */
export const DIGEST_LOOKBACK_DAYS = 7;
/** Pairs of person and schedule handled per run; the next run takes the rest. */
export const DIGEST_PAIRS_PER_RUN = 2_000;
/** At most this many schedules listed in one e-mail; the rest go in the next one. */
export const DIGEST_SCHEDULES_PER_MAIL = 50;

/** The hour (UTC) daily digests go out: DIGEST_DAILY_HOUR_UTC, default 7. */
export function getDailyDigestHourUtc(): number {
  const hour = Number(process.env.DIGEST_DAILY_HOUR_UTC ?? 7);
  return Number.isInteger(hour) && hour >= 0 && hour <= 23 ? hour : 7;
}

/** The latest daily send moment at or before `now`. */
export function getDailyDigestMoment(now: Date, hourUtc = getDailyDigestHourUtc()): Date {
  const moment = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), hourUtc));
  if (moment > now) moment.setUTCDate(moment.getUTCDate() - 1);
  return moment;
}

interface PendingPair extends DigestSchedule {
  userId: string;
  email: string;
  organizationId: string;
  organizationName: string;
  frequency: "immediate" | "daily";
}

/**
 * Sends the review digests that are due: to each engineer and administrator (the roles that
 * disposition) of an organization, one e-mail listing the organization's schedules that completed
 * with failures and were not in an earlier digest of theirs. "immediate" people get it on the next
 * run after completion; "daily" people once a day after the daily hour; "none" never. Safe to run
 * concurrently: the send rows are inserted (primary key person + schedule) in the transaction that
 * sends, so a second runner finds nothing left to send.
 */
export async function sendReviewDigests(now: Date = new Date()): Promise<{ mails: number; schedules: number }> {
  const sql = getSql();
  // As ISO text: postgres-js sends a Date only where it knows the parameter's type.
  const nowIso = now.toISOString();
  const dailyMoment = getDailyDigestMoment(now).toISOString();
  const pairs = await sql`
    select m.user_id, u.email, m.organization_id, o.name as organization_name,
      coalesce(p.frequency, ${DEFAULT_DIGEST_FREQUENCY}) as frequency,
      s.id, s.name, s.reference, s.fail_count, s.error_count, s.completed_at
    from memberships m
    join users u on u.id = m.user_id
    join organizations o on o.id = m.organization_id
    left join review_digest_preferences p on p.user_id = m.user_id and p.organization_id = m.organization_id
    join schedules s on s.organization_id = m.organization_id
    where m.role in ('engineer', 'admin')
      and coalesce(p.frequency, ${DEFAULT_DIGEST_FREQUENCY}) <> 'none'
      and s.status = 'completed' and s.fail_count + s.error_count > 0
      and s.completed_at > greatest(m.created_at, ${nowIso}::timestamptz - make_interval(days => ${DIGEST_LOOKBACK_DAYS}))
      and s.completed_at <= ${nowIso}
      and not exists (select 1 from review_digest_sends d where d.user_id = m.user_id and d.schedule_id = s.id)
      and (coalesce(p.frequency, ${DEFAULT_DIGEST_FREQUENCY}) = 'immediate' or (
        ${nowIso}::timestamptz >= ${dailyMoment}::timestamptz
        and not exists (select 1 from review_digest_sends d where d.user_id = m.user_id and d.frequency = 'daily' and d.sent_at >= ${dailyMoment}::timestamptz)))
    order by m.user_id, m.organization_id, s.completed_at
    limit ${DIGEST_PAIRS_PER_RUN}`;

  const groups = new Map<string, PendingPair[]>();
  for (const r of pairs) {
    const key = `${r.user_id as string}\u0000${r.organization_id as string}`;
    const group = groups.get(key) ?? [];
    if (group.length >= DIGEST_SCHEDULES_PER_MAIL) continue;
    group.push({
      userId: r.user_id as string,
      email: r.email as string,
      organizationId: r.organization_id as string,
      organizationName: r.organization_name as string,
      frequency: r.frequency as "immediate" | "daily",
      id: r.id as string,
      name: r.name as string,
      reference: (r.reference as string | null) ?? null,
      failCount: r.fail_count as number,
      errorCount: r.error_count as number,
      completedAt: new Date(r.completed_at as string | Date),
    });
    groups.set(key, group);
  }

  let mails = 0;
  let schedules = 0;
  for (const group of groups.values()) {
    const first = group[0]!;
    try {
      const sent = await sql.begin(async (tx) => {
        const claimed = await tx`
          insert into review_digest_sends (user_id, organization_id, schedule_id, frequency, sent_at)
          select ${first.userId}, ${first.organizationId}, x.id, ${first.frequency}, ${nowIso}::timestamptz
          from json_to_recordset(${JSON.stringify(group.map((g) => ({ id: g.id })))}::json) as x(id text)
          on conflict do nothing
          returning schedule_id`;
        const ids = new Set(claimed.map((c) => c.schedule_id as string));
        const listed = group.filter((g) => ids.has(g.id));
        if (listed.length === 0) return 0;
        // Sent inside the transaction: if the SMTP server refuses, the claim rolls back and the next run retries.
        await sendMail(buildReviewDigestMail({ to: first.email, organizationName: first.organizationName, schedules: listed, appUrl: getEnv().APP_URL, frequency: first.frequency }));
        return listed.length;
      });
      if (sent > 0) {
        mails += 1;
        schedules += sent;
      }
    } catch (error) {
      console.error(`[sagline] review digest to ${first.userId} not sent: ${(error as Error).message}`);
    }
  }
  return { mails, schedules };
}
