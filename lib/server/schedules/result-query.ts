import { RESULT_SORTS, type ResultPosition, type ResultQueryFilters, type ResultSort } from "@/db/queries/results";
import type { ResultStatus } from "@/db/queries/schedules";
import { MEMBER_CATEGORIES } from "@/lib/engine/intake";
import { DomainError } from "@/lib/server/errors";
import { encodeCursor } from "@/lib/server/http/cursor";

export const RESULT_STATUSES: readonly ResultStatus[] = ["pass", "fail", "error"];
/** Marks are at most 64 characters (lib/engine/intake/read-member.ts); a longer prefix matches nothing. */
export const MAX_MARK_PREFIX_CHARS = 64;
const MAX_CURSOR_CHARS = 512;
const MAX_PAGE = 10_000_000;
const MAX_UTILIZATION_FILTER = 1e9;

export interface ResultQuery {
  sort: ResultSort;
  filters: ResultQueryFilters;
  position?: ResultPosition;
  /** A page to jump to (1-based), when asked for instead of a cursor. */
  page?: number;
}

/** A query parameter Sagline did not accept: its name (as a JSON pointer) and why. */
export interface ResultQueryProblem {
  pointer: string;
  message: string;
}

type Query = { get(name: string): string | null };

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const isMemberIndex = (v: unknown): v is number => Number.isSafeInteger(v) && (v as number) >= -1 && (v as number) < 2 ** 31;
// A NUL or a lone surrogate cannot reach PostgreSQL as text: refuse it here rather than fail there.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const isStorableText = (v: string) => !v.includes("\u0000") && !LONE_SURROGATE.test(v);

/** Encodes a position as the opaque cursor the pages and the API hand out. */
export function encodeResultCursor(position: ResultPosition): string {
  // Schedule order keeps the cursor shape earlier releases issued ({after}), so their links still work.
  if (position.sort === "schedule" && !position.back) return encodeCursor({ after: position.index, p: position.page });
  return encodeCursor({ s: position.sort, k: position.key, i: position.index, b: position.back ? 1 : 0, p: position.page });
}

/** The position a cursor holds, checked to the exact shape encodeResultCursor writes; null for anything else. */
export function decodeResultCursor(text: string): ResultPosition | null {
  if (text.length > MAX_CURSOR_CHARS || !/^[A-Za-z0-9_-]+$/.test(text)) return null;
  let value: unknown;
  try {
    value = JSON.parse(Buffer.from(text, "base64url").toString("utf8"));
  } catch {
    return null;
  }
  if (!isRecord(value)) return null;
  const page = value.p === undefined ? 2 : value.p;
  if (!Number.isSafeInteger(page) || (page as number) < 1 || (page as number) > MAX_PAGE) return null;
  if ("after" in value) {
    if (Object.keys(value).some((k) => k !== "after" && k !== "p") || !isMemberIndex(value.after)) return null;
    return { sort: "schedule", key: value.after, index: value.after, back: false, page: page as number };
  }
  if (Object.keys(value).some((k) => !["s", "k", "i", "b", "p"].includes(k))) return null;
  const sort = value.s;
  if (typeof sort !== "string" || !(RESULT_SORTS as readonly string[]).includes(sort) || !isMemberIndex(value.i) || (value.b !== 0 && value.b !== 1)) return null;
  const key = value.k;
  const keyValid =
    sort === "schedule"
      ? key === value.i
      : sort === "utilization"
        ? key === null || (typeof key === "number" && Number.isFinite(key) && Math.abs(key) <= MAX_UTILIZATION_FILTER)
        : sort === "mark"
          ? typeof key === "string" && key.length <= 4 * MAX_MARK_PREFIX_CHARS && isStorableText(key)
          : typeof key === "string" && (MEMBER_CATEGORIES as readonly string[]).includes(key);
  if (!keyValid) return null;
  return { sort: sort as ResultSort, key: key as number | string | null, index: value.i as number, back: value.b === 1, page: page as number };
}

/**
 * Reads a results query (sort, filters, cursor or page) from query parameters. Every value that is
 * not one Sagline knows is reported as a problem, never guessed; the caller decides whether that is
 * a 400 (API) or a notice (dashboard).
 */
