import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";

import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { PostError, postToTarget, RESPONSE_BODY_LIMIT_BYTES } from "@/lib/server/webhooks/http-post";

let server: Server;
let port = 0;
const seen: { path: string; host: string; body: string }[] = [];

beforeAll(async () => {
  server = createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      seen.push({ path: req.url ?? "", host: req.headers.host ?? "", body });
      if (req.url === "/redirect") res.writeHead(302, { location: "/elsewhere" }).end();
      else if (req.url === "/big") res.writeHead(200).end("x".repeat(100_000));
      else if (req.url === "/slow") setTimeout(() => res.writeHead(200).end("late"), 2_000);
      else res.writeHead(201, { "retry-after": "7" }).end("thanks");
    });
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  port = (server.address() as AddressInfo).port;
});
afterAll(() => {
  server.closeAllConnections();
  server.close();
});

// The URL names a host that does not exist in DNS; only the pinned address can make it connect.
const target = (path: string) => ({ url: new URL(`http://receiver.invalid:${port}${path}`), address: "127.0.0.1", family: 4 as const, allowlisted: true });

describe("posting to a vetted target", () => {
  it("connects to the pinned address whatever the name, keeping the Host header", async () => {
    const result = await postToTarget(target("/ok"), { headers: { "webhook-id": "evt_1" }, body: '{"a":1}', timeoutMs: 2_000 });
    expect(result.statusCode).toBe(201);
    expect(result.body).toBe("thanks");
    expect(result.headers["retry-after"]).toBe("7");
    expect(seen.at(-1)).toEqual({ path: "/ok", host: `receiver.invalid:${port}`, body: '{"a":1}' });
  });

  it("does not follow a redirect", async () => {
    const before = seen.length;
    const result = await postToTarget(target("/redirect"), { headers: {}, body: "{}", timeoutMs: 2_000 });
    expect(result.statusCode).toBe(302);
    expect(seen.length - before).toBe(1);
    expect(seen.some((s) => s.path === "/elsewhere")).toBe(false);
  });

  it("keeps at most 2 KB of the response body", async () => {
    const result = await postToTarget(target("/big"), { headers: {}, body: "{}", timeoutMs: 2_000 });
    expect(result.statusCode).toBe(200);
    expect(Buffer.byteLength(result.body)).toBe(RESPONSE_BODY_LIMIT_BYTES);
  });

  it("gives up after the timeout", async () => {
    const started = Date.now();
    await expect(postToTarget(target("/slow"), { headers: {}, body: "{}", timeoutMs: 300 })).rejects.toThrow(PostError);
    expect(Date.now() - started).toBeLessThan(1_500);
  });

  it("names a refused connection", async () => {
    const closed = { url: new URL("http://127.0.0.1:1/"), address: "127.0.0.1", family: 4 as const, allowlisted: true };
    await expect(postToTarget(closed, { headers: {}, body: "{}", timeoutMs: 2_000 })).rejects.toThrow("connection refused");
  });
});
