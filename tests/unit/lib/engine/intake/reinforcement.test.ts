/**
 * Intake of reinforced concrete: the `reinforcement` block (SI and US units), the tee outline,
 * the errors naming field and member, lambda_Delta = xi / (1 + 50 rho') with rho' = A's/(b d)
 * (ACI 318-19 24.2.4.1.1 and Table 24.2.4.1.3, from memory), f_r = 0.62 sqrt(f'c) (ACI 318-19
 * 19.2.3.1, from memory), and the gross-section flag.
 */
import { describe, expect, it } from "vitest";
import { createDoc, formatIssues, parseIssues, parseOk } from "./helpers";

const concrete = {
  material: "concrete-fc30",
  section: { shape: "rectangle", b: 300, h: 500 },
  spans: [6],
  loads: [{ case: "dead", type: "uniform", w: 15 }, { case: "live", type: "uniform", w: 10 }],
};
const reinforcement = { tensionSteel: 1473, effectiveDepth: 440 };

describe("reinforcement block", () => {
  it("builds the span's reinforced section on the rectangle outline; I stays I_g", () => {
    const member = parseOk(createDoc({ ...concrete, reinforcement })).members[0]!;
    const span = member.spans[0]!;
    expect(span.iMm4).toBeCloseTo((300 * 500 ** 3) / 12, 3);
    expect(span.reinforcedConcrete).toEqual({
      webWidthMm: 300,
      depthMm: 500,
      tensionSteelMm2: 1473,
      effectiveDepthMm: 440,
      steelEMpa: 200_000,
      ruptureMpa: 0.62 * Math.sqrt(30),
    });
    expect(member.concreteGrossSection).toBeUndefined();
  });

  it("US units through the unit table: in^2 and in (1 in = 25.4 mm exactly, NIST SP 811)", () => {
    const doc = createDoc({ ...concrete, reinforcement: { tensionSteel: { value: 2.4, unit: "in^2" }, effectiveDepth: { value: 17.5, unit: "in" } } });
    const section = parseOk(doc).members[0]!.spans[0]!.reinforcedConcrete!;
    expect(section.tensionSteelMm2).toBeCloseTo(2.4 * 25.4 ** 2, 9);
    expect(section.effectiveDepthMm).toBeCloseTo(17.5 * 25.4, 9);
  });

  it("a tee outline gives flange width and thickness, and the T's I_g", () => {
    const doc = createDoc({ ...concrete, section: { shape: "tee", bf: 1200, hf: 100, bw: 300, h: 600 }, reinforcement: { tensionSteel: 2000, effectiveDepth: 530 } });
    const span = parseOk(doc).members[0]!.spans[0]!;
    expect(span.reinforcedConcrete).toMatchObject({ webWidthMm: 300, depthMm: 600, flangeWidthMm: 1200, flangeThicknessMm: 100 });
    const ybar = (120000 * 50 + 150000 * 350) / 270000;
    expect(span.iMm4).toBeCloseTo((1200 * 100 ** 3) / 12 + 120000 * (ybar - 50) ** 2 + (300 * 500 ** 3) / 12 + 150000 * (350 - ybar) ** 2, 0);
    expect(span.areaMm2).toBe(270000);
  });

  it("lambda_Delta from rho': xi = 2.0 by default, rho' = A's/(b d)", () => {
    const member = parseOk(createDoc({ ...concrete, reinforcement: { ...reinforcement, compressionSteel: 660, compressionDepth: 60 } }, { profile: { preset: "aci-318-19-floor" } })).members[0]!;
    expect(member.materialCreepFactor).toBeCloseTo(2 / (1 + 50 * (660 / (300 * 440))), 12);
    const twelve = parseOk(createDoc({ ...concrete, reinforcement, creep: { method: "aci", durationMonths: 12 } }, { profile: { preset: "aci-318-19-floor" } })).members[0]!;
    expect(twelve.materialCreepFactor).toBeCloseTo(1.4, 12);
  });

  it("top steel for hogging regions: topSteel at topDepth (from the bottom face), both or neither", () => {
    const doc = createDoc({ ...concrete, supports: ["roller", "fixed"], reinforcement: { ...reinforcement, topSteel: { value: 24.54, unit: "cm^2" }, topDepth: 445 } });
    const section = parseOk(doc).members[0]!.spans[0]!.reinforcedConcrete!;
    // 1 cm^2 = 100 mm^2 (SI, NIST SP 811)
    expect(section.topSteelMm2).toBeCloseTo(2454, 9);
    expect(section.topEffectiveDepthMm).toBe(445);
    const half = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { ...reinforcement, topSteel: 2454 } })));
    expect(half).toEqual(["members[0].reinforcement.topDepth: top steel needs both topSteel (area) and topDepth (d_top, from the bottom face)"]);
    const deep = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { ...reinforcement, topSteel: 2454, topDepth: 520 } })));
    expect(deep).toEqual(["members[0].reinforcement.topDepth: the top steel depth d_top (520 mm, from the bottom face) must be less than the section depth h (500 mm) (members[0].spans[0])"]);
  });

  // A span between supports that can hog needs its top steel: a guess of it (the bottom steel
  // mirrored, say) overstates the stiffness when the real top steel is lighter (hogging-causes.ts).
  it("top steel is required wherever the member can hog, once per reinforcement block, with the cause", () => {
    const continuous = formatIssues(parseIssues(createDoc({ ...concrete, spans: [6, 5], supports: ["pinned", "pinned", "roller"], reinforcement })));
    expect(continuous).toHaveLength(1);
    expect(continuous[0]).toMatch(/^members\[0\]\.reinforcement\.topSteel: is required because it is continuous over an interior support: .*give topSteel \(area\) and topDepth/);
    const overhang = formatIssues(parseIssues(createDoc({ ...concrete, overhangs: { right: 2 }, reinforcement })));
    expect(overhang[0]).toMatch(/^members\[0\]\.reinforcement\.topSteel: is required because it has an overhang beyond a support/);
    const fixed = formatIssues(parseIssues(createDoc({ ...concrete, supports: ["fixed", "roller"], reinforcement })));
    expect(fixed[0]).toMatch(/because it has a fixed end/);
    // a span's own reinforcement is named on its own path
    const own = createDoc({ ...concrete, spans: [6, { length: 5, reinforcement }], supports: ["pinned", "pinned", "roller"], reinforcement: { ...reinforcement, topSteel: 982, topDepth: 445 } });
    expect(formatIssues(parseIssues(own)).map((issue) => issue.split(":")[0])).toEqual(["members[0].spans[1].reinforcement.topSteel"]);
    // a simple span under downward load, and a cantilever (whose given steel is its top steel), need none
    expect(parseOk(createDoc({ ...concrete, reinforcement })).members).toHaveLength(1);
    expect(parseOk(createDoc({ ...concrete, supports: ["fixed", "free"], spans: [2], reinforcement })).members).toHaveLength(1);
    expect(parseOk(createDoc({ ...concrete, spans: [6, 5], supports: ["pinned", "pinned", "roller"], reinforcement: { ...reinforcement, topSteel: 982, topDepth: 445 } })).members).toHaveLength(1);
  });

  it("errors name the field and the member", () => {
    const issues = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { tensionSteel: 0, effectiveDepth: 440 } })));
    expect(issues).toContain("members[0].reinforcement.tensionSteel: must be greater than 0");
    const deep = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { tensionSteel: 1473, effectiveDepth: 520 } })));
    expect(deep).toEqual(["members[0].reinforcement.effectiveDepth: effective depth d (520 mm) must be less than the section depth h (500 mm) (members[0].spans[0])"]);
    const steel = formatIssues(parseIssues(createDoc({ ...concrete, material: "steel-s355", reinforcement })));
    expect(steel[0]).toMatch(/^members\[0\]\.reinforcement: reinforcement needs a library concrete material/);
    const round = formatIssues(parseIssues(createDoc({ ...concrete, section: { shape: "round", d: 400 }, reinforcement: { tensionSteel: 1000, effectiveDepth: 340 } })));
    expect(round[0]).toMatch(/^members\[0\]\.reinforcement: reinforcement needs a rectangle or tee section/);
    const half = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { ...reinforcement, compressionSteel: 600 } })));
    expect(half[0]).toMatch(/^members\[0\]\.reinforcement\.compressionDepth: compression steel needs both/);
    const ratio = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement, creep: { method: "aci", durationMonths: 60, compressionRatio: 0.01 } })));
    expect(ratio).toContain("members[0].creep.compressionRatio: is derived from the reinforcement (rho' = A's / (b d)); leave it out");
    const unknown = formatIssues(parseIssues(createDoc({ ...concrete, reinforcement: { ...reinforcement, as: 3 } })));
    expect(unknown[0]).toMatch(/^members\[0\]\.reinforcement\.as: unknown field/);
  });

  it("a span's own section is checked against the member's reinforcement, naming the span", () => {
    const doc = createDoc({ ...concrete, spans: [6, { length: 4, section: { shape: "rectangle", b: 300, h: 400 } }], supports: ["pinned", "pinned", "roller"], reinforcement });
    expect(formatIssues(parseIssues(doc))).toEqual(["members[0].reinforcement.effectiveDepth: effective depth d (440 mm) must be less than the section depth h (400 mm) (members[0].spans[1])"]);
  });
});

describe("gross-section flag", () => {
  it("concrete without reinforcement or an explicit I is flagged; an explicit I is the schedule's own", () => {
    expect(parseOk(createDoc(concrete)).members[0]!.concreteGrossSection).toBe(true);
    expect(parseOk(createDoc({ ...concrete, section: { shape: "explicit", I: 1.5e9, A: 150000 } })).members[0]!.concreteGrossSection).toBeUndefined();
    expect(parseOk(createDoc({})).members[0]!.concreteGrossSection).toBeUndefined();
  });
});
