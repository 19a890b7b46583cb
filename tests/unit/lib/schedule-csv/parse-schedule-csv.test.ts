import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";
import { buildCsvTemplate, createCsvRowMapper, mapIssueToCsvRow, parseScheduleCsv, type ParseScheduleCsvOptions } from "@/lib/schedule-csv";

const exampleCsv = readFileSync(new URL("../../../../examples/lumenbrook-depot-hall-b-joists.csv", import.meta.url), "utf8");
const exampleJson = JSON.parse(readFileSync(new URL("../../../../examples/lumenbrook-depot-hall-b.json", import.meta.url), "utf8"));
const options: ParseScheduleCsvOptions = { name: "Lumenbrook Depot joists", profile: { preset: "en1995-timber-floor" } };

const HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m],notes";

function parseOk(text: string, extra: Partial<ParseScheduleCsvOptions> = {}) {
  const result = parseScheduleCsv(text, { ...options, profile: { preset: "ibc-2021-floor" }, ...extra });
  if (!result.ok) throw new Error(JSON.stringify(result.errors));
  return result;
}

function parseErrors(text: string, extra: Partial<ParseScheduleCsvOptions> = {}) {
  const result = parseScheduleCsv(text, { ...options, profile: { preset: "ibc-2021-floor" }, ...extra });
  if (result.ok) throw new Error("expected errors");
  return result.errors;
}

describe("the example CSV", () => {
  const result = parseScheduleCsv(exampleCsv, options);
  if (!result.ok) throw new Error(JSON.stringify(result.errors));
  const parsed = parseSchedule(result.doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));

  it("maps every row to a member that intake accepts", () => {
    expect(parsed.schedule.members.map((m) => m.mark)).toEqual(["J1", "J2", "J3", "L2", "BAL2"]);
    expect(result.places.map((p) => p.row)).toEqual([2, 3, 4, 5, 6]);
  });

  it("gives the same engine member for J1 as the JSON example", () => {
    const fromJson = parseSchedule(exampleJson);
    if (!fromJson.ok) throw new Error("example JSON invalid");
    const jsonJ1 = fromJson.schedule.members.find((m) => m.mark === "J1");
    const csvJ1 = parsed.schedule.members[0];
    expect(csvJ1?.spans).toEqual(jsonJ1?.spans);
    expect(csvJ1?.materialCreepFactor).toBe(jsonJ1?.materialCreepFactor);
    expect(csvJ1?.loads.map((l) => (l.kind === "uniform" ? l.wNPerMm : 0))).toEqual(jsonJ1?.loads.map((l) => (l.kind === "uniform" ? l.wNPerMm : 0)));
  });

  it("reads quoted commas and doubled quotes in notes", () => {
    const members = result.doc.members as Record<string, unknown>[];
    expect(members[0]?.notes).toBe("Level 2, bays 1-4");
    expect(members[2]?.notes).toBe('Two-span "continuous" joist');
  });

  it("reads a point load list with positions, and a fixed-free cantilever", () => {
    const bal = parsed.schedule.members[4];
    expect(bal?.supports).toEqual([{ kind: "fixed" }, { kind: "free" }]);
    expect(bal?.loads).toContainEqual({ kind: "point", loadCase: "live", atMm: 1500, pN: 1500 });
  });
});

describe("delimiters and encodings", () => {
  const rows = ["B1,floor_beam,2,steel-s355,rectangle,100,200,5,pinned roller,2,", "B2,floor_beam,1,steel-s355,rectangle,100,250,6,pinned roller,2.5,"];

  it("strips a BOM and accepts CRLF", () => {
    const result = parseOk(`\uFEFF${HEADER}\r\n${rows.join("\r\n")}\r\n`);
    expect((result.doc.members as unknown[]).length).toBe(2);
  });

  it("reads semicolon-delimited files when told", () => {
    const text = [HEADER, ...rows].map((line) => line.replaceAll(",", ";")).join("\n");
    const result = parseOk(text, { delimiter: ";" });
    expect((result.doc.members as Record<string, unknown>[])[1]?.mark).toBe("B2");
  });

  it("reads tab-delimited files when told", () => {
    const text = [HEADER, ...rows].map((line) => line.replaceAll(",", "\t")).join("\n");
    expect((parseOk(text, { delimiter: "\t" }).doc.members as unknown[]).length).toBe(2);
  });

  it("does not guess the delimiter: a semicolon file read as commas fails on the header", () => {
    const text = [HEADER, ...rows].map((line) => line.replaceAll(",", ";")).join("\n");
    expect(parseErrors(text)).toEqual([
      { row: 1, line: 1, column: "", code: "wrong_delimiter", message: 'the header is a single column containing ";": pass that delimiter (e.g. --delimiter ;)' },
    ]);
  });

  it("rejects an unsupported delimiter", () => {
    expect(parseErrors(HEADER, { delimiter: "|" as never })[0]?.code).toBe("invalid_delimiter");
  });
});

