import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

import Ajv2020 from "ajv/dist/2020.js";
import { describe, expect, it } from "vitest";

const repoRoot = fileURLToPath(new URL("../../../../", import.meta.url));
const exampleJson = "examples/lumenbrook-depot-hall-b.json";
const exampleCsv = "examples/lumenbrook-depot-hall-b-joists.csv";
const tempDir = mkdtempSync(join(tmpdir(), "sagline-cli-"));

function runCli(args: string[]) {
  const result = spawnSync(process.execPath, ["--import", "tsx", "lib/cli/check.ts", ...args], { cwd: repoRoot, encoding: "utf8", timeout: 60_000 });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

function writeTemp(name: string, text: string): string {
  const path = join(tempDir, name);
  writeFileSync(path, text);
  return path;
}

/*
 * Why B2 of the example fails (examples/lumenbrook-depot-hall-b.json): an S355 plate I-section
 * bf 100, tf 8.5, d 200, tw 5.6 mm, simply supported over L = 8000 mm, live 5.0 kN/m = 5.0 N/mm.
 * I = [bf d^3 - (bf - tw)(d - 2tf)^3] / 12 = [100 * 200^3 - 94.4 * 183^3] / 12 = 18.46e6 mm^4
 * (doubly symmetric I from plates, fillets ignored; any mechanics-of-materials text, e.g. Gere and Goodno, Mechanics of Materials, from memory).
 * E = 210,000 MPa (EN 1993-1-1:2005 3.2.6, from memory, the source lib/engine/materials.ts names for steel-s355).
 * Live alone: 5wL^4/(384EI) = 5 * 5.0 * 8000^4 / (384 * 210,000 * 18.46e6) = 68.8 mm
 * (AISC Manual Table 3-23 case 1, from memory), against the file's own override l/360 = 22.2 mm of
 * the EN 1995-1-1 7.2 preset's w_inst: utilization about 3.1, so B2 fails on live load alone, and
 * w_inst (dead + live, EN 1995-1-1 2.2.3(2), from memory) is larger still.
 */
/** A 20 ft US beam, I = 204 in^4, steel-aisc, under a live line load of `wKlf` (negative is uplift). */
function createUsBeamDoc(wKlf: number) {
  return {
    format: "sagline.schedule/v2",
    name: "US beam",
    units: { system: "US" },
    profile: { preset: "ibc-2021-floor" },
    members: [
      {
        mark: "W1",
        category: "floor_beam",
        quantity: 1,
        material: "steel-aisc",
        section: { shape: "explicit", I: 204 },
        spans: [20],
        supports: ["pinned", "roller"],
        loads: [{ case: "live", type: "uniform", w: wKlf }],
      },
    ],
  };
}

const CAUTION = "Screening and review aid: the engineer of record and the governing local codes decide.";

describe("npm run check", { timeout: 60_000 }, () => {
  it("exits 1 when a member fails, with the table and the caution line", () => {
    const { code, stdout, stderr } = runCli([exampleJson]);
    expect(stderr).toBe("");
    expect(code).toBe(1);
    expect(stdout).toMatch(/^mark\s+governing check\s+deflection \[mm\]\s+allowed \[mm\]\s+achieved\s+limit\s+utilization\s+factor of safety\s+outcome$/m);
    // B2's governing check is w_inst at l/360; achieved l/N is 8000 / deflection, below 360
    expect(stdout).toMatch(/^B2\s+w_inst, span 1\s+[\d.]+ down\s+22\.22\s+l\/\d+\s+l\/360\s.*fail$/m);
    expect(stdout).toMatch(/^B1\s.*pass$/m);
    // B2 fails: 68.8 mm against l/360 = 22.2 mm (derived above).
    expect(stdout).toMatch(/^B2\s.*fail$/m);
    expect(stdout).toContain("6 members: 5 pass, 1 fail.");
    expect(stdout).toContain(CAUTION);
  });

  it("names frequency as the governing check of a member that fails only on frequency", () => {
    // S355 plate I (as B2), 6 m, simply supported, dead 3 N/mm and 0.1 x live as mass, live 0.1 N/mm: every
    // deflection passes; f1 = (pi / (2 L^2)) sqrt(EI / m) is about 4.9 Hz (Roark's Formulas Table
    // 16.1 case 1, from memory), far below the 20 Hz the profile asks.
    const doc = JSON.parse(readFileSync(join(repoRoot, exampleJson), "utf8"));
    doc.profile = { preset: "ibc-2021-floor-vibration", overrides: { frequency: { min: 20 } } };
    doc.members = [{ ...doc.members[5], spans: [6.0], selfWeight: false, loads: [{ case: "dead", type: "uniform", w: 3.0 }, { case: "live", type: "uniform", w: 0.1 }] }];
    const file = writeTemp("frequency.json", JSON.stringify(doc));
    const table = runCli([file]);
    expect(table.code).toBe(1);
    expect(table.stdout).toMatch(/^B2\s+frequency\s+-\s+-\s+[\d.]+ Hz\s+>= 20 Hz\s.*fail$/m);
    const json = JSON.parse(runCli([file, "--json"]).stdout);
    expect(json.members[0].checks.every((c: { pass: boolean }) => c.pass)).toBe(true);
    expect(json.members[0].governingCheck).toMatchObject({ kind: "frequency", key: "frequency", pass: false });
    const iMm4 = (100 * 200 ** 3 - (100 - 5.6) * (200 - 17) ** 3) / 12;
    const f1Hz = (Math.PI / (2 * 6 ** 2)) * Math.sqrt((210000 * iMm4 * 1e-6) / (3010 / 9.80665)); // mass of dead + 0.1 live, the preset's massFactors
    expect(json.members[0].governingCheck.utilization).toBeCloseTo(20 / f1Hz, 2);
  });

  it("exits 0 when every member passes (the CSV example with a profile)", () => {
    const { code, stdout } = runCli([exampleCsv, "--profile", "en1995-timber-floor"]);
    expect(code).toBe(0);
    expect(stdout).toContain("5 members: 5 pass, 0 fail.");
    expect(stdout).toContain(CAUTION);
  });

  it("reads a semicolon-delimited CSV when told", () => {
    const text = "mark;category;quantity;material;section;b [mm];h [mm];span_1 [m];supports;live_uniform [kN/m]\r\nB1;floor_beam;1;steel-s355;rectangle;100;200;3;pinned roller;1\r\n";
    const { code, stdout } = runCli([writeTemp("semi.csv", text), "--delimiter", "semicolon", "--profile", "ibc-2021-floor"]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^B1\s.*pass$/m);
  });

  it("prints results JSON that matches result.schema.json", () => {
    const { code, stdout } = runCli([exampleJson, "--json"]);
    expect(code).toBe(1);
    const doc = JSON.parse(stdout);
    const schema = JSON.parse(readFileSync(join(repoRoot, "api-schemas/v1/result.schema.json"), "utf8"));
    const validate = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true }).compile(schema);
    expect(validate(doc) ? [] : validate.errors).toEqual([]);
    expect(doc.caution).toBe(CAUTION);
    // The one failure is B2 (derived above).
    expect(doc.counts).toEqual({ members: 6, pass: 5, fail: 1, error: 0 });
  });

  it("exits 2 and prints every issue as path: message", () => {
    const doc = JSON.parse(readFileSync(join(repoRoot, exampleJson), "utf8"));
    doc.members[0].spans = [0];
    doc.members[2].loads[2].at = 9;
    const { code, stdout, stderr } = runCli([writeTemp("bad.json", JSON.stringify(doc))]);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr.trim().split("\n")).toEqual([
      "members[0].spans[0]: must be greater than 0",
      "members[2].loads[2].at: beyond the end of the member (total length 5500 mm, overhangs included)",
    ]);
  });

  it("exits 2 with row, line and column for a bad CSV row", () => {
    const text = 'mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m],notes\nB1,floor_beam,1,steel-s355,rectangle,100,200,3,pinned roller,1,"two\nlines"\nB2,floor_beam,1,steel-s355,rectangle,100,200,abc,pinned roller,1,\n';
    const { code, stderr } = runCli([writeTemp("bad.csv", text), "--profile", "ibc-2021-floor"]);
    expect(code).toBe(2);
    expect(stderr.trim()).toBe('row 3 (line 4), span_1 [m]: "abc" is not a number');
  });

  it("exits 2 for intake issues in a CSV, naming the row", () => {
    const text = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m]\nB1,floor_beam,1,steel-s355,rectangle,100,200,0,pinned roller,1\n";
    const { code, stderr } = runCli([writeTemp("zero.csv", text), "--profile", "ibc-2021-floor"]);
    expect(code).toBe(2);
    expect(stderr.trim()).toBe("row 2, span_1 [m]: must be greater than 0");
  });

  it("exits 2 when a CSV has no profile, listing the presets", () => {
    const { code, stderr } = runCli([exampleCsv]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/a CSV schedule needs --profile ID; presets: ibc-2021-floor, /);
  });

  it("exits 2 on a file that is not JSON, without a stack trace", () => {
    const { code, stderr } = runCli([writeTemp("broken.json", "{ not json")]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/broken\.json: not valid JSON/);
    expect(stderr).not.toMatch(/\bat .*\.ts:\d+/);
  });

  it("exits 2 on a missing file and on an unknown option", () => {
    expect(runCli([join(tempDir, "nope.json")]).code).toBe(2);
    const unknown = runCli([exampleJson, "--colour"]);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toContain("unknown option --colour");
  });

  it("prints deflections in inches for a US schedule: 5wL^4/(384EI) = 0.487 in against l/360 = 0.667 in (AISC Manual Table 3-23 case 1)", () => {
    const doc = createUsBeamDoc(0.8);
    // w = 0.8 klf = 0.8/12 kip/in, L = 240 in, I = 204 in^4;
    // E = 29,000 ksi (AISC 360-16 / Steel Construction Manual, from memory: the source lib/engine/materials.ts names for steel-aisc).
    // 5wL^4/(384EI): AISC Manual Table 3-23 case 1 (from memory).
    const expectedIn = (5 * (0.8 / 12) * 240 ** 4) / (384 * 29000 * 204);
    const { code, stdout } = runCli([writeTemp("us.json", JSON.stringify(doc))]);
    expect(code).toBe(0);
    expect(stdout).toContain("deflection [in]");
    const row = /^W1\s+live, span 1\s+([\d.]+) down\s+([\d.]+)\s+(l\/\d+)\s+(l\/\d+)\s+([\d.]+)\s+([\d.]+)\s+pass$/m.exec(stdout);
    // Allowed: l/360 for floor live load, IBC 2021 Table 1604.3 (from memory); achieved l/N = 240 in / deflection.
    expect(row?.slice(1, 6)).toEqual([expectedIn.toFixed(3), (240 / 360).toFixed(3), `l/${Math.round(240 / expectedIn)}`, "l/360", (expectedIn / (240 / 360)).toFixed(3)]);
  });

  it("prints a failing US member's minimum I in in^4, never below 5wL^4 x 360 / (384 E L) (AISC Manual Table 3-23 case 1, from memory)", () => {
    const doc = createUsBeamDoc(2.0);
    // The minimum I meets l/360 (IBC 2021 Table 1604.3, from memory) exactly: deflection scales with 1/I
    // here (no springs, self-weight, shear deformation or frequency), so I_min = 5wL^4 / (384 E L/360).
    const exactIn4 = (5 * (2.0 / 12) * 240 ** 4) / (384 * 29000 * (240 / 360));
    const { code, stdout } = runCli([writeTemp("us-fail.json", JSON.stringify(doc))]);
    expect(code).toBe(1);
    const match = /^W1: needs I >= ([\d,.]+) in\^4$/m.exec(stdout);
    expect(match, stdout).not.toBeNull();
    const printedIn4 = Number((match?.[1] ?? "").replaceAll(",", ""));
    expect(printedIn4).toBeGreaterThanOrEqual(exactIn4);
    expect(printedIn4).toBeLessThanOrEqual(exactIn4 * 1.001 + 0.1);
    expect(stdout).not.toContain("mm^4");
  });

  it("shows uplift as up: the same beam under -0.8 klf deflects 0.487 in up (AISC Manual Table 3-23 case 1, from memory)", () => {
    const expectedIn = (5 * (0.8 / 12) * 240 ** 4) / (384 * 29000 * 204);
    const { code, stdout } = runCli([writeTemp("us-uplift.json", JSON.stringify(createUsBeamDoc(-0.8)))]);
    expect(code).toBe(0);
    expect(stdout).toMatch(new RegExp(`^W1\\s+live, span 1\\s+${expectedIn.toFixed(3).replace(".", "\\.")} up\\s`, "m"));
    expect(stdout).not.toMatch(/^W1\s.* down\s/m);
  });

  it("flags a concrete member checked with its gross section and summarises a reinforced one (table and JSON)", () => {
    const concrete = { category: "floor_beam", quantity: 1, material: "concrete-fc30", section: { shape: "rectangle", b: 300, h: 500 }, spans: [6], supports: ["pinned", "roller"], loads: [{ case: "dead", type: "uniform", w: 15 }, { case: "live", type: "uniform", w: 10 }] };
    const doc = {
      format: "sagline.schedule/v2",
      name: "Invented RC beams",
      units: { system: "SI" },
      profile: { preset: "ibc-2021-floor" },
      members: [
        { mark: "G1", ...concrete },
        { mark: "R1", ...concrete, reinforcement: { tensionSteel: 1473, effectiveDepth: 440 } },
      ],
    };
    const path = writeTemp("concrete.json", JSON.stringify(doc));
    const table = runCli([path]);
    expect(table.stdout).toContain("G1: gross section: cracking not included");
    expect(table.stdout).toMatch(/R1: cracked section: I_e per ACI 318-19 Table 24\.2\.3\.5/);
    const json = JSON.parse(runCli([path, "--json"]).stdout);
    expect(json.members[0].notes).toContain("gross section: cracking not included");
  });

  it("passes --catalogue through: the failing member gets the lightest catalogue section with enough I", () => {
    const catalogueFile = "examples/catalogue-ostrovel-plate-girders.json";
    const { code, stdout } = runCli([exampleJson, "--catalogue", catalogueFile]);
    expect(code).toBe(1);
    const match = /^B2: needs I >= ([\d,]+) mm\^4; lightest passing catalogue section (.+)$/m.exec(stdout);
    expect(match).not.toBeNull();
    const minIMm4 = Number((match?.[1] ?? "").replaceAll(",", ""));
    const catalogue: { name: string; iMm4: number; massKgPerM: number }[] = JSON.parse(readFileSync(join(repoRoot, catalogueFile), "utf8"));
    const byMass = [...catalogue].sort((a, b) => a.massKgPerM - b.massKgPerM);
    const chosen = byMass.findIndex((s) => s.name === match?.[2]);
    expect(byMass[chosen]?.iMm4).toBeGreaterThanOrEqual(minIMm4);
    expect(byMass[chosen - 1]?.iMm4 ?? 0).toBeLessThan(minIMm4);
  });

  it("exits 2 on a malformed catalogue", () => {
    const { code, stderr } = runCli([exampleJson, "--catalogue", writeTemp("cat.json", '[{"name": "X", "iMm4": -1}]')]);
    expect(code).toBe(2);
    expect(stderr).toContain("catalogue[0] needs name, and positive iMm4, areaMm2 and massKgPerM");
  });

  it("replaces the schedule's profile with --profile", () => {
    const { code, stdout } = runCli([exampleJson, "--profile", "ibc-2021-floor"]);
    // IBC floor has no creep combination: timber members then need no creep spec and still check.
    expect(stdout).toContain("Floor members, IBC 2021");
    expect(code).toBe(1);
  });
});
