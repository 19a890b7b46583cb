import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";

import { createDoc, formatIssues, parseIssues } from "./helpers";

function getMessages(member: Record<string, unknown>, root: Record<string, unknown> = {}): string[] {
  return formatIssues(parseIssues(createDoc(member, root)));
}

describe("every problem at once, each with its path", () => {
  it("collects issues from several members in one pass", () => {
    const doc = createDoc();
    const members = doc.members as Record<string, unknown>[];
    const base = members[0] ?? {};
    doc.members = [
      base,
      { ...base, mark: "B2", spans: [5, 0], supports: ["pinned", "pinned", "roller"] },
      { ...base, mark: "B3", loads: [{ case: "live", type: "point", at: 7, P: 3 }] },
      { ...base, mark: "B1" },
      { ...base, mark: "B5", material: "steel-s999" },
      { ...base, mark: "B6", section: "W12x26" },
      { ...base, mark: "B7", supports: ["pinned"] },
      { ...base, mark: "B8", loads: [{ case: "snow", type: "uniform", w: 1 }] },
    ];
    const messages = formatIssues(parseIssues(doc));
    expect(messages).toEqual([
      "members[1].spans[1]: must be greater than 0",
      "members[2].loads[0].at: beyond the end of the member (total length 5000 mm, overhangs included)",
      'members[3].mark: duplicate mark "B1" (first at members[0])',
      expect.stringMatching(/^members\[4\]\.material: unknown material "steel-s999"; library ids: /),
      'members[5].section: section "W12x26" is a catalogue name, but no catalogue was given',
      "members[6].supports: has 1 supports but 1 span need 2 (one per span end, left to right; overhang tips are free and not listed)",
      'members[7].loads[0].case: "snow" is not used by limit profile ibc-2021-floor (its cases: live, dead); the load would be ignored',
    ]);
  });

  it("names the length field when a span is written as an object", () => {
    expect(getMessages({ spans: [5, { length: -2 }], supports: ["pinned", "pinned", "roller"] })).toEqual([
      "members[0].spans[1].length: must be greater than 0",
    ]);
  });
});

describe("units are never guessed", () => {
  it("a bare number with no declared default is an issue naming the kind to declare", () => {
    const messages = getMessages({}, { units: { length: "m", sectionDimension: "mm" } });
    expect(messages).toEqual([
      'members[0].loads[0].w: no unit: write {"value": 2, "unit": "..."} or declare units.distributedLoad (or units.system) for distributed load values',
    ]);
  });

  it("an unknown unit lists the accepted ones", () => {
    const [message] = getMessages({ spans: [{ value: 5, unit: "furlong" }] });
    expect(message).toMatch(/^members\[0\]\.spans\[0\]\.unit: unknown length unit "furlong"; accepted: mm, cm, m, in, ft$/);
  });

  it("a unit of the wrong kind says which kind it is", () => {
    expect(getMessages({ loads: [{ case: "live", type: "uniform", w: { value: 2, unit: "kN" } }] })).toEqual([
      'members[0].loads[0].w.unit: "kN" is a force unit, but a distributed load is expected; accepted: N/mm, kN/m, N/m, kN/mm, plf, klf, lb/in, kip/in',
    ]);
  });

  it("a {value} without unit is an issue", () => {
    expect(getMessages({ spans: [{ value: 5 }] })).toEqual(["members[0].spans[0].unit: is required: a length unit"]);
  });

  it("a wrong declared default is reported and bare numbers of that kind are not read in the system unit", () => {
    const messages = formatIssues(parseIssues(createDoc({}, { units: { system: "SI", length: "metres please" } })));
    expect(messages[0]).toMatch(/^units\.length: unknown length unit "metres please"/);
    expect(messages).toContain('members[0].spans[0]: no unit: write {"value": 5, "unit": "..."} or declare units.length (or units.system) for length values');
  });
});

