import { readFileSync } from "node:fs";

import { describe, expect, it } from "vitest";

import { parseSchedule } from "@/lib/engine/intake";
import type { Member } from "@/lib/engine/model";

import { createDoc, parseOk } from "./helpers";

const example = JSON.parse(readFileSync(new URL("../../../../../examples/lumenbrook-depot-hall-b.json", import.meta.url), "utf8"));

function getMember(members: Member[], mark: string): Member {
  const member = members.find((m) => m.mark === mark);
  if (!member) throw new Error(`no member ${mark}`);
  return member;
}

describe("the Lumenbrook Depot example", () => {
  const schedule = parseOk(example);

  it("reads every member, the name and the edited preset", () => {
    expect(schedule.members.map((m) => m.mark)).toEqual(["B1", "J1", "BAL1", "G1", "L1", "B2"]);
    expect(schedule.name).toContain("Lumenbrook Depot");
    expect(schedule.profile.id).toBe("en1995-timber-floor");
    expect(schedule.profile.combinations.find((c) => c.id === "w_inst")?.limitRatio).toBe(360);
    expect(schedule.profile.source).toContain("edited by the schedule");
  });

  it("B1: 6.0 m becomes 6000 mm, kN/m becomes N/mm, EN steel E and the plate-I formula", () => {
    const b1 = getMember(schedule.members, "B1");
    expect(b1.spans).toHaveLength(1);
    expect(b1.spans[0]?.lengthMm).toBeCloseTo(6000, 9);
    expect(b1.spans[0]?.eMpa).toBe(210000); // EN 1993-1-1:2005 3.2.6 (from memory)
    // I = [bf d^3 - (bf - tw)(d - 2tf)^3] / 12, doubly symmetric I from plates, fillets ignored (Gere and Goodno, Mechanics of Materials, appendix of plane-area properties, from memory)
    expect(b1.spans[0]?.iMm4).toBeCloseTo((150 * 300 ** 3 - (150 - 7.1) * (300 - 21.4) ** 3) / 12, 3);
    expect(b1.spans[0]?.densityKgPerM3).toBe(7850); // EN 1991-1-1 Table A.4 (from memory)
    expect(b1.loads).toEqual([
      { kind: "uniform", loadCase: "dead", wNPerMm: 6 },
      { kind: "uniform", loadCase: "live", wNPerMm: 7.5 },
    ]);
    expect(b1.selfWeightCase).toBe("dead");
    // Steel does not creep at ambient temperature (common practice).
    expect(b1.materialCreepFactor).toBe(0);
    expect(b1.supports).toEqual([{ kind: "pinned" }, { kind: "roller" }]);
  });

  it("J1: area load x tributary width (0.5 kPa x 400 mm = 0.2 N/mm), k_def 0.6 for service class 1 (EN 1995-1-1 Table 3.2, from memory)", () => {
    const j1 = getMember(schedule.members, "J1");
    expect(j1.loads[0]).toMatchObject({ kind: "uniform", loadCase: "dead" });
    expect(j1.loads[0]?.kind === "uniform" && j1.loads[0].wNPerMm).toBeCloseTo(0.2, 12);
    expect(j1.loads[1]?.kind === "uniform" && j1.loads[1].wNPerMm).toBeCloseTo(0.6, 12);
    expect(j1.materialCreepFactor).toBe(0.6);
    expect(j1.spans[0]?.eMpa).toBe(11000); // EN 338 C24 E0,mean (from memory)
  });

  it("BAL1: the right overhang becomes a span with a free tip; positions count from the left end", () => {
    const bal = getMember(schedule.members, "BAL1");
    expect(bal.spans.map((s) => s.lengthMm)).toEqual([4000, 1500]);
    expect(bal.supports).toEqual([{ kind: "pinned" }, { kind: "roller" }, { kind: "free" }]);
    expect(bal.loads[1]).toEqual({ kind: "uniform", loadCase: "live", wNPerMm: 4, startMm: 4000, endMm: 5500 });
    expect(bal.loads[2]).toEqual({ kind: "point", loadCase: "live", atMm: 5500, pN: 1500 });
    // (B H^3 - b h^3)/12 with b = B - 2t, h = H - 2t (Gere and Goodno, Mechanics of Materials, appendix of plane-area properties, from memory)
    expect(bal.spans[0]?.iMm4).toBeCloseTo((100 * 200 ** 3 - 87.4 * 187.4 ** 3) / 12, 3);
  });

  it("G1: the second span takes its own section; glulam creep k_def 0.8 in service class 2 (EN 1995-1-1 Table 3.2, from memory)", () => {
    const g1 = getMember(schedule.members, "G1");
    // bh^3/12 (Gere and Goodno, Mechanics of Materials, appendix of plane-area properties, from memory)
    expect(g1.spans[0]?.iMm4).toBeCloseTo((90 * 315 ** 3) / 12, 3);
    expect(g1.spans[1]?.iMm4).toBeCloseTo((90 * 270 ** 3) / 12, 3);
    expect(g1.spans[1]?.eMpa).toBe(11500); // EN 14080 GL24h E0,mean (from memory)
    expect(g1.materialCreepFactor).toBe(0.8);
    expect(g1.loads[2]).toEqual({ kind: "linear", loadCase: "live", startMm: 0, endMm: 2000, wStartNPerMm: 1, wEndNPerMm: 0 });
  });

  it("L1: per-field units override the schedule defaults (4000 N/m = 4 N/mm, 12000 N)", () => {
    const l1 = getMember(schedule.members, "L1");
    expect(l1.loads[0]?.kind === "uniform" && l1.loads[0].wNPerMm).toBeCloseTo(4, 12);
    expect(l1.loads[1]).toEqual({ kind: "point", loadCase: "live", atMm: 1200, pN: 12000 });
    expect(l1.selfWeightCase).toBeUndefined();
  });
});

