import { readFileSync } from "node:fs";

import Papa from "papaparse";
import { describe, expect, it } from "vitest";

import { createCsvRowMapper, parseScheduleCsv, type PublicMember } from "@/lib/schedule-csv";

const exampleCsv = readFileSync(new URL("../../../../examples/lumenbrook-depot-hall-b-joists.csv", import.meta.url), "utf8");

/** What the upload page does in the browser: papaparse row by row, the header once, then mapRow per record. */
function mapWithPapaparse(text: string, delimiter: string): PublicMember[] {
  const rows: string[][] = [];
  Papa.parse<string[]>(text, { delimiter, skipEmptyLines: "greedy", step: (result) => void rows.push(result.data) });
  const [header, ...records] = rows;
  const created = createCsvRowMapper(header ?? []);
  if (!created.ok) throw new Error(JSON.stringify(created.errors));
  return records.map((fields, index) => {
    const mapped = created.mapper.mapRow(fields, { row: index + 2 });
    if (!mapped.ok || !mapped.member) throw new Error(JSON.stringify(mapped));
    return mapped.member;
  });
}

describe("the row mapper fed by papaparse (an independent CSV reader)", () => {
  it("gives the same members as parseScheduleCsv, BOM included", () => {
    const ours = parseScheduleCsv(`\uFEFF${exampleCsv}`, { name: "x", profile: { preset: "en1995-timber-floor" } });
    if (!ours.ok) throw new Error(JSON.stringify(ours.errors));
    expect(mapWithPapaparse(`\uFEFF${exampleCsv}`, ",")).toEqual(ours.doc.members);
  });

  it("agrees on quoted newlines in a semicolon file", () => {
    const text = 'mark;category;quantity;material;section;b [mm];h [mm];span_1 [m];supports;live_uniform [kN/m];notes\r\nB1;floor_beam;1;steel-s355;rectangle;100;200;3;pinned roller;1;"a;b\r\nc ""d"""\r\n';
    const ours = parseScheduleCsv(text, { delimiter: ";", name: "x", profile: { preset: "ibc-2021-floor" } });
    if (!ours.ok) throw new Error(JSON.stringify(ours.errors));
    // Line ends are made uniform before reading (a quoted CRLF is kept as LF), as on the upload page.
    const theirs = mapWithPapaparse(text.replace(/\r\n?/g, "\n"), ";");
    expect(theirs).toEqual(ours.doc.members);
    expect(theirs[0]?.notes).toBe('a;b\nc "d"');
  });
});
