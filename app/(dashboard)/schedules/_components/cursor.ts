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

export { isIndexCursor, isScheduleCursor } from "@/lib/server/http/cursor";
