import { readFileSync } from "node:fs";

import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";
import { listPresetIds } from "@/lib/engine/presets";

import { createDoc } from "../lib/engine/intake/helpers";

const schema = JSON.parse(readFileSync(new URL("../../../api-schemas/v1/schedule.schema.json", import.meta.url), "utf8"));
const example = JSON.parse(readFileSync(new URL("../../../examples/lumenbrook-depot-hall-b.json", import.meta.url), "utf8"));

const ajv = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true });
addFormats(ajv);
const validate = ajv.compile(schema);

function withMember(member: Record<string, unknown>): Record<string, unknown> {
  return createDoc(member);
}

const goodDocuments: [string, unknown][] = [
  ["the Lumenbrook Depot example", example],
  ["the minimal test schedule", createDoc()],
  ["US units with an explicit section and a moment", createDoc({ material: "steel-aisc", section: { shape: "explicit", I: 204, A: 7.65 }, loads: [{ case: "dead", type: "moment", at: 0, M: 5 }] }, { units: { system: "US" } })],
  ["a spring, overhangs, a per-span override and shear deformation", createDoc({
    spans: [5, { length: { value: 4000, unit: "mm" }, section: { shape: "tube", D: 150, t: 8 } }],
    overhangs: { left: 0, right: { length: 1.2 } },
    supports: ["pinned", { kind: "spring", stiffness: 3 }, { kind: "roller" }],
    shearDeformation: true,
  })],
  ["an ACI preset with a sustained live fraction", createDoc({ material: "concrete-fc30", creep: { method: "aci", durationMonths: 60, compressionRatio: 0 } }, { profile: { preset: "aci-318-19-floor", sustainedLiveFraction: 0.25 } })],
  ["wood with its moisture condition", createDoc({ material: "timber-c24", moistureCondition: "seasoned_dry" })],
  ["a custom combination with its own cantilever ratio and the IBC creep component", createDoc({}, {
    profile: {
      custom: {
        id: "spec", label: "Spec", source: "project specification", cantileverSpanMultiplier: 2,
        combinations: [{ id: "total", label: "total", factors: { live: 1 }, sustainedFactors: { dead: 1 }, creep: "ibc_creep_component", limitRatio: 240, cantileverLimitRatio: 180 }],
      },
    },
  })],
  ["a custom profile with cap and frequency", createDoc({}, {
    profile: {
      custom: {
        id: "spec", label: "Spec", source: "project specification", cantileverSpanMultiplier: 2,
        combinations: [{ id: "live", label: "live", factors: { live: 1 }, limitRatio: 500, cap: { value: 0.5, unit: "in" } }],
        frequency: { min: 5, massFactors: { dead: 1 } },
      },
    },
  })],
  ["reinforced concrete on a tee, with compression steel and a span's own reinforcement", createDoc({
    material: "concrete-fc30",
    section: { shape: "tee", bf: 1200, hf: 100, bw: 300, h: 600 },
    reinforcement: { tensionSteel: 2000, effectiveDepth: 530, compressionSteel: 400, compressionDepth: 60, topSteel: 1600, topDepth: 540 },
    spans: [6, { length: 5, reinforcement: { tensionSteel: { value: 2.5, unit: "in^2" }, effectiveDepth: 540, topSteel: 1200, topDepth: 540, steelE: { value: 200, unit: "GPa" } } }],
    supports: ["pinned", "pinned", "roller"],
    creep: { method: "aci", durationMonths: 12 },
  }, { profile: { preset: "aci-318-19-floor" } })],
  ["a preset with overrides", createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { limitRatio: 480 } }, frequency: { min: 4, massFactors: { dead: 1 } } } } })],
];

