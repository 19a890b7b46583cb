import type { Mail } from "./send-mail";

/** Escapes text for HTML element content and quoted attribute values. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function layout(title: string, paragraphs: string[], action: { label: string; url: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("");
  return `<!doctype html><html><body style="font-family:sans-serif;color:#1f2328;background:#f7f6f2;padding:24px">
<div style="max-width:520px;margin:auto;background:#fff;border:1px solid #d9d6cc;padding:24px">
<h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}
<p><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#0f5c6e;color:#fff;padding:8px 14px;text-decoration:none;border-radius:4px">${escapeHtml(action.label)}</a></p>
<p style="font-size:12px;color:#4f5660">Or paste this address into your browser: ${escapeHtml(action.url)}</p>
</div></body></html>`;
}

export function buildInvitationMail(input: {
  to: string;
  organizationName: string;
  roleLabel: string;
  inviterName: string;
  url: string;
  expiresInHours: number;
}): Mail {
  const subject = `You are invited to ${input.organizationName} on Sagline`;
  const lines = [
    `${input.inviterName} invited you to join ${input.organizationName} on Sagline as ${input.roleLabel}.`,
    `The link works once and expires in ${input.expiresInHours} hours.`,
  ];
  return {
    to: input.to,
    subject,
    text: `${lines.join("\n\n")}\n\nAccept the invitation: ${input.url}\n`,
    html: layout(subject, lines, { label: "Accept the invitation", url: input.url }),
  };
}

export function buildPasswordResetMail(input: { to: string; url: string; expiresInMinutes: number }): Mail {
  const subject = "Reset your Sagline password";
  const lines = [
    "Someone asked to reset the password of this Sagline account. If it was not you, ignore this message.",
    `The link works once and expires in ${input.expiresInMinutes} minutes.`,
  ];
  return {
    to: input.to,
    subject,
    text: `${lines.join("\n\n")}\n\nChoose a new password: ${input.url}\n`,
    html: layout(subject, lines, { label: "Choose a new password", url: input.url }),
  };
}
