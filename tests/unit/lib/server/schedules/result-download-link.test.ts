import { createHmac } from "node:crypto";

import { describe, expect, it } from "vitest";

import { DomainError } from "@/lib/server/errors";
import { createResultDownloadLinks, createResultDownloadToken, readResultDownloadToken, RESULT_DOWNLOAD_TTL_SECONDS } from "@/lib/server/schedules/result-download-link";

const secret = "an-invented-test-secret-of-40-characters";
const claims = { organizationId: "org_demoengineering", scheduleId: "sch_lumenbrook1", format: "csv" as const, expiresAt: 1_900_000_000 };
const before = new Date((claims.expiresAt - 60) * 1000);

function codeOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof DomainError) return error.code;
    throw error;
  }
  return "accepted";
}

describe("signed result-download tokens", () => {
  it("read back exactly what was signed, until the expiry", () => {
    const token = createResultDownloadToken(claims, secret);
    expect(readResultDownloadToken(token, secret, before)).toEqual(claims);
    expect(codeOf(() => readResultDownloadToken(token, secret, new Date(claims.expiresAt * 1000)))).toBe("download_link_expired");
  });

  it("are refused when altered, signed with another secret or for another purpose", () => {
    const token = createResultDownloadToken(claims, secret);
    const [payload, signature] = token.split(".") as [string, string];
    const otherFormat = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, "base64url").toString()), f: "ndjson" })).toString("base64url");
    const laterExpiry = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, "base64url").toString()), e: claims.expiresAt + 86_400 })).toString("base64url");
    // Signed with the raw secret rather than the key derived for downloads: another purpose.
    const rawSigned = `${payload}.${createHmac("sha256", secret).update(payload).digest("base64url")}`;
    const flipped = signature.slice(0, -1) + (signature.endsWith("A") ? "B" : "A");
    for (const bad of [`${otherFormat}.${signature}`, `${laterExpiry}.${signature}`, `${payload}.${flipped}`, rawSigned, createResultDownloadToken(claims, `${secret}x`), "", ".", "a.b.c", "x".repeat(10_000), `${payload}.`]) {
      expect(codeOf(() => readResultDownloadToken(bad, secret, before)), bad.slice(0, 40)).toBe("download_link_invalid");
    }
  });

  it("an expired and altered token is refused as altered, not as expired", () => {
    const token = createResultDownloadToken(claims, secret);
    expect(codeOf(() => readResultDownloadToken(token.slice(0, -2), secret, new Date((claims.expiresAt + 10) * 1000)))).toBe("download_link_invalid");
  });

  it("links from an event expire the TTL after the event, one per format", () => {
    const occurredAt = new Date("2026-12-01T10:00:00Z");
    const links = createResultDownloadLinks({ organizationId: claims.organizationId, scheduleId: claims.scheduleId, occurredAt, appUrl: "https://sagline.example", secret });
    expect(links.expiresAt).toBe(new Date(occurredAt.getTime() + RESULT_DOWNLOAD_TTL_SECONDS * 1000).toISOString());
    const token = (url: string) => new URL(url).pathname.replace("/api/v1/result-downloads/", "");
    expect(readResultDownloadToken(token(links.csv), secret, occurredAt).format).toBe("csv");
    expect(readResultDownloadToken(token(links.ndjson), secret, occurredAt).format).toBe("ndjson");
  });
});
