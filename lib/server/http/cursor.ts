import { DomainError } from "@/lib/server/errors";

/** Opaque keyset cursors: base64url JSON. A cursor that does not decode is a 400 naming it. */
export function encodeCursor(value: unknown): string {
  return Buffer.from(JSON.stringify(value)).toString("base64url");
}

export function decodeCursor<T>(text: string | null, isValid: (value: unknown) => value is T): T | undefined {
  if (text === null || text === "") return undefined;
  try {
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
