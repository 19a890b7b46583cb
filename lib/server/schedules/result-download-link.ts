import { createHmac, timingSafeEqual } from "node:crypto";

import { DomainError } from "@/lib/server/errors";

/**
 * Signed result-download links: a token that names the organization, the schedule, the format
 * and the expiry, HMAC-SHA256-signed with a key derived for this one purpose, so it opens exactly
 * one download and nothing else (it is no API key and no session). Tokens are stateless: rotating
 * NEXTAUTH_SECRET invalidates every link.
 */
export const RESULT_DOWNLOAD_FORMATS = ["csv", "ndjson"] as const;
export type ResultDownloadFormat = (typeof RESULT_DOWNLOAD_FORMATS)[number];

/** How long a link works after the event that carries it: longer than the whole retry schedule (about 11 h). */
export const RESULT_DOWNLOAD_TTL_SECONDS = 7 * 24 * 3600;

const PURPOSE = "sagline.result-download.v1";
// A token is a few hundred characters; anything longer is refused before it is decoded.
const MAX_TOKEN_LENGTH = 600;
const ID_PATTERN = /^[a-z]{2,10}_[0-9A-Za-z_-]{1,80}$/;

export interface ResultDownloadClaims {
  organizationId: string;
  scheduleId: string;
  format: ResultDownloadFormat;
  /** Unix seconds. */
  expiresAt: number;
}

function deriveKey(secret: string): Buffer {
  return createHmac("sha256", secret).update(PURPOSE).digest();
}

function sign(payload: string, secret: string): string {
  return createHmac("sha256", deriveKey(secret)).update(payload).digest("base64url");
}

export function createResultDownloadToken(claims: ResultDownloadClaims, secret: string): string {
  const payload = Buffer.from(JSON.stringify({ p: PURPOSE, o: claims.organizationId, s: claims.scheduleId, f: claims.format, e: claims.expiresAt })).toString("base64url");
  return `${payload}.${sign(payload, secret)}`;
}

const refused = () => new DomainError("download_link_invalid", "This download link is not valid: it was altered, or it is not a Sagline result-download link.");

/**
 * The claims of a token this server signed, or a DomainError: download_link_invalid (403) for a
 * malformed, altered or foreign token, download_link_expired (410) once it is past its expiry.
 * The signature is checked before anything in the payload is trusted.
 */
export function readResultDownloadToken(token: string, secret: string, now: Date): ResultDownloadClaims {
  if (token.length > MAX_TOKEN_LENGTH) throw refused();
  const dot = token.indexOf(".");
  if (dot <= 0 || dot !== token.lastIndexOf(".")) throw refused();
  const payload = token.slice(0, dot);
  const given = Buffer.from(token.slice(dot + 1), "base64url");
  const expected = Buffer.from(sign(payload, secret), "base64url");
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) throw refused();
  let claims: { p?: unknown; o?: unknown; s?: unknown; f?: unknown; e?: unknown };
  try {
    claims = JSON.parse(Buffer.from(payload, "base64url").toString("utf8")) as typeof claims;
  } catch {
    throw refused();
  }
  const { p, o, s, f, e } = claims ?? {};
  if (p !== PURPOSE || typeof o !== "string" || !ID_PATTERN.test(o) || typeof s !== "string" || !ID_PATTERN.test(s)) throw refused();
  if (typeof f !== "string" || !(RESULT_DOWNLOAD_FORMATS as readonly string[]).includes(f) || typeof e !== "number" || !Number.isSafeInteger(e)) throw refused();
  if (now.getTime() >= e * 1000) throw new DomainError("download_link_expired", `This download link expired at ${new Date(e * 1000).toISOString()}. Read the results with an API key, or resend the webhook for a fresh link.`);
  return { organizationId: o, scheduleId: s, format: f as ResultDownloadFormat, expiresAt: e };
}

/** The download addresses a schedule.completed event carries, valid until occurredAt + the TTL. */
export function createResultDownloadLinks(input: { organizationId: string; scheduleId: string; occurredAt: Date; appUrl: string; secret: string }) {
  const expiresAt = Math.floor(input.occurredAt.getTime() / 1000) + RESULT_DOWNLOAD_TTL_SECONDS;
  const url = (format: ResultDownloadFormat) =>
    new URL(`/api/v1/result-downloads/${createResultDownloadToken({ organizationId: input.organizationId, scheduleId: input.scheduleId, format, expiresAt }, input.secret)}`, input.appUrl).toString();
  return { csv: url("csv"), ndjson: url("ndjson"), expiresAt: new Date(expiresAt * 1000).toISOString() };
}