describe("no non-finite number passes", () => {
  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])("rejects %s as a span", (value) => {
    expect(getMessages({ spans: [value] })).toEqual([`members[0].spans[0]: must be a finite number or {"value": number, "unit": string}, got a non-finite number`]);
  });

  it("rejects a value that overflows on conversion", () => {
    expect(getMessages({ section: { shape: "explicit", I: { value: 1e300, unit: "m^4" } } })).toEqual(["members[0].section.I: is too large"]);
  });

  it("rejects numbers written as strings", () => {
    expect(getMessages({ quantity: "4" })).toEqual(["members[0].quantity: must be a whole number from 1 to 1000000"]);
  });
});

describe("member problems", () => {
  it("reports an unknown field (a typo is never ignored)", () => {
    expect(getMessages({ spna: [5] })[0]).toMatch(/^members\[0\]\.spna: unknown field; allowed here: mark, category/);
  });

  it("reports missing required fields", () => {
    const doc = createDoc();
    doc.members = [{ mark: "X" }];
    const paths = parseIssues(doc).map((i) => i.path);
    expect(paths).toEqual(["members[0].category", "members[0].quantity", "members[0].material", "members[0].section", "members[0].spans", "members[0].supports", "members[0].loads"]);
  });

  it("reports a negative position", () => {
    expect(getMessages({ loads: [{ case: "live", type: "point", at: -1, P: 1 }] })).toEqual([
      "members[0].loads[0].at: must not be negative (positions are measured from the member's left end, overhang included)",
    ]);
  });

  it("counts the overhangs in the member length for positions", () => {
    const ok = parseSchedule(createDoc({ overhangs: { left: 1, right: 1 }, loads: [{ case: "live", type: "point", at: 7, P: 1 }] }));
    expect(ok.ok).toBe(true);
  });

  it("reports a partial load whose end is before its start", () => {
    expect(getMessages({ loads: [{ case: "live", type: "uniform", w: 1, start: 3, end: 2 }] })).toEqual(["members[0].loads[0].end: must be beyond start"]);
  });

  it("asks for either w or pressure with tributaryWidth", () => {
    expect(getMessages({ loads: [{ case: "live", type: "uniform", pressure: 2 }] })).toEqual(["members[0].loads[0].tributaryWidth: is required with pressure"]);
    expect(getMessages({ loads: [{ case: "live", type: "uniform", w: 1, pressure: 2, tributaryWidth: 1 }] })).toEqual([
      "members[0].loads[0]: a uniform load needs either w, or pressure with tributaryWidth",
    ]);
  });

  it("reports an unknown load type and an invalid case name", () => {
    expect(getMessages({ loads: [{ case: "live", type: "triangle" }] })).toEqual(["members[0].loads[0].type: must be one of: uniform, linear, point, moment"]);
    expect(getMessages({ loads: [{ case: "Live Load", type: "uniform", w: 1 }] })).toEqual([
      "members[0].loads[0].case: load case names are lowercase letters, digits and _ (starting with a letter)",
    ]);
  });

  it("requires a spring's stiffness", () => {
    expect(getMessages({ supports: ["pinned", "spring"] })).toEqual(['members[0].supports[1]: a spring needs its stiffness: {"kind": "spring", "stiffness": ...}']);
  });

  it("reports an unstable member", () => {
    expect(getMessages({ supports: ["roller", "free"] })).toEqual([
      "members[0].supports: the member is unstable: it needs a fixed support, or at least two pinned, roller or spring supports",
    ]);
  });

  it("accepts a cantilever fixed at one end", () => {
    expect(parseSchedule(createDoc({ category: "cantilever", supports: ["fixed", "free"] })).ok).toBe(true);
  });

  it("reports impossible section geometry at the dimension's path", () => {
    expect(getMessages({ section: { shape: "tube", D: 100, t: 60 } })).toEqual(["members[0].section.t: wall thickness must be less than half the outer diameter D"]);
    expect(getMessages({ section: { shape: "hexagon", s: 10 } })[0]).toMatch(/^members\[0\]\.section\.shape: must be a catalogue name or an object with shape one of/);
  });

  it("requires creep information for timber under a profile with creep combinations", () => {
    const messages = getMessages({ material: "timber-c24" }, { profile: { preset: "en1995-timber-floor" } });
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatch(/^members\[0\]\.creep: is required: the limit profile has long-term \(creep\) combinations and Softwood C24 creeps/);
  });

  it("rejects a creep method that does not fit the material", () => {
    expect(getMessages({ material: "timber-c24", creep: { method: "aci", durationMonths: 60, compressionRatio: 0 } })).toEqual([
      "members[0].creep.method: aci creep does not apply to timber (Softwood C24)",
    ]);
  });

  it("needs area and density for self-weight, and the dead case in the profile", () => {
    expect(getMessages({ section: { shape: "explicit", I: 1e8 }, selfWeight: true })).toEqual(["members[0].selfWeight: needs the section area A (members[0].spans[0])"]);
    const wall = getMessages({ selfWeight: true, loads: [{ case: "wind", type: "uniform", w: 1 }] }, { profile: { preset: "ibc-2021-wall-flexible" } });
    expect(wall).toEqual(["members[0].selfWeight: self-weight goes to the dead case, which limit profile ibc-2021-wall-flexible does not use"]);
  });

  it("flags a member with nothing on it", () => {
    expect(getMessages({ loads: [] })).toEqual(["members[0].loads: the member has no loads and no self-weight"]);
  });
});

