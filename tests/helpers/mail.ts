import { MAIL_UI_URL } from "./app";

export interface CapturedMail {
  id: number;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

/** Waits for the SMTP fake to hold a message to this address matching the subject. */
export async function waitForMail(to: string, subjectIncludes: string, timeoutMs = 10_000): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const response = await fetch(new URL(`api/messages?to=${encodeURIComponent(to)}`, MAIL_UI_URL));
    const list = (await response.json()) as CapturedMail[];
    const match = list.filter((m) => m.subject.includes(subjectIncludes)).at(-1);
    if (match) return match;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${to} about "${subjectIncludes}"`);
}

export function extractLink(mail: CapturedMail, pathPrefix: string): string {
  const match = mail.text.match(new RegExp(`https?://\\S+${pathPrefix}[A-Za-z0-9_-]+`));
  if (!match) throw new Error(`no ${pathPrefix} link in mail`);
  return match[0];
}
