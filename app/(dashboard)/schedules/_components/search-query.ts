type Query = { get(name: string): string | null };

/** Next.js hands search params as a record; this gives them the URLSearchParams reading shape. */
export function toQuery(params: Record<string, string | string[] | undefined>): Query {
  return { get: (name) => { const v = params[name]; return typeof v === "string" ? v : (v?.[0] ?? null); } };
}
