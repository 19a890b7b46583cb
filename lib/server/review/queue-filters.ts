import { z } from "zod";

import { reviewStates } from "@/db/schema";
import { DomainError, type FieldError } from "@/lib/server/errors";

/** How the queue can be ordered. Each has its own keyset, so every page costs the same at any depth. */
export const queueSorts = ["utilization", "age", "schedule"] as const;
export type QueueSort = (typeof queueSorts)[number];

export { queueSortLabels } from "@/lib/review-vocabulary";

const id = (prefix: string) => z.string().regex(new RegExp(`^${prefix}_[0-9a-z]{1,40}$`), `must be a ${prefix}_ id`);
const shortText = z.string().min(1).max(120);

/**
 * What narrows the queue. The same object serves the dashboard, the API and bulk dispositions, so
 * the count a bulk action previews is the count of exactly the rows the queue shows.
 */
export const queueFilterSchema = z.object({
  state: z.enum(reviewStates).default("awaiting_review"),
  scheduleId: id("sch").optional(),
  projectId: shortText.optional(),
  category: shortText.optional(),
  governingCheck: shortText.optional(),
  /** Only members whose utilization is above this (1.0 = at the limit). */
  utilizationAbove: z.coerce.number().finite().min(0).max(1_000_000).optional(),
});
export type QueueFilter = z.infer<typeof queueFilterSchema>;

export const queueQuerySchema = queueFilterSchema.extend({
  sort: z.enum(queueSorts).default("utilization"),
});
export type QueueQuery = z.infer<typeof queueQuerySchema>;

/** The query parameters the queue reads (beyond cursor and limit). */
export const queueParameterNames = ["state", "scheduleId", "projectId", "category", "governingCheck", "utilizationAbove", "sort"] as const;

/**
 * Reads the queue's filters from query parameters; an empty parameter means "any". A bad value is
 * a 400 naming the parameter (`/query/<name>`), never a silently widened selection.
 */
export function readQueueQuery(params: URLSearchParams, pointerBase = "/query"): QueueQuery {
  const raw: Record<string, string> = {};
  for (const name of queueParameterNames) {
    const value = params.get(name);
    if (value !== null && value.trim() !== "") raw[name] = value.trim();
  }
  const parsed = queueQuerySchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  const errors: FieldError[] = parsed.error.issues.slice(0, 20).map((issue) => ({ pointer: `${pointerBase}/${issue.path.join("/")}`, message: issue.message }));
  throw new DomainError("bad_request", `Query parameter "${String(parsed.error.issues[0]?.path[0] ?? "?")}" is not valid: ${parsed.error.issues[0]?.message ?? ""}.`, errors);
}

/** The filter as query parameters (defaults left out), for links that keep the selection. */
export function toQueueSearchParams(query: Partial<QueueQuery>): URLSearchParams {
  const params = new URLSearchParams();
  for (const name of queueParameterNames) {
    const value = query[name];
    if (value === undefined || value === null) continue;
    if (name === "state" && value === "awaiting_review") continue;
    if (name === "sort" && value === "utilization") continue;
    params.set(name, String(value));
  }
  return params;
}
