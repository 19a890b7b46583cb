// The upload page's in-browser CSV work (pure functions, no server needed): rows and lines as
// the server counts them, column mapping, every row checked, and a rewritten CSV the server
// reads to the same members and the same errors.
import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import {
  IGNORE,
  buildMappedHeader,
  describeHeaders,
  parseCsvText,
  relineErrors,
  suggestDelimiter,
  validateSchedule,
  writeMappedCsv,
  type MappingChoices,
} from "@/app/(dashboard)/schedules/new/_components/csv-model";
import { parseScheduleCsv } from "@/lib/schedule-csv";

const fixture = (name: string) => readFileSync(`tests/fixtures/schedules-ui/${name}`, "utf8");

function parseOk(text: string, delimiter: "comma" | "semicolon" | "tab" = "comma") {
  const parsed = parseCsvText(text, delimiter);
  if (!parsed.ok) throw new Error(`did not parse: ${JSON.stringify(parsed.errors)}`);
  return parsed;
}

// The fixture's own headers: Member, Span and Comment are not Sagline's names.
const fixtureChoices: MappingChoices = { targets: { 0: "mark", 7: "span_1", 10: IGNORE }, units: { 7: "m" }, system: "SI" };

describe("splitting the file", () => {
  it("numbers rows and the lines they start on, across quoted line breaks, CRLF, BOM and blank rows", () => {
    const parsed = parseOk('\uFEFFa,b\r\n1,"x\r\ny"\r\n\r\n3,4\n5,6\r\n');
    expect(parsed.header).toEqual({ fields: ["a", "b"], row: 1, line: 1 });
    expect(parsed.records).toEqual([
      // Line ends inside quotes become LF too (one line each way).
      { fields: ["1", "x\ny"], row: 2, line: 2 },
      { fields: [""], row: 3, line: 4 },
      { fields: ["3", "4"], row: 4, line: 5 },
      { fields: ["5", "6"], row: 5, line: 6 },
    ]);
  });

  it("reports an unclosed quote with its row", () => {
    const parsed = parseCsvText('a,b\n1,"open\n', "comma");
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.errors[0]).toMatchObject({ row: 2, line: 2, code: "unterminated_quote" });
  });

  it("suggests the delimiter the first line uses most, without choosing it", () => {
    expect(suggestDelimiter(fixture("two-beams-semicolon.csv"))).toBe("semicolon");
    expect(suggestDelimiter("a\tb\tc\n")).toBe("tab");
    expect(suggestDelimiter("mark\n")).toBeNull();
  });
});

describe("mapping the columns", () => {
  const headers = describeHeaders(parseOk(fixture("two-beams-semicolon.csv"), "semicolon").header.fields);

  it("recognises Sagline's own headers and leaves the others to the person", () => {
    expect(headers.filter((h) => h.knownName === null).map((h) => h.original)).toEqual(["Member", "Span", "Comment"]);
    expect(headers.find((h) => h.original === "b [mm]")).toMatchObject({ knownName: "b", headerUnit: "mm" });
  });

  it("names every column still to be chosen", () => {
    const mapped = buildMappedHeader(headers, { targets: {}, units: {}, system: "SI" });
    expect(mapped.problems.map((p) => [p.column, p.code])).toEqual([
      ["Member", "unmapped_column"],
      ["Span", "unmapped_column"],
      ["Comment", "unmapped_column"],
    ]);
  });

  it("writes name [unit] for mapped columns and drops ignored ones", () => {
    const mapped = buildMappedHeader(headers, fixtureChoices);
    expect(mapped.problems).toEqual([]);
    expect(mapped.header).toEqual(["mark", "category", "quantity", "material", "section", "b [mm]", "h [mm]", "span_1 [m]", "supports", "live_uniform [kN/m]"]);
    expect(mapped.originOf["span_1 [m]"]).toBe("Span");
  });

  it("asks for a unit when neither the header, the column nor a unit system gives one", () => {
    const mapped = buildMappedHeader(headers, { ...fixtureChoices, units: {}, system: null });
    expect(mapped.problems).toEqual([expect.objectContaining({ column: "Span", code: "missing_unit" })]);
  });
});

