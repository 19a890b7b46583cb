import { decodeCursor, encodeCursor } from "@/lib/server/http/cursor";

/**
 * Page links carry the same opaque keyset cursors as the public API. A cursor that does not decode
 * gives `invalid`, so the page can say so instead of failing or guessing.
 */
export function readPageCursor<T>(text: string | null, isValid: (value: unknown) => value is T): { cursor?: T; invalid: boolean } {
  try {
    return { cursor: decodeCursor(text, isValid), invalid: false };
  } catch {
    return { invalid: true };
  }
}

export { encodeCursor };

export const isScheduleCursor = (v: unknown): v is { createdAt: string; id: string } =>
  typeof v === "object" &&
  v !== null &&
  typeof (v as { createdAt?: unknown }).createdAt === "string" &&
  typeof (v as { id?: unknown }).id === "string" &&
  !Number.isNaN(Date.parse((v as { createdAt: string }).createdAt));

export const isIndexCursor = (v: unknown): v is { after: number } =>
  typeof v === "object" && v !== null && Number.isInteger((v as { after?: unknown }).after) && (v as { after: number }).after >= -1;
