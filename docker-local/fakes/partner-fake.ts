// Local stand-in for a partner's webhook receiver. Verifies every delivery with the independent
// `standardwebhooks` package, records it, and counts each webhook-id as processed once.
//   POST /hooks/:receiver             a webhook delivery
//   PUT  /receivers/:receiver         { secrets?, mode?, retryAfterSeconds?, slowMs? } configure one receiver
//   POST /control                     { mode, receiver? = "demo" } switch a receiver's failure mode
//   GET  /receivers/:receiver         JSON: its deliveries and processed ids; DELETE clears them
//   GET  /                            a page listing what arrived
// Modes: ok (200), 500, 410, 429 (Retry-After), slow (answers after slowMs), redirect (302),
// down (the connection is dropped without an answer). Never started unless fakes are on.
// A processed schedule.completed is followed up as a partner would: each signed download link
// (data.download.csv / .ndjson) is fetched without an API key and the answer recorded in `downloads`.
import { readFileSync } from "node:fs";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { join } from "node:path";

import { Webhook } from "standardwebhooks";

const modes = ["ok", "500", "410", "429", "slow", "redirect", "down"] as const;
type Mode = (typeof modes)[number];

interface Receiver {
  secrets: string[];
  mode: Mode;
  retryAfterSeconds: number;
  slowMs: number;
}

interface Received {
  receiver: string;
  receivedAt: string;
  webhookId: string;
  webhookTimestamp: string;
  webhookSignature: string;
  body: string;
  verified: boolean;
  verifyError: string | null;
  answeredStatus: number | null;
  mode: Mode;
  /** True only on the first verified, acknowledged delivery of this webhook-id. */
  processed: boolean;
  /** The signed download links of a processed schedule.completed, as fetched after acknowledging it. */
  downloads: Download[];
}

interface Download {
  format: string;
  status: number | null;
  contentType: string | null;
  /** Non-empty lines of the body (CSV: header + rows; NDJSON: rows). */
  lines: number;
  firstLine: string;
  error: string | null;
}

const MAX_DOWNLOAD_BYTES = 20 * 1024 * 1024;

/** Fetches one signed link as a partner would: no credentials, bounded in size and time. */
async function fetchDownload(format: string, url: string): Promise<Download> {
  try {
    const response = await fetch(url, { redirect: "manual", signal: AbortSignal.timeout(30_000) });
    const text = await response.text();
    const body = text.length > MAX_DOWNLOAD_BYTES ? text.slice(0, MAX_DOWNLOAD_BYTES) : text;
    const lines = body.split(/\r?\n/).filter((line) => line !== "");
    return { format, status: response.status, contentType: response.headers.get("content-type"), lines: lines.length, firstLine: (lines[0] ?? "").slice(0, 500), error: null };
  } catch (e) {
    return { format, status: null, contentType: null, lines: 0, firstLine: "", error: (e as Error).message };
  }
}

function readDownloadLinks(body: string): [string, string][] {
  try {
    const parsed = JSON.parse(body) as { type?: unknown; data?: { download?: Record<string, unknown> } };
    if (parsed.type !== "schedule.completed") return [];
    const download = parsed.data?.download ?? {};
    return (["csv", "ndjson"] as const).flatMap((format) => (typeof download[format] === "string" ? [[format, download[format] as string] as [string, string]] : []));
  } catch {
    return [];
  }
}

const port = Number(process.env.PARTNER_PORT ?? 3792);
const secretsFile = join(process.env.LOCAL_DIR ?? ".local", "partner-fake", `secrets-${port}.json`);
const receivers = new Map<string, Receiver>();
const received: Received[] = [];
const processedIds = new Map<string, Set<string>>();
const MAX_RECORDS = 5_000;

function getReceiver(name: string): Receiver {
  let receiver = receivers.get(name);
  if (!receiver) {
    receiver = { secrets: [], mode: "ok", retryAfterSeconds: 1, slowMs: 15_000 };
    receivers.set(name, receiver);
  }
  // The seed writes the demo receiver's secret here; read it late so a re-seed is picked up.
  if (receiver.secrets.length === 0) {
    try {
      const fromFile = (JSON.parse(readFileSync(secretsFile, "utf8")) as Record<string, string[]>)[name];
      if (fromFile) receiver.secrets = fromFile;
    } catch {
      // no secrets file: deliveries are recorded as unverified
    }
  }
  return receiver;
}

