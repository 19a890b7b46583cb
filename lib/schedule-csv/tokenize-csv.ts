/**
 * RFC 4180 tokenizer behind parseScheduleCsv (API uploads and the CLI): quoted fields may hold the delimiter, doubled quotes
 * and newlines, so each record keeps the line it starts on (a record's row number and its line
 * number differ once a quoted field spans lines). A UTF-8 BOM is dropped; CRLF, LF and CR end lines.
 */

export interface CsvRecord {
  fields: string[];
  /** 1-based line on which the record starts. */
  line: number;
}

export type TokenizeResult = { ok: true; records: CsvRecord[] } | { ok: false; line: number; message: string };

export const UTF8_BOM = "\uFEFF";

export function stripBom(text: string): string {
  return text.startsWith(UTF8_BOM) ? text.slice(1) : text;
}

export function tokenizeCsv(input: string, delimiter: string): TokenizeResult {
  const text = stripBom(input);
  const records: CsvRecord[] = [];
  let fields: string[] = [];
  let field = "";
  let line = 1;
  let recordLine = 1;
  let inQuotes = false;
  let quoteLine = 0;
  let fieldStarted = false;
  let i = 0;
  const endRecord = () => {
    fields.push(field);
    records.push({ fields, line: recordLine });
    fields = [];
    field = "";
    fieldStarted = false;
  };
  while (i < text.length) {
    const char = text[i] as string;
    if (inQuotes) {
      if (char === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        inQuotes = false;
        i += 1;
        continue;
      }
      if (char === "\r" || char === "\n") {
        // A quoted newline is data; CRLF counts as one line break.
        field += char === "\r" && text[i + 1] === "\n" ? "\r\n" : char;
        i += char === "\r" && text[i + 1] === "\n" ? 2 : 1;
        line += 1;
        continue;
      }
      field += char;
      i += 1;
      continue;
    }
    if (char === '"' && !fieldStarted) {
      inQuotes = true;
      quoteLine = line;
      fieldStarted = true;
      i += 1;
      continue;
    }
    if (char === delimiter) {
      fields.push(field);
      field = "";
      fieldStarted = false;
      i += 1;
      continue;
    }
    if (char === "\r" || char === "\n") {
      endRecord();
      i += char === "\r" && text[i + 1] === "\n" ? 2 : 1;
      line += 1;
      recordLine = line;
      continue;
    }
    field += char;
    fieldStarted = true;
    i += 1;
  }
  if (inQuotes) return { ok: false, line: quoteLine, message: "a quoted field is not closed" };
  if (field !== "" || fields.length > 0 || fieldStarted) endRecord();
  return { ok: true, records };
}
