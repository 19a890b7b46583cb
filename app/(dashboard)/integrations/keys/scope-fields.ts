import type { ApiKeyScope } from "@/db/schema";

/** One checkbox per scope: the form sends each under its own name (runAction keeps one value per name). */
export function scopeFieldName(scope: ApiKeyScope): string {
  return `scope:${scope}`;
}