const badDocuments: [string, unknown][] = [
  ["no format", (() => { const d = createDoc(); delete d.format; return d; })()],
  ["another format", createDoc({}, { format: "other/v1" })],
  ["a sustained live fraction given as a percentage", createDoc({ material: "concrete-fc30", creep: { method: "aci", durationMonths: 60, compressionRatio: 0 } }, { profile: { preset: "aci-318-19-floor", sustainedLiveFraction: 25 } })],
  ["an unknown moisture condition", createDoc({ material: "timber-c24", moistureCondition: "damp" })],
  ["an unknown root field", createDoc({}, { colour: "red" })],
  ["an unknown member field", withMember({ colour: "red" })],
  ["a zero span", withMember({ spans: [0] })],
  ["a span object without its unit", withMember({ spans: [{ value: 5 }] })],
  ["a fractional quantity", withMember({ quantity: 1.5 })],
  ["an unknown category", withMember({ category: "beam" })],
  ["a spring without stiffness", withMember({ supports: ["pinned", "spring"] })],
  ["an unknown load type", withMember({ loads: [{ case: "live", type: "triangle", w: 1 }] })],
  ["a uniform load with both w and pressure", withMember({ loads: [{ case: "live", type: "uniform", w: 1, pressure: 1, tributaryWidth: 1 }] })],
  ["a uniform load with pressure but no width", withMember({ loads: [{ case: "live", type: "uniform", pressure: 1 }] })],
  ["a capitalised case name", withMember({ loads: [{ case: "Live", type: "uniform", w: 1 }] })],
  ["an unknown shape", withMember({ section: { shape: "hexagon", s: 5 } })],
  ["a hollow rectangle in the retired v1 form (outer B and H)", withMember({ section: { shape: "hollow_rectangle", B: 100, H: 200, t: 5 } })],
  ["service class 4", withMember({ material: "timber-c24", creep: { method: "en1995", serviceClass: 4 } })],
  ["an unknown preset", createDoc({}, { profile: { preset: "ibc-1997" } })],
  ["both custom and preset", createDoc({}, { profile: { preset: "ibc-2021-floor", custom: {} } })],
  ["no members", createDoc({}, { members: [] })],
  ["a custom material without E", withMember({ material: { name: "x", G: 1 } })],
  ["a blank mark", withMember({ mark: "   " })],
  ["a negative load position", withMember({ loads: [{ case: "live", type: "point", at: -1, P: 1 }] })],
  ["a negative limit ratio override", createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { limitRatio: -1 } } } } })],
  ["reinforcement without its effective depth", withMember({ material: "concrete-fc30", reinforcement: { tensionSteel: 1000 } })],
  ["compression steel without its depth", withMember({ material: "concrete-fc30", reinforcement: { tensionSteel: 1000, effectiveDepth: 150, compressionSteel: 200 } })],
  ["a string where a number belongs", withMember({ spans: ["5 m"] })],
];

describe("schedule.schema.json", () => {
  it("is a JSON Schema 2020-12 document with an $id", () => {
    expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(schema.$id).toMatch(/schedule\.schema\.json$/);
    expect(schema.properties.members.maxItems).toBe(100000);
  });

  it("lists exactly the engine's presets", () => {
    expect(schema.$defs.profile.oneOf[0].properties.preset.enum).toEqual(listPresetIds());
  });

  it.each(goodDocuments)("accepts %s, and so does intake", (_name, doc) => {
    const valid = validate(doc);
    expect(validate.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    const parsed = parseSchedule(doc);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
  });

  it.each(badDocuments)("rejects %s, and so does intake", (_name, doc) => {
    expect(validate(doc)).toBe(false);
    expect(parseSchedule(doc).ok).toBe(false);
  });
});

describe("docs/schedule-format.md", () => {
  it("opens with a JSON example that the schema and intake accept", () => {
    const docs = readFileSync(new URL("../../../docs/schedule-format.md", import.meta.url), "utf8");
    const block = /```json\n([\s\S]*?)\n```/.exec(docs)?.[1];
    expect(block).toBeDefined();
    const doc = JSON.parse(block ?? "null");
    expect(validate(doc) ? [] : validate.errors).toEqual([]);
    const parsed = parseSchedule(doc);
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
  });
});
