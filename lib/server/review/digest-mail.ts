import { SAFETY_CAUTION } from "@/lib/safety";
import { escapeHtml } from "@/lib/server/mail/templates";
import type { Mail } from "@/lib/server/mail/send-mail";

export interface DigestSchedule {
  id: string;
  name: string;
  reference: string | null;
  failCount: number;
  errorCount: number;
  completedAt: Date;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The review digest: each schedule that completed with failures, its counts and a link to its members in the queue. */
export function buildReviewDigestMail(input: { to: string; organizationName: string; schedules: DigestSchedule[]; appUrl: string; frequency: "immediate" | "daily" }): Mail {
  const members = input.schedules.reduce((n, s) => n + s.failCount + s.errorCount, 0);
  const subject = `Sagline review digest: ${plural(input.schedules.length, "schedule")} with ${plural(members, "member")} to review`;
  const items = input.schedules.map((s) => {
    const url = new URL(`/review?scheduleId=${encodeURIComponent(s.id)}`, input.appUrl).toString();
    const counts = [s.failCount > 0 ? `${s.failCount} failed` : null, s.errorCount > 0 ? `${s.errorCount} could not be checked` : null].filter(Boolean).join(", ");
    return { title: `${s.name}${s.reference ? ` (${s.reference})` : ""}`, counts, completed: `${s.completedAt.toISOString().slice(0, 16).replace("T", " ")} UTC`, url };
  });
  const lead =
    input.frequency === "daily"
      ? `Schedules of ${input.organizationName} that completed with failures since your last daily digest.`
      : `A schedule of ${input.organizationName} completed with failures.`;
  const queueUrl = new URL("/review", input.appUrl).toString();
  const text = [
    lead,
    "",
    ...items.flatMap((i) => [`- ${i.title}: ${i.counts}; completed ${i.completed}`, `  ${i.url}`]),
    "",
    `The whole review queue: ${queueUrl}`,
    `Change how often you get this e-mail under "Digest e-mail" on the review page.`,
    "",
    `Caution: ${SAFETY_CAUTION}`,
    "",
  ].join("\n");
  const rows = items
    .map((i) => `<li style="margin:0 0 8px"><a href="${escapeHtml(i.url)}">${escapeHtml(i.title)}</a>: ${escapeHtml(i.counts)}; completed ${escapeHtml(i.completed)}</li>`)
    .join("");
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1f2328;background:#f7f6f2;padding:24px">
<div style="max-width:560px;margin:auto;background:#fff;border:1px solid #d9d6cc;padding:24px">
<h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(subject)}</h1><p>${escapeHtml(lead)}</p><ul style="padding-left:18px">${rows}</ul>
<p><a href="${escapeHtml(queueUrl)}">Open the review queue</a>. Change how often you get this e-mail under "Digest e-mail" on the review page.</p>
<p style="font-size:12px;color:#7a4b00;border-top:1px solid #d9d6cc;padding-top:8px">Caution: ${escapeHtml(SAFETY_CAUTION)}</p>
</div></body></html>`;
  return { to: input.to, subject, text, html };
}
