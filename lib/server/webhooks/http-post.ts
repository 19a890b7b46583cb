import { request as httpRequest, type IncomingHttpHeaders, type RequestOptions } from "node:http";
import { request as httpsRequest } from "node:https";
import type { LookupFunction } from "node:net";

import type { VettedTarget } from "./ssrf-guard";

export const RESPONSE_BODY_LIMIT_BYTES = 2_048;

export interface PostResult {
  statusCode: number;
  headers: IncomingHttpHeaders;
  /** The first RESPONSE_BODY_LIMIT_BYTES bytes, as text. */
  body: string;
}

export class PostError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PostError";
  }
}

/**
 * POSTs to a vetted target, connecting to the pinned address whatever DNS says now (the custom
 * lookup), never following redirects (node's client does not), giving up after timeoutMs for the
 * whole exchange. TLS still verifies the certificate against the URL's host name.
 */
export function postToTarget(target: VettedTarget, input: { headers: Record<string, string>; body: string; timeoutMs: number }): Promise<PostResult> {
  const pinned: LookupFunction = (_hostname, options, callback) => {
    if ((options as { all?: boolean }).all) {
      (callback as unknown as (e: null, a: { address: string; family: number }[]) => void)(null, [{ address: target.address, family: target.family }]);
    } else {
      callback(null, target.address, target.family);
    }
  };
  const options: RequestOptions = {
    method: "POST",
    lookup: pinned,
    headers: {
      ...input.headers,
      "content-type": "application/json",
      "content-length": String(Buffer.byteLength(input.body)),
      "user-agent": "Sagline-Webhooks/1",
    },
    agent: false,
  };
  const send = target.url.protocol === "https:" ? httpsRequest : httpRequest;
  return new Promise((resolve, reject) => {
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      fn();
    };
    const req = send(target.url, options, (res) => {
      const chunks: Buffer[] = [];
      let kept = 0;
      res.on("data", (chunk: Buffer) => {
        if (kept < RESPONSE_BODY_LIMIT_BYTES) {
          const part = chunk.subarray(0, RESPONSE_BODY_LIMIT_BYTES - kept);
          chunks.push(part);
          kept += part.length;
        }
        // Only the status matters; a receiver streaming a huge body is cut off.
        if (kept >= RESPONSE_BODY_LIMIT_BYTES) res.destroy();
      });
      const done = () =>
        finish(() => resolve({ statusCode: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks).toString("utf8") }));
      res.on("end", done);
      res.on("close", done);
      res.on("error", done);
    });
    const timer = setTimeout(() => {
      finish(() => reject(new PostError(`no answer within ${input.timeoutMs} ms`)));
      req.destroy();
    }, input.timeoutMs);
    req.on("error", (error) => finish(() => reject(new PostError(describeNetworkError(error)))));
    req.end(input.body);
  });
}

function describeNetworkError(error: Error & { code?: string }): string {
  switch (error.code) {
    case "ECONNREFUSED":
      return "connection refused";
    case "ECONNRESET":
      return "connection reset by the receiver";
    case "EHOSTUNREACH":
    case "ENETUNREACH":
      return "host unreachable";
    default:
      return error.code ? `${error.code}: ${error.message}` : error.message;
  }
}
