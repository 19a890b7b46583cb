import { describe, expect, it } from "vitest";

import { MAX_CSV_CELL_CHARS, readCsvRecords, type CsvRecord, type CsvRecordLimits } from "@/lib/schedule-csv/read-csv-records";
import type { CsvDelimiter } from "@/lib/schedule-csv";

const roomy: CsvRecordLimits = { maxRows: 1000, maxFilledRows: 1000 };

function read(text: string, delimiter: CsvDelimiter = ",", limits = roomy) {
  const records: CsvRecord[] = [];
  const result = readCsvRecords(text, delimiter, limits, (r) => void records.push(r));
  return { result, records: records.map(({ fields, line }) => ({ fields, line })) };
}

describe("readCsvRecords (papaparse, RFC 4180)", () => {
  it("drops a UTF-8 BOM and splits CRLF, LF and lone CR lines alike", () => {
    for (const end of ["\r\n", "\n", "\r"]) {
      expect(read(`\uFEFFa,b${end}1,2${end}`).records).toEqual([{ fields: ["a", "b"], line: 1 }, { fields: ["1", "2"], line: 2 }]);
    }
  });

  it("keeps delimiters, doubled quotes and newlines inside quotes, and counts lines", () => {
    expect(read('a,b\n"x, y","say ""hi"""\n"two\r\nlines",z\nlast,1').records).toEqual([
      { fields: ["a", "b"], line: 1 },
      { fields: ["x, y", 'say "hi"'], line: 2 },
      { fields: ["two\nlines", "z"], line: 3 },
      { fields: ["last", "1"], line: 5 },
    ]);
  });

  it("splits on the given delimiter only", () => {
    expect(read("a;b,c\n", ";").records).toEqual([{ fields: ["a", "b,c"], line: 1 }]);
    expect(read("a\tb\n", "\t").records).toEqual([{ fields: ["a", "b"], line: 1 }]);
  });

  it("keeps empty trailing fields and blank rows, but not the empty record after the final line break", () => {
    expect(read("a,,\n\nb,c,d\n").records).toEqual([{ fields: ["a", "", ""], line: 1 }, { fields: [""], line: 2 }, { fields: ["b", "c", "d"], line: 3 }]);
  });

  it("reports an unclosed quote with the row and line it opened on", () => {
    expect(read('a\n"open,\nmore').result).toEqual({ ok: false, error: { row: 2, line: 2, column: "", code: "unterminated_quote", message: "a quoted field is not closed" } });
  });

  it('refuses text after a closing quote ("ab"c)', () => {
    expect(read('a,b\n"ab"c,d\n').result).toMatchObject({ ok: false, error: { row: 2, line: 2, code: "invalid_quote" } });
  });

  it("stops at a cell over the cap, naming its column", () => {
    expect(read(`mark,notes\nA,${"n".repeat(MAX_CSV_CELL_CHARS + 1)}\n`).result).toMatchObject({ ok: false, error: { row: 2, column: "notes", code: "cell_too_long" } });
  });

  it("stops as soon as a row limit is passed", () => {
    const filled = read("h\n1\n2\n3\n4\n", ",", { maxRows: 100, maxFilledRows: 3 });
    expect(filled.result).toMatchObject({ ok: false, error: { row: 4, code: "too_many_rows" } });
    const blank = read("h\n\n\n\n\n\n", ",", { maxRows: 3, maxFilledRows: 100 });
    expect(blank.result).toMatchObject({ ok: false, error: { row: 4, code: "too_many_rows" } });
  });
});
