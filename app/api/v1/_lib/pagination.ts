import { getEnv } from "@/lib/env";
import { DomainError } from "@/lib/server/errors";

/**
 * Keyset pagination for list routes: `?limit=` and an opaque `?cursor=` (base64url JSON), and an
 * RFC 8288 `Link: <...>; rel="next"` header while more pages follow. Bad query parameters answer
 * 400 naming the parameter, with errors[] pointing at `/query/<name>`.
 */
export interface PageQuery {
  limit: number;
  cursor: string | null;
}

export function readPageQuery(url: URL, options: { defaultLimit: number; maxLimit: number }): PageQuery {
  const rawLimit = url.searchParams.get("limit");
  let limit = options.defaultLimit;
  if (rawLimit !== null) {
    if (!/^\d{1,6}$/.test(rawLimit) || Number(rawLimit) < 1 || Number(rawLimit) > options.maxLimit) {
      const message = `must be a whole number from 1 to ${options.maxLimit}`;
      throw new DomainError("bad_request", `Query parameter "limit" ${message}.`, [{ pointer: "/query/limit", message }]);
    }
    limit = Number(rawLimit);
  }
  const cursor = url.searchParams.get("cursor");
  if (cursor !== null && (cursor.length === 0 || cursor.length > 512 || !/^[A-Za-z0-9_-]+$/.test(cursor))) throw badCursor();
  return { limit, cursor };
}

function badCursor(): DomainError {
  const message = 'is not a cursor this API issued; use the Link rel="next" address, or start again without it';
  return new DomainError("bad_request", `Query parameter "cursor" ${message}.`, [{ pointer: "/query/cursor", message }]);
}

export function encodeCursor(position: Record<string, string | number>): string {
  return Buffer.from(JSON.stringify(position), "utf8").toString("base64url");
}

/** The position a cursor holds, checked by `read` (which returns null for anything it does not accept). */
export function decodeCursor<T>(cursor: string, read: (value: Record<string, unknown>) => T | null): T {
  let value: unknown;
  try {
    value = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
  } catch {
    throw badCursor();
  }
  const position = typeof value === "object" && value !== null && !Array.isArray(value) ? read(value as Record<string, unknown>) : null;
  if (position === null) throw badCursor();
  return position;
}

/** `Link: <APP_URL/path?...&cursor=...>; rel="next"`, keeping the request's other query parameters. */
export function buildNextLink(requestUrl: URL, nextCursor: string): string {
  const next = new URL(requestUrl.pathname + requestUrl.search, getEnv().APP_URL);
  next.searchParams.set("cursor", nextCursor);
  return `<${next.toString()}>; rel="next"`;
}