function readBody(req: IncomingMessage, limit = 5 * 1024 * 1024): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (c: Buffer) => {
      size += c.length;
      if (size > limit) reject(new Error("too large"));
      else chunks.push(c);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

function verify(receiver: Receiver, body: string, headers: Record<string, string>): { verified: boolean; error: string | null } {
  if (receiver.secrets.length === 0) return { verified: false, error: "no secret configured" };
  let lastError = "";
  for (const secret of receiver.secrets) {
    try {
      new Webhook(secret).verify(body, headers);
      return { verified: true, error: null };
    } catch (e) {
      lastError = (e as Error).message;
    }
  }
  return { verified: false, error: lastError };
}

function json(res: ServerResponse, status: number, value: unknown) {
  res.writeHead(status, { "content-type": "application/json" }).end(JSON.stringify(value));
}

async function handleDelivery(name: string, req: IncomingMessage, res: ServerResponse) {
  const receiver = getReceiver(name);
  const body = await readBody(req);
  const header = (h: string) => String(req.headers[h] ?? "");
  const headers = { "webhook-id": header("webhook-id"), "webhook-timestamp": header("webhook-timestamp"), "webhook-signature": header("webhook-signature") };
  const { verified, error } = verify(receiver, body, headers);
  const record: Received = {
    receiver: name,
    receivedAt: new Date().toISOString(),
    webhookId: headers["webhook-id"],
    webhookTimestamp: headers["webhook-timestamp"],
    webhookSignature: headers["webhook-signature"],
    body,
    verified,
    verifyError: error,
    answeredStatus: null,
    mode: receiver.mode,
    processed: false,
    downloads: [],
  };
  received.push(record);
  if (received.length > MAX_RECORDS) received.shift();
  const answer = (status: number, extra: Record<string, string> = {}, text = "") => {
    record.answeredStatus = status;
    res.writeHead(status, { "content-type": "text/plain", ...extra }).end(text);
  };
  switch (receiver.mode) {
    case "down":
      record.answeredStatus = null;
      req.socket.destroy();
      return;
    case "500":
      return answer(500, {}, "receiver failing (fake)");
    case "410":
      return answer(410, {}, "gone (fake)");
    case "429":
      return answer(429, { "retry-after": String(receiver.retryAfterSeconds) }, "slow down (fake)");
    case "redirect":
      return answer(302, { location: `http://127.0.0.1:${port}/hooks/${name}-moved` });
    case "slow":
      await new Promise((r) => setTimeout(r, receiver.slowMs));
      break;
    case "ok":
      break;
  }
  if (!verified) return answer(401, {}, `signature did not verify: ${error}`);
  const seen = processedIds.get(name) ?? new Set<string>();
  processedIds.set(name, seen);
  record.processed = !seen.has(record.webhookId);
  seen.add(record.webhookId);
  answer(200, {}, record.processed ? "processed" : "duplicate, already processed");
  if (record.processed) {
    for (const [format, url] of readDownloadLinks(body)) record.downloads.push(await fetchDownload(format, url));
  }
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

const server = createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://localhost");
  const parts = url.pathname.split("/").filter(Boolean);
  (async () => {
    if (req.method === "POST" && parts[0] === "hooks" && parts[1]) return handleDelivery(parts[1], req, res);
    if (parts[0] === "receivers" && parts[1]) {
      const name = parts[1];
      if (req.method === "PUT") {
        const input = JSON.parse((await readBody(req)) || "{}") as Partial<Receiver>;
        const receiver = getReceiver(name);
        if (input.secrets) receiver.secrets = input.secrets;
        if (input.mode && modes.includes(input.mode)) receiver.mode = input.mode;
        if (typeof input.retryAfterSeconds === "number") receiver.retryAfterSeconds = input.retryAfterSeconds;
        if (typeof input.slowMs === "number") receiver.slowMs = input.slowMs;
        return json(res, 200, { receiver: name, mode: receiver.mode, secrets: receiver.secrets.length });
      }
      if (req.method === "DELETE") {
        for (let i = received.length - 1; i >= 0; i -= 1) if (received[i]!.receiver === name) received.splice(i, 1);
        processedIds.delete(name);
        res.writeHead(204).end();
        return;
      }
      const list = received.filter((r) => r.receiver === name);
      return json(res, 200, { receiver: name, mode: getReceiver(name).mode, deliveries: list, processed: [...(processedIds.get(name) ?? [])] });
    }
    if (req.method === "POST" && url.pathname === "/control") {
      const input = JSON.parse((await readBody(req)) || "{}") as { mode?: Mode; receiver?: string };
      if (!input.mode || !modes.includes(input.mode)) return json(res, 422, { error: `mode must be one of ${modes.join(", ")}` });
      getReceiver(input.receiver ?? "demo").mode = input.mode;
      return json(res, 200, { receiver: input.receiver ?? "demo", mode: input.mode });
    }
    if (req.method === "GET" && url.pathname === "/") {
      const rows = [...received]
        .reverse()
        .slice(0, 200)
        .map(
          (r) =>
            `<tr><td>${escape(r.receivedAt)}</td><td>${escape(r.receiver)}</td><td><code>${escape(r.webhookId)}</code></td><td>${r.verified ? "verified" : `not verified: ${escape(r.verifyError ?? "")}`}</td><td>${r.answeredStatus ?? "dropped"}</td><td>${r.processed ? "processed" : ""}</td><td><code>${escape(r.body.slice(0, 200))}</code></td></tr>`,
        )
        .join("");
      res
        .writeHead(200, { "content-type": "text/html; charset=utf-8" })
        .end(
          `<!doctype html><title>Partner receiver (fake)</title><h1>Partner webhook receiver (local fake, ${received.length} received)</h1><table border="1" cellpadding="4"><tr><th>received</th><th>receiver</th><th>webhook-id</th><th>signature</th><th>answer</th><th></th><th>body</th></tr>${rows}</table>`,
        );
      return;
    }
    json(res, 404, { error: "not found" });
  })().catch((e: Error) => {
    if (!res.headersSent) json(res, 400, { error: e.message });
  });
});
server.listen(port, "127.0.0.1", () => console.log(`[partner-fake] receiving on http://127.0.0.1:${port}/hooks/<receiver>`));
const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