describe("US customary schedules", () => {
  const doc = createDoc(
    {
      material: "steel-aisc",
      section: { shape: "explicit", I: 204, A: 7.65 }, // invented test values (in^4, in^2), not catalogue data
      spans: [20],
      loads: [
        { case: "live", type: "uniform", w: 0.8 },
        { case: "dead", type: "point", at: 10, P: 2 },
        { case: "dead", type: "moment", at: 0, M: 5 },
      ],
    },
    { units: { system: "US" } },
  );
  const member = parseOk(doc).members[0];

  it("converts ft, klf, kip, kip*ft and in^4 with the exact foot, inch and pound-force (NIST SP 811 Appendix B, from memory)", () => {
    expect(member?.spans[0]?.lengthMm).toBeCloseTo(20 * 304.8, 9);
    expect(member?.spans[0]?.iMm4).toBeCloseTo(204 * 25.4 ** 4, 3);
    expect(member?.spans[0]?.areaMm2).toBeCloseTo(7.65 * 645.16, 6);
    expect(member?.loads[0]?.kind === "uniform" && member.loads[0].wNPerMm).toBeCloseTo((0.8 * 4448.2216152605) / 304.8, 9);
    expect(member?.loads[1]).toEqual({ kind: "point", loadCase: "dead", atMm: 3048, pN: 2 * 4448.2216152605 });
    expect(member?.loads[2]?.kind === "moment" && member.loads[2].mNmm).toBeCloseTo(5 * 4448.2216152605 * 304.8, 3);
  });

  it("lets one kind be set on top of the system (units.distributedLoad = plf)", () => {
    const plf = parseOk({ ...doc, units: { system: "US", distributedLoad: "plf" } }).members[0];
    expect(plf?.loads[0]?.kind === "uniform" && plf.loads[0].wNPerMm).toBeCloseTo((0.8 * 4.4482216152605) / 304.8, 12);
  });
});

describe("supports and sections", () => {
  it("reads a spring support's stiffness in springStiffness units (SI default kN/mm; 1 kN = 1,000 N by SI definition)", () => {
    const member = parseOk(createDoc({ supports: ["pinned", { kind: "spring", stiffness: 2.5 }] })).members[0];
    expect(member?.supports[1]).toEqual({ kind: "spring", springNPerMm: 2500 });
  });

  it("resolves a catalogue name against the given catalogue, ignoring case", () => {
    // an invented test row, not catalogue data
    const catalogue = [{ name: "TEST-C12x26", iMm4: 84.9e6, areaMm2: 4935, massKgPerM: 38.7 }];
    const member = parseOk(createDoc({ section: "test-c12x26" }), { catalogue }).members[0];
    expect(member?.spans[0]?.iMm4).toBe(84.9e6);
    expect(member?.sectionName).toBe("TEST-C12x26");
  });

  it("passes G and shear area only when shear deformation is asked for", () => {
    const plain = parseOk(createDoc()).members[0];
    expect(plain?.spans[0]?.gMpa).toBeUndefined();
    const withShear = parseOk(createDoc({ shearDeformation: true })).members[0];
    expect(withShear?.includeShearDeformation).toBe(true);
    expect(withShear?.spans[0]?.gMpa).toBe(81000); // EN 1993-1-1:2005 3.2.6 (from memory)
    // k = 5/6 for a solid rectangle (Timoshenko beam theory, e.g. Timoshenko and Gere, Mechanics of Materials, from memory)
    expect(withShear?.spans[0]?.shearAreaMm2).toBeCloseTo((5 / 6) * 100 * 200, 9);
  });

  it("a zero overhang means no overhang", () => {
    const member = parseOk(createDoc({ overhangs: { left: 0, right: 0 } })).members[0];
    expect(member?.spans).toHaveLength(1);
  });

  it("takes a custom material with its own creep factor", () => {
    const doc = createDoc(
      { material: { name: "LVL", E: 13.8, G: 0.66, density: 510, creepFactor: 0.6 } },
      { units: { system: "SI", modulus: "GPa" }, profile: { preset: "en1995-timber-floor" } },
    );
    const member = parseOk(doc).members[0];
    expect(member?.spans[0]?.eMpa).toBeCloseTo(13800, 9);
    expect(member?.materialCreepFactor).toBe(0.6);
    expect(member?.materialName).toBe("LVL");
  });
});