describe("row and line numbers", () => {
  it("reports the row (header = row 1) and the line, which differ after a quoted newline", () => {
    const text = `${HEADER}\nB1,floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2,"first line\nsecond line"\nB2,floor_beam,1,steel-s355,rectangle,100,200,5x,pinned roller,2,\n`;
    expect(parseErrors(text)).toEqual([{ row: 3, line: 4, column: "span_1 [m]", code: "invalid_number", message: '"5x" is not a number' }]);
  });

  it("maps an intake issue back to the row it came from", () => {
    const text = `${HEADER}\nB1,floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2,\nB2,floor_beam,1,steel-s355,rectangle,100,200,0,pinned roller,2,\n`;
    const result = parseOk(text);
    const parsed = parseSchedule(result.doc);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.issues).toEqual([{ path: "members[1].spans[0]", message: "must be greater than 0" }]);
      expect(mapIssueToCsvRow(parsed.issues[0] ?? { path: "", message: "" }, result.places)).toEqual({
        row: 3,
        line: 3,
        column: "span_1 [m]",
        code: "invalid_value",
        message: "must be greater than 0",
      });
    }
  });

  it("names the position column of a point load that lies beyond the member", () => {
    const header = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_point [kN],live_point_at [m]";
    const result = parseOk(`${header}\nB1,floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2|3,1|6\n`);
    const parsed = parseSchedule(result.doc);
    if (parsed.ok) throw new Error("expected an issue");
    expect(parsed.issues.map((issue) => mapIssueToCsvRow(issue, result.places))).toEqual([
      { row: 2, line: 2, column: "live_point_at [m]", code: "invalid_value", message: "loads[1].at: beyond the end of the member (total length 5000 mm, overhangs included)" },
    ]);
  });
});

describe("header problems", () => {
  it("rejects duplicate headers", () => {
    expect(parseErrors(`${HEADER},Span_1 [m]\n`)).toContainEqual({ row: 1, line: 1, column: "Span_1 [m]", code: "duplicate_header", message: 'column "span_1" appears twice (also "span_1 [m]")' });
  });

  it("rejects unknown columns", () => {
    const errors = parseErrors(`${HEADER},colour\n`);
    expect(errors).toEqual([{ row: 1, line: 1, column: "colour", code: "unknown_column", message: 'unknown column "colour"; see the column list in docs/schedule-format.md' }]);
  });

  it("rejects a quantity column without a unit, unless a units option supplies one", () => {
    const header = HEADER.replace("span_1 [m]", "span_1");
    expect(parseErrors(`${header}\n`)).toEqual([
      { row: 1, line: 1, column: "span_1", code: "missing_unit", message: 'column "span_1" needs a length unit: write "span_1 [m]" or pass a units option' },
    ]);
    const row = "B1,floor_beam,1,steel-s355,rectangle,100,200,16.4,pinned roller,2,";
    const result = parseOk(`${header}\n${row}\n`, { units: { system: "US" } });
    expect((result.doc.members as Record<string, unknown>[])[0]?.spans).toEqual([{ value: 16.4, unit: "ft" }]);
  });

  it("rejects an unknown unit in brackets", () => {
    expect(parseErrors(`${HEADER.replace("[kN/m]", "[kN/m3]")}\n`)[0]).toMatchObject({ code: "unknown_unit", column: "live_uniform [kN/m3]" });
  });

  it("requires the core columns", () => {
    expect(parseErrors("mark,category\n").map((e) => e.message)).toContain('the "span_1" column is required');
  });
});

