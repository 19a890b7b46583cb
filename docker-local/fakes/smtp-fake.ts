// Local stand-in for a hosted SMTP service: accepts every message on loopback, keeps it in a
// JSON file under .local, and lists captured mail at http://127.0.0.1:$MAIL_UI_PORT/
// (JSON at /api/messages; DELETE clears). Never started unless fakes are on.
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import { join } from "node:path";

import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

interface CapturedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

const smtpPort = Number(process.env.SMTP_PORT ?? 2590);
const uiPort = Number(process.env.MAIL_UI_PORT ?? 3791);
const dir = process.env.MAIL_DIR ?? ".local/mail";
mkdirSync(dir, { recursive: true });
const file = join(dir, `messages-${smtpPort}.json`);

let messages: CapturedMail[] = [];
try {
  messages = JSON.parse(readFileSync(file, "utf8")) as CapturedMail[];
} catch {
  messages = [];
}
const save = () => writeFileSync(file, JSON.stringify(messages));

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  size: 5 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        messages.push({
          id: (messages.at(-1)?.id ?? 0) + 1,
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
        });
        save();
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});
smtp.listen(smtpPort, "127.0.0.1");

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://localhost");
  if (url.pathname === "/api/messages" && req.method === "DELETE") {
    messages = [];
    save();
    res.writeHead(204).end();
  } else if (url.pathname === "/api/messages") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? messages.filter((m) => m.to.some((t) => t.toLowerCase() === to)) : messages;
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list));
  } else if (url.pathname === "/") {
    const rows = [...messages]
      .reverse()
      .map((m) => `<li><b>${escape(m.subject)}</b> to ${escape(m.to.join(", "))} at ${m.receivedAt}<pre>${escape(m.text)}</pre></li>`)
      .join("");
    res
      .writeHead(200, { "content-type": "text/html; charset=utf-8" })
      .end(`<!doctype html><title>Captured mail</title><h1>Captured mail (local fake, ${messages.length})</h1><ul>${rows}</ul>`);
  } else {
    res.writeHead(404).end();
  }
}).listen(uiPort, "127.0.0.1");

console.log(`[smtp-fake] SMTP on 127.0.0.1:${smtpPort}, mail list on http://127.0.0.1:${uiPort}/`);
const stop = () => smtp.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
