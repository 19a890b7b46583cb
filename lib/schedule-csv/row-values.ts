/** Cell readers: strict numbers (a decimal comma is an error, not a guess), yes/no, lists. */

const NUMBER_PATTERN = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

export type CellResult<T> = { ok: true; value: T } | { ok: false; code: string; message: string };

export function parseCellNumber(text: string): CellResult<number> {
  const trimmed = text.trim();
  if (NUMBER_PATTERN.test(trimmed)) {
    const value = Number(trimmed);
    if (Number.isFinite(value)) return { ok: true, value };
    return { ok: false, code: "invalid_number", message: `"${trimmed}" is too large` };
  }
  if (/^[+-]?\d+,\d+$/.test(trimmed)) {
    return { ok: false, code: "invalid_number", message: `"${trimmed}" uses a decimal comma; write ${trimmed.replace(",", ".")}` };
  }
  return { ok: false, code: "invalid_number", message: `"${trimmed}" is not a number` };
}

const TRUE_WORDS = new Set(["yes", "y", "true", "1"]);
const FALSE_WORDS = new Set(["no", "n", "false", "0"]);

export function parseCellBoolean(text: string): CellResult<boolean> {
  const word = text.trim().toLowerCase();
  if (TRUE_WORDS.has(word)) return { ok: true, value: true };
  if (FALSE_WORDS.has(word)) return { ok: true, value: false };
  return { ok: false, code: "invalid_value", message: `"${text.trim()}" is not yes or no` };
}

/** Splits a list cell on `|`, `;` or whitespace (a `;` list needs quotes in a `;`-delimited file). */
export function splitCellList(text: string): string[] {
  return text
    .split(/[|;\s]+/)
    .map((item) => item.trim())
    .filter((item) => item !== "");
}