describe("row problems", () => {
  function getRowErrors(row: string, header = HEADER) {
    return parseErrors(`${header}\n${row}\n`).map((e) => `${e.column}: ${e.code}: ${e.message}`);
  }

  it("rejects a decimal comma with the fix", () => {
    expect(getRowErrors('B1,floor_beam,1,steel-s355,rectangle,100,200,"5,5",pinned roller,2,')).toEqual(['span_1 [m]: invalid_number: "5,5" uses a decimal comma; write 5.5']);
  });

  it("rejects a row with the wrong number of fields", () => {
    expect(getRowErrors("B1,floor_beam,1")).toEqual([": field_count: the row has 3 fields but the header has 11"]);
  });

  it("rejects a dimension the shape does not use", () => {
    expect(getRowErrors("B1,floor_beam,1,steel-s355,round,100,200,5,pinned roller,2,")).toEqual([
      "b [mm]: not_applicable: b does not apply to section round",
      "h [mm]: not_applicable: h does not apply to section round",
      "section: missing_value: section round needs the d column",
    ]);
  });

  it("rejects a gap in the span columns", () => {
    const header = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],span_2 [m],span_3 [m],supports,live_uniform [kN/m]";
    expect(getRowErrors("B1,floor_beam,1,steel-s355,rectangle,100,200,5,,4,pinned pinned roller,2", header)).toEqual(["span_3 [m]: span_gap: span_3 is given but span_2 is empty"]);
  });

  it("rejects point loads and positions of different counts", () => {
    const header = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_point [kN],live_point_at [m]";
    expect(getRowErrors("B1,floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2|3,1", header)).toEqual([
      "live_point [kN]: list_mismatch: 2 values in live_point but 1 positions in live_point_at",
    ]);
  });

  it("reports a missing required cell", () => {
    expect(getRowErrors(",floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2,")).toEqual(["mark: missing_value: mark is required"]);
  });

  it("skips blank rows", () => {
    const result = parseOk(`${HEADER}\n,,,,,,,,,,\nB1,floor_beam,1,steel-s355,rectangle,100,200,5,pinned roller,2,\n`);
    expect(result.places.map(({ row, line }) => ({ row, line }))).toEqual([{ row: 3, line: 3 }]);
  });
});

describe("streaming row mapper", () => {
  it("maps rows one at a time after checking the header once", () => {
    const created = createCsvRowMapper(HEADER.split(","));
    if (!created.ok) throw new Error(JSON.stringify(created.errors));
    const mapped = created.mapper.mapRow("B7,roof_beam,3,timber-c24,rectangle,47,150,3,pinned roller,0.5,".split(","), { row: 100000 });
    expect(mapped).toEqual({
      ok: true,
      member: {
        mark: "B7",
        category: "roof_beam",
        quantity: 3,
        material: "timber-c24",
        section: { shape: "rectangle", b: { value: 47, unit: "mm" }, h: { value: 150, unit: "mm" } },
        spans: [{ value: 3, unit: "m" }],
        supports: ["pinned", "roller"],
        loads: [{ case: "live", type: "uniform", w: { value: 0.5, unit: "kN/m" } }],
      },
      sources: {
        mark: "mark",
        category: "category",
        quantity: "quantity",
        material: "material",
        section: "section",
        "section.b": "b [mm]",
        "section.h": "h [mm]",
        "spans[0]": "span_1 [m]",
        supports: "supports",
        "loads[0]": "live_uniform [kN/m]",
      },
    });
    const bad = created.mapper.mapRow("B8,roof_beam,x,timber-c24,rectangle,47,150,3,pinned roller,0.5,".split(","), { row: 100001, line: 100003 });
    expect(bad).toEqual({ ok: false, errors: [{ row: 100001, line: 100003, column: "quantity", code: "invalid_number", message: '"x" is not a whole number' }] });
  });
});

describe("buildCsvTemplate", () => {
  it("is a header and one example row that intake accepts", () => {
    const template = buildCsvTemplate();
    expect(template.split("\r\n").filter((line) => line !== "")).toHaveLength(2);
    const result = parseScheduleCsv(template, options);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const parsed = parseSchedule(result.doc);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
  });
});

describe("moisture_condition (IBC 2021 Table 1604.3 creep component of wood, from memory: 0.5 D seasoned dry, 1.0 D otherwise)", () => {
  const header = "mark,category,quantity,material,moisture_condition,section,b [mm],h [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m]";
  it("reaches intake, which sets the creep component", () => {
    const result = parseOk(`${header}\nJ1,floor_beam,1,timber-c24,Seasoned_Dry,rectangle,47,200,3.6,pinned roller,0.2,0.6\n`);
    expect((result.doc.members as Record<string, unknown>[])[0]?.moistureCondition).toBe("seasoned_dry");
    const parsed = parseSchedule(result.doc);
    expect(parsed.ok && parsed.schedule.members[0]?.ibcCreepComponentFactor).toBe(0.5);
  });
  it("on steel is an intake issue on that field", () => {
    const result = parseOk(`${header}\nB1,floor_beam,1,steel-s355,unseasoned_or_wet,rectangle,100,200,3.6,pinned roller,0.2,0.6\n`);
    const parsed = parseSchedule(result.doc);
    expect(parsed.ok ? [] : parsed.issues.map((i) => i.path)).toEqual(["members[0].moistureCondition"]);
  });
});
