// Issue 10 / RELIABILITY figure 10: the results CSV neutralises formula text (= + - @, tab, CR)
// in every cell position, for readers that split on comma, semicolon or tab, and for one that
// ignores quotes and quoted line breaks altogether.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";

import type { ResultPageRow } from "@/db/queries/results";
import { resultsToCsv } from "@/lib/server/schedules/represent";

const hostile = [
  "=HYPERLINK(\"http://evil.example\",\"open\")",
  "+SUM(A1:A9)",
  "-2+3",
  "@cmd",
  "\t=1+1",
  "\r=1+1",
  "safe;=cmd|' /C calc'!A0",
  "safe\t@SUM(1)",
  "safe,+1",
  "two\nlines\n=1+1",
  "two\r\n-1",
  "\u202e=evil\u202c",
];

const rows: ResultPageRow[] = hostile.map((text, i) => ({
  memberIndex: i,
  mark: text,
  markKey: text.toLowerCase(),
  category: text,
  status: "fail",
  governingCheck: text,
  utilization: -0.5,
  factorOfSafety: 2,
  governingDeflectionMm: -1.5,
  limitRatio: 360,
  achievedRatio: 720,
  // notes are text too: the same hostile strings go through the last column
  notes: [text],
  allowedDeflectionMm: 25,
  // section and material are text from the schedule too
  section: text,
  material: text,
  quantity: 1,
  spansMm: [6000],
  review: null,
}));

// A plain negative number is a number to every reader, not a formula.
const startsFormula = (cell: string) => /^[=+\-@\t\r]/.test(cell) && !/^-\d+(?:\.\d+)?$/.test(cell);
const csv = resultsToCsv(rows, true);

/** A reader that knows no quoting: every line break ends a row, every delimiter a cell. */
function readNaively(text: string, delimiter: string): string[] {
  return text.split(/\r\n|\n|\r/).flatMap((line) => line.split(delimiter).map((cell) => cell.replace(/^"/, "")));
}

describe("the results CSV against formula injection", () => {
  it.each([",", ";", "\t"])("a reader splitting on %j sees no cell starting a formula", (delimiter) => {
    const parsed = Papa.parse<string[]>(csv, { delimiter, newline: "\r\n" });
    const cells = parsed.data.flat();
    expect(cells.length).toBeGreaterThan(0);
    expect(cells.filter(startsFormula)).toEqual([]);
    expect(readNaively(csv, delimiter).filter(startsFormula)).toEqual([]);
  });

  it("a comma reader gets the text back, only prefixed", () => {
    const [, ...data] = Papa.parse<string[]>(csv.trimEnd(), { delimiter: ",", newline: "\r\n" }).data;
    expect(data[4]?.[0]).toBe("'\t'=1+1");
    expect(data[9]?.[0]).toBe("two\nlines\n'=1+1");
    expect(data[0]?.[0]).toBe("'=HYPERLINK(\"http://evil.example\",\"open\")");
    expect(data[6]?.[0]).toBe("safe;'=cmd|' /C calc'!A0");
    // Numbers stay numbers: a negative utilization is not text to neutralise.
    expect(data[0]?.[4]).toBe("-0.5");
  });
});
