/**
 * CSV records for the server and the upload page alike, both read by papaparse with the same
 * settings and the same record handler, so the two sides agree by construction. Line ends are
 * made uniform first (CRLF and a lone CR become LF, quoted ones too): papaparse takes one line-end
 * style per file, spreadsheets and hand edits mix them. Each record keeps its spreadsheet row
 * (header = 1) and the line it starts on (they differ once a quoted field spans lines).
 *
 * Bounded work: a cell over MAX_CSV_CELL_CHARS, a row count over the caller's limit, a quote that
 * is never closed or text after a closing quote (`"ab"c`) stops the reading with one error.
 */
import Papa from "papaparse";

import type { CsvDelimiter } from "./delimiters";
import type { CsvRowError } from "./row-mapper";

export const UTF8_BOM = "\uFEFF";

/** The longest cell read (the longest text field, notes, takes 2,000). */
export const MAX_CSV_CELL_CHARS = 10_000;

export function stripBom(text: string): string {
  return text.startsWith(UTF8_BOM) ? text.slice(1) : text;
}

export interface CsvRecord {
  fields: string[];
  /** Spreadsheet row: the header is row 1, the first data row row 2. */
  row: number;
  /** 1-based physical line on which the record starts. */
  line: number;
}

export interface CsvRecordLimits {
  /** Rows in all, header and blank rows included. */
  maxRows: number;
  /** Rows with any text, header included. */
  maxFilledRows: number;
}

/** The result of reading: the records were all handed over, or reading stopped at `error`. */
export type CsvReadResult = { ok: true; rowCount: number } | { ok: false; error: CsvRowError };

/** Receives each record in order; returning false stops the reading (the caller has seen enough). */
export type CsvRecordSink = (record: CsvRecord) => boolean | void;

/** Replaces CRLF and lone CR with LF in a stream of chunks; a CR at a chunk's end waits for the next. */
export function createLineEndNormaliser(): { push(chunk: string): string; end(): string } {
  let heldCr = false;
  return {
    push(chunk) {
      let text = heldCr ? `\r${chunk}` : chunk;
      heldCr = text.endsWith("\r");
      if (heldCr) text = text.slice(0, -1);
      return text.replace(/\r\n?/g, "\n");
    },
    end() {
      const rest = heldCr ? "\n" : "";
      heldCr = false;
      return rest;
    },
  };
}

const countLineFeeds = (text: string) => {
  let count = 0;
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) count++;
  return count;
};

const isBlank = (fields: readonly string[]) => fields.every((f) => f.trim() === "");

/**
 * The papaparse settings and record handler both sides use. Records are handed to `sink` one
 * behind, so that the empty record papaparse reports after a final line break can be dropped.
 */
export function createPapaReading(delimiter: CsvDelimiter, limits: CsvRecordLimits, sink: CsvRecordSink) {
  let row = 0;
  let filledRows = 0;
  let line = 1;
  let pending: CsvRecord | null = null;
  let header: string[] = [];
  let result: CsvReadResult | null = null;
  let consumedChars = 0;
  const stop = (error: CsvRowError) => {
    result ??= { ok: false, error };
  };
  const columnName = (index: number) => {
    const text = (header[index] ?? "").trim();
    return text === "" || text.length > 80 ? `column ${index + 1}` : text;
  };
  const hand = (record: CsvRecord) => {
    if (sink(record) === false) result ??= { ok: true, rowCount: record.row };
  };
  const step = (parsed: Papa.ParseStepResult<string[]>, parser: Papa.Parser) => {
    if (result) return parser.abort();
    consumedChars = parsed.meta.cursor;
    row += 1;
    const at = { row, line };
    for (const e of parsed.errors) {
      if (e.code === "InvalidQuotes") stop({ ...at, column: "", code: "invalid_quote", message: 'a quoted field has text after its closing quote (write "" for a quote inside a quoted field)' });
      else if (e.code === "MissingQuotes") stop({ ...at, column: "", code: "unterminated_quote", message: "a quoted field is not closed" });
    }
    const fields = parsed.data;
    const longIndex = fields.findIndex((f) => f.length > MAX_CSV_CELL_CHARS);
    if (longIndex !== -1) stop({ ...at, column: columnName(longIndex), code: "cell_too_long", message: `the cell is ${fields[longIndex]!.length} characters long; at most ${MAX_CSV_CELL_CHARS}` });
    if (row > limits.maxRows) stop({ ...at, column: "", code: "too_many_rows", message: `the file has more than ${limits.maxRows} rows` });
    if (!isBlank(fields) && ++filledRows > limits.maxFilledRows) {
      stop({ ...at, column: "", code: "too_many_rows", message: `the file has more than ${limits.maxFilledRows - 1} member rows` });
    }
    if (result) return parser.abort();
    if (row === 1) header = fields;
    if (pending) hand(pending);
    pending = { fields, row, line };
    line += 1 + fields.reduce((sum, f) => sum + countLineFeeds(f), 0);
  };
  const config = { delimiter, newline: "\n", quoteChar: '"', skipEmptyLines: false, step } satisfies Papa.ParseConfig<string[]>;
  return {
    config,
    /** Call once papaparse has finished: hands over the last record and says how the reading went. */
    finish(): CsvReadResult {
      const last = pending as CsvRecord | null;
      pending = null;
      if (!result && last && !(last.fields.length === 1 && last.fields[0] === "")) hand(last);
      return result ?? { ok: true, rowCount: row };
    },
    /** True once the reading has stopped, on an error or because the sink had enough. */
    stopped: () => result !== null,
    /** Characters papaparse has finished with: the end of the last complete record. */
    consumedChars: () => consumedChars,
    /** Stops the reading because the record after the last one has run past `maxChars`. */
    stopOnLongRow(maxChars: number): void {
      stop({ row: row + 1, line, column: "", code: "row_too_long", message: `the row is longer than ${maxChars} characters` });
    },
  };
}

/** Reads a whole text (the upload page, the CLI and tests, which hold the file already). */
export function readCsvRecords(text: string, delimiter: CsvDelimiter, limits: CsvRecordLimits, sink: CsvRecordSink): CsvReadResult {
  const reading = createPapaReading(delimiter, limits, sink);
  const normaliser = createLineEndNormaliser();
  Papa.parse<string[]>(normaliser.push(stripBom(text)) + normaliser.end(), reading.config);
  return reading.finish();
}