describe("schedule-level problems", () => {
  it("rejects a non-object document", () => {
    expect(formatIssues(parseIssues([]))).toEqual([": must be an object, got an array"]);
  });

  it("checks the format id and required fields", () => {
    const issues = formatIssues(parseIssues({ format: "other/v9" }));
    expect(issues).toEqual(["name: is required", "units: is required", "profile: is required", "members: is required", 'format: must be "sagline.schedule/v2"']);
  });

  it("reports an unknown preset with the list", () => {
    expect(getMessages({}, { profile: { preset: "ibc-1997" } })[0]).toMatch(/^profile\.preset: unknown preset "ibc-1997"; presets: ibc-2021-floor, /);
  });

  it("reports an override of a combination the preset does not have", () => {
    expect(getMessages({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { snow: { limitRatio: 300 } } } } })).toEqual([
      'profile.overrides.combinations.snow: no combination "snow" in preset ibc-2021-floor; its combinations: live, dead+live',
    ]);
  });

  it("rejects a zero limit ratio in an override", () => {
    expect(getMessages({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { limitRatio: 0 } } } } })).toEqual([
      "profile.overrides.combinations.live.limitRatio: must be greater than 0",
    ]);
  });

  it("reports duplicate combination ids in a custom profile", () => {
    const combination = { id: "live", label: "live", factors: { live: 1 }, limitRatio: 360 };
    const messages = getMessages({}, { profile: { custom: { id: "p", label: "P", source: "spec", cantileverSpanMultiplier: 2, combinations: [combination, combination] } } });
    expect(messages).toEqual(['profile.custom.combinations[1].id: duplicate combination id "live"']);
  });

  it("caps the number of listed issues and says how many more there were", () => {
    const doc = createDoc();
    const base = (doc.members as Record<string, unknown>[])[0] ?? {};
    doc.members = Array.from({ length: 30 }, (_, i) => ({ ...base, mark: `M${i}`, spans: [-1] }));
    const issues = parseIssues(doc, { maxIssues: 10 });
    expect(issues).toHaveLength(11);
    expect(issues[10]).toEqual({ path: "", message: "20 more issues not listed" });
    const result = parseSchedule(doc, { maxIssues: 10 });
    expect(result.ok ? null : result.unlistedCount).toBe(20);
    expect(parseSchedule(createDoc({ spans: [-1] }))).toMatchObject({ ok: false, unlistedCount: 0 });
  });

  it("rejects an empty members array", () => {
    expect(formatIssues(parseIssues(createDoc({}, { members: [] })))).toEqual(["members: must be an array of 1 to 100000 members"]);
  });
});