export function readResultQuery(query: Query): { query: ResultQuery; problems: ResultQueryProblem[] } {
  const problems: ResultQueryProblem[] = [];
  const text = (name: string) => {
    const value = query.get(name);
    return value === null || value === "" ? null : value;
  };
  const filters: ResultQueryFilters = {};

  const sortText = text("sort");
  let sort: ResultSort = "schedule";
  if (sortText !== null) {
    if ((RESULT_SORTS as readonly string[]).includes(sortText)) sort = sortText as ResultSort;
    else problems.push({ pointer: "/query/sort", message: `must be one of ${RESULT_SORTS.join(", ")}` });
  }
  const status = text("status");
  if (status !== null) {
    if ((RESULT_STATUSES as readonly string[]).includes(status)) filters.status = status as ResultStatus;
    else problems.push({ pointer: "/query/status", message: "must be pass, fail or error" });
  }
  const category = text("category");
  if (category !== null) {
    if ((MEMBER_CATEGORIES as readonly string[]).includes(category)) filters.category = category;
    else problems.push({ pointer: "/query/category", message: `must be one of ${MEMBER_CATEGORIES.join(", ")}` });
  }
  const review = text("review");
  if (review !== null) {
    if (review === "awaiting") filters.awaitingReview = true;
    else problems.push({ pointer: "/query/review", message: 'must be "awaiting"' });
  }
  const above = text("utilizationAbove");
  if (above !== null) {
    const n = Number(above);
    if (above.length <= 24 && /^-?\d+(\.\d+)?$/.test(above) && Number.isFinite(n) && Math.abs(n) <= MAX_UTILIZATION_FILTER) filters.utilizationAbove = n;
    else problems.push({ pointer: "/query/utilizationAbove", message: "must be a decimal number such as 0.9" });
  }
  const mark = query.get("mark");
  if (mark !== null && mark.trim() !== "") {
    const prefix = mark.trim();
    if (prefix.length <= MAX_MARK_PREFIX_CHARS && isStorableText(prefix)) filters.markPrefix = prefix;
    else problems.push({ pointer: "/query/mark", message: `must be a mark prefix of at most ${MAX_MARK_PREFIX_CHARS} characters` });
  }

  const result: ResultQuery = { sort, filters };
  const cursor = text("cursor");
  if (cursor !== null) {
    const position = decodeResultCursor(cursor);
    if (!position) problems.push({ pointer: "/query/cursor", message: "is not a cursor Sagline issued; use links.next or start again without it" });
    else if (position.sort !== sort) problems.push({ pointer: "/query/cursor", message: `belongs to the ${position.sort} ordering, not ${sort}` });
    else result.position = position;
  }
  const pageText = text("page");
  if (pageText !== null) {
    if (/^\d{1,8}$/.test(pageText) && Number(pageText) >= 1 && Number(pageText) <= MAX_PAGE) result.page = Number(pageText);
    else problems.push({ pointer: "/query/page", message: "must be a whole number from 1" });
  }
  return { query: result, problems };
}

/** The same, for the public API: any problem is a 400 naming every parameter refused. */
export function readResultQueryOrThrow(query: Query): ResultQuery {
  const { query: result, problems } = readResultQuery(query);
  if (problems.length > 0) {
    throw new DomainError("bad_request", `Query parameter${problems.length > 1 ? "s" : ""} not accepted: ${problems.map((p) => `${p.pointer.slice("/query/".length)} ${p.message}`).join("; ")}.`, problems);
  }
  return result;
}

/** The query parameters of a results query (without cursor or page), for links that keep them. */
export function toResultSearchParams(query: Pick<ResultQuery, "sort" | "filters">): Record<string, string> {
  const f = query.filters;
  const params: Record<string, string> = {};
  if (query.sort !== "schedule") params.sort = query.sort;
  if (f.status) params.status = f.status;
  if (f.category) params.category = f.category;
  if (f.awaitingReview) params.review = "awaiting";
  if (f.utilizationAbove !== undefined) params.utilizationAbove = String(f.utilizationAbove);
  if (f.markPrefix) params.mark = f.markPrefix;
  return params;
}

/** True when any filter narrows the results. */
export function hasResultFilters(filters: ResultQueryFilters): boolean {
  return filters.status !== undefined || filters.category !== undefined || filters.awaitingReview === true || filters.utilizationAbove !== undefined || filters.markPrefix !== undefined;
}