describe("checking every row", () => {
  const options = { system: "SI" as const, presetId: "ibc-2021-floor", name: "Two beams", reference: "" };

  it("says which delimiter to choose when the header did not split", () => {
    const parsed = parseOk(fixture("two-beams-semicolon.csv"), "comma");
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), { targets: {}, units: {}, system: "SI" });
    const result = validateSchedule({ parsed, mapped, ...options });
    expect(result).toEqual({ ok: false, errors: [expect.objectContaining({ row: 1, code: "wrong_delimiter", message: expect.stringContaining("semicolon") })] });
  });

  it("passes the good fixture with its two members", () => {
    const parsed = parseOk(fixture("two-beams-semicolon.csv"), "semicolon");
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), fixtureChoices);
    expect(validateSchedule({ parsed, mapped, ...options })).toEqual({ ok: true, memberCount: 2 });
  });

  it("lists every error of the broken fixture by row, line and column, as the server would", () => {
    const parsed = parseOk(fixture("two-beams-broken.csv"), "semicolon");
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), fixtureChoices);
    const result = validateSchedule({ parsed, mapped, ...options });
    expect(result.ok).toBe(false);
    const browser = result.ok ? [] : result.errors.map((e) => [e.row, e.line, e.column, e.code]);
    expect(browser).toEqual([
      [3, 4, "quantity", "invalid_number"],
      [3, 4, "span_1 [m]", "invalid_number"],
    ]);
    const server = parseScheduleCsv(writeMappedCsv(parsed, mapped, "semicolon"), { delimiter: ";", name: "x", profile: { preset: "ibc-2021-floor" }, units: { system: "SI" } });
    // The sent file lacks the ignored column and its quoted line break; lines are mapped back by row.
    expect(server.ok ? [] : relineErrors(server.errors, parsed).map((e) => [e.row, e.line, e.column, e.code])).toEqual(browser);
  });

  it("counts fields on the file as written, so an ignored column cannot hide a short row", () => {
    const text = "Member;category;quantity;material;section;b [mm];h [mm];Span;supports;live_uniform [kN/m];Comment\r\nP1;floor_beam;2;steel-s355;rectangle;200;600;4;pinned roller;5\r\n";
    const parsed = parseOk(text, "semicolon");
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), fixtureChoices);
    const result = validateSchedule({ parsed, mapped, ...options });
    expect(result).toEqual({ ok: false, errors: [expect.objectContaining({ row: 2, line: 2, code: "field_count" })] });
  });

  it("runs intake too: a load case the preset does not use is named at its row and column", () => {
    const text = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,snow_uniform [kN/m]\r\nS1,floor_beam,1,steel-s355,rectangle,100,300,4,pinned roller,2\r\n";
    const parsed = parseOk(text);
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), { targets: {}, units: {}, system: "SI" });
    const result = validateSchedule({ parsed, mapped, ...options });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors).toEqual([expect.objectContaining({ row: 2, line: 2, column: "snow_uniform [kN/m]" })]);
  });

  it("writes a CSV the server reads to the same members", () => {
    const parsed = parseOk(fixture("two-beams-semicolon.csv"), "semicolon");
    const mapped = buildMappedHeader(describeHeaders(parsed.header.fields), fixtureChoices);
    const server = parseScheduleCsv(writeMappedCsv(parsed, mapped, "semicolon"), { delimiter: ";", name: "x", profile: { preset: "ibc-2021-floor" }, units: { system: "SI" } });
    expect(server.ok).toBe(true);
    if (server.ok) {
      const members = server.doc.members as { mark: string; spans: unknown[] }[];
      expect(members.map((m) => m.mark)).toEqual(["P1", "F1"]);
      expect(members[0]!.spans).toEqual([{ value: 4, unit: "m" }]);
    }
  });
});