describe("hostile or broken input", () => {
  it("rejects a catalogue entry with a non-finite I instead of passing NaN to the engine", () => {
    const catalogue = [{ name: "BAD1", iMm4: Number.NaN, areaMm2: 100, massKgPerM: 1 }];
    expect(formatIssues(parseIssues(createDoc({ section: "BAD1" }), { catalogue }))).toEqual([
      'members[0].section: catalogue entry "BAD1" has no valid iMm4 (must be a positive finite number)',
    ]);
  });

  it("treats __proto__ and constructor keys as unknown fields, never as data", () => {
    const doc = JSON.parse('{"format":"sagline.schedule/v2","name":"x","units":{"system":"SI"},"profile":{"preset":"ibc-2021-floor","overrides":{"combinations":{"__proto__":{"limitRatio":1}}}},"members":[{"__proto__":{"mark":"evil"},"mark":"B1","category":"floor_beam","quantity":1,"material":"steel-s355","section":{"shape":"rectangle","b":100,"h":200},"spans":[5],"supports":["pinned","roller"],"loads":[{"case":"live","type":"uniform","w":2}]}]}');
    const paths = parseIssues(doc).map((i) => i.path);
    expect(paths).toEqual(["profile.overrides.combinations.__proto__", "members[0].__proto__"]);
    expect(({} as Record<string, unknown>).mark).toBeUndefined();
  });

  it("rejects an over-long mark and a huge member list without reading it", () => {
    expect(getMessages({ mark: "M".repeat(65) })).toEqual(["members[0].mark: must be at most 64 characters"]);
    const doc = createDoc({}, { members: { length: 200000 } });
    expect(formatIssues(parseIssues(doc))).toEqual(["members: must be an array of 1 to 100000 members"]);
  });
});

describe("values outside their physical range are refused on their own field (lib/engine/input-bounds.ts, common practice)", () => {
  it("a 1e308 mm span names spans[0], not a singular matrix", () => {
    expect(getMessages({ spans: [{ value: 1e308, unit: "mm" }] })).toEqual([
      "members[0].spans[0]: must be at most 1,000,000 mm: expected a member length, position or width from 1 mm to 1 km",
    ]);
  });

  it("states the limit in the unit the schedule used (a 5,000 ft span)", () => {
    expect(getMessages({ spans: [5000] }, { units: { system: "US" } })).toContain(
      "members[0].spans[0]: must be at most 3,280.84 ft: expected a member length, position or width from 1 mm to 1 km",
    );
  });

  it("a custom E of 13.8 read as MPa is refused with the likely slip named", () => {
    expect(getMessages({ material: { name: "LVL", E: 13.8 } })).toEqual([
      "members[0].material.E: must be at least 100 MPa: expected a structural modulus from 100 MPa to 1,000,000 MPa (1,000 GPa); a smaller number is usually GPa written without its unit",
    ]);
  });

  it("the same E written as 13.8 GPa is accepted", () => {
    // A custom wood product also states its moisture condition: the IBC D + L row needs its creep component.
    expect(parseSchedule(createDoc({ material: { name: "LVL", E: { value: 13.8, unit: "GPa" } }, moistureCondition: "seasoned_dry" })).ok).toBe(true);
  });

  it.each([
    ["an explicit I of 1e30 mm^4", { section: { shape: "explicit", I: 1e30 } }, /^members\[0\]\.section\.I: must be at most 1e15 mm\^4/],
    ["a spring of 1e12 kN/mm", { supports: ["pinned", { kind: "spring", stiffness: 1e12 }] }, /^members\[0\]\.supports\[1\]\.stiffness: must be at most 1e7 kN\/mm: .*use pinned/],
    ["a line load of 1e9 kN/m", { loads: [{ case: "live", type: "uniform", w: -1e9 }] }, /^members\[0\]\.loads\[0\]\.w: must be at most 100,000 kN\/m in magnitude/],
    ["a density of 1e6 kg/m^3", { material: { name: "X", E: 1000, density: 1e6 } }, /^members\[0\]\.material\.density: must be at most 25,000 kg\/m\^3/],
  ])("%s names its field", (_name, member, message) => {
    const messages = getMessages(member);
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatch(message);
  });
});
