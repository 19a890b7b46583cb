import type { ResultStatus } from "@/db/queries/schedules";
import { MEMBER_CATEGORIES } from "@/lib/engine/intake";

export const RESULT_STATUSES: readonly ResultStatus[] = ["pass", "fail", "error"];

export interface ResultFilters {
  status?: ResultStatus;
  category?: string;
  /** Query values that are not filters Sagline knows, so the page can say they were not applied. */
  rejected: string[];
}

type Query = { get(name: string): string | null };

/** Reads the results filters from a query string; an unknown value is reported, never guessed. */
export function readResultFilters(query: Query): ResultFilters {
  const rejected: string[] = [];
  const statusText = query.get("status") || null;
  const categoryText = query.get("category") || null;
  const status = statusText && (RESULT_STATUSES as readonly string[]).includes(statusText) ? (statusText as ResultStatus) : undefined;
  if (statusText && !status) rejected.push(`status "${statusText}"`);
  const category = categoryText && (MEMBER_CATEGORIES as readonly string[]).includes(categoryText) ? categoryText : undefined;
  if (categoryText && !category) rejected.push(`category "${categoryText}"`);
  return { status, category, rejected };
}

/** Next.js hands search params as a record; this gives them the URLSearchParams reading shape. */
export function toQuery(params: Record<string, string | string[] | undefined>): Query {
  return { get: (name) => { const v = params[name]; return typeof v === "string" ? v : (v?.[0] ?? null); } };
}