describe("profile", () => {
  it("accepts a custom profile with a cap and a frequency requirement", () => {
    const schedule = parseOk(
      createDoc(
        {},
        {
          profile: {
            custom: {
              id: "project-floor",
              label: "Project floor",
              source: "Fernhollow Vantarra project specification (invented)",
              cantileverSpanMultiplier: 2,
              combinations: [{ id: "live", label: "live", factors: { live: 1 }, limitRatio: 500, cap: 12 }],
              frequency: { min: 5, massFactors: { dead: 1, live: 0.1 } },
            },
          },
        },
      ),
    );
    expect(schedule.profile.combinations[0]).toEqual({ id: "live", label: "live", factors: { live: 1 }, limitRatio: 500, capMm: 12 });
    expect(schedule.profile.frequency).toEqual({ minHz: 5, massFactors: { dead: 1, live: 0.1 } });
  });

  it("overrides a preset's ratio, cap and cantilever multiplier", () => {
    const schedule = parseOk(
      createDoc({}, { profile: { preset: "ibc-2021-floor", overrides: { combinations: { live: { limitRatio: 480, cap: { value: 0.5, unit: "in" } } }, cantileverSpanMultiplier: 1.5 } } }),
    );
    expect(schedule.profile.combinations[0]).toMatchObject({ limitRatio: 480, capMm: 12.7 });
    expect(schedule.profile.cantileverSpanMultiplier).toBe(1.5);
  });
});

describe("creep methods through intake", () => {
  it("concrete under ACI 318-19: lambda = 2.0 / (1 + 50 x 0.005) = 1.6 (ACI 318-19 24.2.4.1, from memory)", () => {
    const doc = createDoc(
      { material: "concrete-fc30", creep: { method: "aci", durationMonths: 60, compressionRatio: 0.005 }, section: { shape: "rectangle", b: 1000, h: 200 } },
      { profile: { preset: "aci-318-19-floor" } },
    );
    const member = parseOk(doc).members[0];
    expect(member?.materialCreepFactor).toBeCloseTo(1.6, 12);
    expect(member?.spans[0]?.eMpa).toBeCloseTo(4700 * Math.sqrt(30), 9); // ACI 318-19 19.2.2.1(b) (from memory)
  });

  it("timber under NDS: K_cr 1.5 gives an added factor of 0.5 (NDS 3.5.2, from memory)", () => {
    const doc = createDoc({ material: "timber-c24", creep: { method: "nds", condition: "seasoned_dry" } }, { profile: { preset: "en1995-timber-floor" } });
    expect(parseOk(doc).members[0]?.materialCreepFactor).toBeCloseTo(0.5, 12);
  });

  it("timber under a profile without creep combinations needs no creep spec", () => {
    expect(parseOk(createDoc({ material: "timber-c24" })).members[0]?.materialCreepFactor).toBeUndefined();
  });
});

it("reads a hollow rectangle's b and h as its OUTER size and t as its wall", () => {
  const member = parseOk(createDoc({ section: { shape: "hollow_rectangle", b: 100, h: 200, t: 5 } })).members[0];
  // (B H^3 - b_i h_i^3)/12 with the inner 90 x 190 (Gere and Goodno, Mechanics of Materials, appendix of plane-area properties, from memory)
  expect(member?.spans[0]?.iMm4).toBeCloseTo((100 * 200 ** 3 - 90 * 190 ** 3) / 12, 6);
});

it("refuses a hollow rectangle in the retired v1 form (outer B and H) on its fields", () => {
  const result = parseSchedule(createDoc({ section: { shape: "hollow_rectangle", B: 100, H: 200, t: 5 } }));
  expect(result.ok).toBe(false);
  if (!result.ok) expect(result.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["members[0].section.B"]));
});

it("refuses a sagline.schedule/v1 document, saying what changed", () => {
  const result = parseSchedule({ ...createDoc({}), format: "sagline.schedule/v1" });
  expect(result.ok).toBe(false);
  if (!result.ok) {
    expect(result.issues).toHaveLength(1);
    expect(result.issues[0]?.path).toBe("format");
    expect(result.issues[0]?.message).toMatch(/v1 is retired.*"limits" block is now "profile".*OUTER width and depth/);
  }
});
