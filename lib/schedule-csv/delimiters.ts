/** The field delimiters a schedule CSV may use, and the names forms, query parameters and the CLI give them. */

export const CSV_DELIMITERS = [",", ";", "\t"] as const;
export type CsvDelimiter = (typeof CSV_DELIMITERS)[number];

export type CsvDelimiterName = "comma" | "semicolon" | "tab";

export const CSV_DELIMITER_CHARS: Record<CsvDelimiterName, CsvDelimiter> = { comma: ",", semicolon: ";", tab: "\t" };

export function isCsvDelimiter(text: string): text is CsvDelimiter {
  return (CSV_DELIMITERS as readonly string[]).includes(text);
}

/**
 * A header that was read as one single column but contains another delimiter was most likely
 * split with the wrong one. Returns the first of `candidates` it contains (callers differ in
 * which they name first), or null when the header has several columns or contains none.
 */
export function findDelimiterInSingleColumnHeader(headerFields: readonly string[], candidates: readonly CsvDelimiter[]): CsvDelimiter | null {
  const only = headerFields.length === 1 ? (headerFields[0] ?? "") : "";
  return candidates.find((d) => only.includes(d)) ?? null;
}
