import { and, eq, inArray } from "drizzle-orm";

import { getDb } from "@/db/client";
import { memberships, organizations, roles, users, type EndpointDisabledReason } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { hasPermission } from "@/lib/server/auth/permissions";
import { sendMail, type Mail } from "@/lib/server/mail/send-mail";
import { escapeHtml } from "@/lib/server/mail/templates";

const reasonText: Record<EndpointDisabledReason, string> = {
  manual: "It was disabled by hand.",
  gone: "The receiver answered 410 Gone, which says the endpoint no longer exists.",
  failing: "Every attempt of the published retry schedule failed.",
};

export function buildEndpointDisabledMail(input: {
  to: string;
  organizationName: string;
  url: string;
  reason: EndpointDisabledReason;
  lastStatusCode: number | null;
  lastError: string | null;
  consoleUrl: string;
}): Mail {
  const subject = `Webhook endpoint disabled for ${input.organizationName}`;
  const last = input.lastStatusCode !== null ? `The last attempt was answered with HTTP ${input.lastStatusCode}.` : input.lastError ? `The last attempt failed: ${input.lastError}.` : "";
  const lines = [
    `Sagline stopped sending events to ${input.url}.`,
    reasonText[input.reason],
    last,
    "Fix the receiver, enable the endpoint again in the console, then resend the failed deliveries.",
  ].filter(Boolean);
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1f2328">
<h1 style="font-size:18px">${escapeHtml(subject)}</h1>${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("")}
<p><a href="${escapeHtml(input.consoleUrl)}">Open the webhook console</a></p></body></html>`;
  return { to: input.to, subject, text: `${lines.join("\n\n")}\n\nWebhook console: ${input.consoleUrl}\n`, html };
}

/** E-mails everyone in the organization whose role manages integrations (integrators, administrators). */
export async function notifyEndpointDisabled(input: {
  endpointId: string;
  organizationId: string;
  url: string;
  reason: EndpointDisabledReason;
  lastStatusCode: number | null;
  lastError: string | null;
}): Promise<number> {
  const db = getDb();
  const [organization] = await db.select({ name: organizations.name }).from(organizations).where(eq(organizations.id, input.organizationId));
  const managingRoles = roles.filter((r) => hasPermission(r, "integrations:manage"));
  const recipients = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organizationId, input.organizationId), inArray(memberships.role, managingRoles)));
  const consoleUrl = new URL("/integrations/webhooks", getEnv().APP_URL).toString();
  for (const { email } of recipients) {
    await sendMail(
      buildEndpointDisabledMail({ to: email, organizationName: organization?.name ?? "your organization", url: input.url, reason: input.reason, lastStatusCode: input.lastStatusCode, lastError: input.lastError, consoleUrl }),
    );
  }
  return recipients.length;
}
