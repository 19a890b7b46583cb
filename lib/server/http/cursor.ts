import { DomainError } from "@/lib/server/errors";

/** Opaque keyset cursors: base64url JSON. A cursor that does not decode is a 400 naming it. */
export function encodeCursor(value: unknown): string {
  return Buffer.from(JSON.stringify(value)).toString("base64url");
}

/** Longest cursor text read; ours are well under it. */
const MAX_CURSOR_CHARS = 512;

// A cursor is only a position: every part is checked to the shape this API writes, so a crafted
// one is a 400 here rather than an error from PostgreSQL (bad timestamp, number out of range).
const ISO_TIMESTAMP = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(?:\.\d{1,6})?Z$/;
export const isCursorTimestamp = (v: unknown): v is string => typeof v === "string" && ISO_TIMESTAMP.test(v) && !Number.isNaN(Date.parse(v));
export const isCursorId = (prefix: string, v: unknown): v is string => typeof v === "string" && v.length <= 64 && v.startsWith(`${prefix}_`) && /^[a-z]+_[0-9a-z]+$/.test(v);
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** The schedule list's position: the last schedule of the previous page. */
export const isScheduleCursor = (v: unknown): v is { createdAt: string; id: string } => isRecord(v) && isCursorTimestamp(v.createdAt) && isCursorId("sch", v.id);

/** A results page's position: the last member index shown (-1 before the first). */
export const isIndexCursor = (v: unknown): v is { after: number } => isRecord(v) && Number.isSafeInteger(v.after) && (v.after as number) >= -1 && (v.after as number) < 2 ** 31;

export function decodeCursor<T>(text: string | null, isValid: (value: unknown) => value is T): T | undefined {
  if (text === null || text === "") return undefined;
  try {
    if (text.length > MAX_CURSOR_CHARS) throw new RangeError("cursor too long");
    const value: unknown = JSON.parse(Buffer.from(text, "base64url").toString("utf8"));
    if (isValid(value)) return value;
  } catch {
    // fall through to the refusal below
  }
  throw new DomainError("bad_request", "The cursor is not one this API issued.", [{ pointer: "/query/cursor", message: "use the cursor from a Link header or links.next" }]);
}

export function readLimit(text: string | null, max = 1000, fallback = 100): number {
  if (text === null) return fallback;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1 || n > max) {
    throw new DomainError("bad_request", `limit must be a whole number from 1 to ${max}.`, [{ pointer: "/query/limit", message: `1 to ${max}` }]);
  }
  return n;
}

/** RFC 8288 Link header for the next page. */
export function nextLink(url: URL, cursor: string | null): Record<string, string> {
  if (!cursor) return {};
  const next = new URL(url);
  next.searchParams.set("cursor", cursor);
  return { link: `<${next.pathname}${next.search}>; rel="next"` };
}
