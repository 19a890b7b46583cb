/**
 * Pattern (partial) loading of variable cases: closed forms for the arrangements a handbook
 * tabulates, a brute force over every arrangement, and the switches (profile off, fixed loads,
 * user variable cases). Sources beside each value; the superposition principle itself is the
 * theory of linear elastic beams (Mueller-Breslau's influence lines).
 */
import { describe, expect, it } from "vitest";
import { checkMember } from "../../../../../lib/engine/check-member";
import { getSpanJudgements } from "../../../../../lib/engine/checks";
import type { CheckResult, LimitProfile, Load, Member, Support } from "../../../../../lib/engine/model";
import { createRandom } from "../solver/random";
import { EI, createMember, createSpans, createSupports, expectRelative } from "../solver/fixtures";

const W = 10; // N/mm

const liveProfile: LimitProfile = {
  id: "pattern",
  label: "Pattern test",
  source: "test profile",
  cantileverSpanMultiplier: 2,
  combinations: [
    { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
    { id: "D+L", label: "Dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
};
const unpatterned: LimitProfile = { ...liveProfile, patternLoads: false };

function getCheck(checks: CheckResult[], combinationId: string, spanIndex: number): CheckResult {
  const check = checks.find((c) => c.combinationId === combinationId && c.spanIndex === spanIndex);
  if (check === undefined) throw new Error(`no check ${combinationId} on span ${spanIndex}`);
  return check;
}

/** Largest f(x) on [0, L]: 2,000 samples, then golden-section refinement around the best one. */
function maximizeNumerically(f: (x: number) => number, lengthMm: number): { x: number; value: number } {
  let bestX = 0;
  for (let k = 0; k <= 2000; k++) if (f((lengthMm * k) / 2000) > f(bestX)) bestX = (lengthMm * k) / 2000;
  let lo = Math.max(0, bestX - lengthMm / 2000);
  let hi = Math.min(lengthMm, bestX + lengthMm / 2000);
  const ratio = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 200; i++) {
    const a = hi - ratio * (hi - lo);
    const b = lo + ratio * (hi - lo);
    if (f(a) > f(b)) hi = b;
    else lo = a;
  }
  return { x: (lo + hi) / 2, value: f((lo + hi) / 2) };
}

/**
 * Deflection (+ down) of a simply supported span under uniform w with a hogging moment M at its
 * right end: w x (L^3 - 2 L x^2 + x^3) / (24 EI) - M x (L^2 - x^2) / (6 EI L), by superposing
 * AISC Manual Table 3-23 case 1 and the end-moment case (from memory).
 */
function getSpanWithEndMoment(wNPerMm: number, lengthMm: number, momentNmm: number): (x: number) => number {
  return (x) => (wNPerMm * x * (lengthMm ** 3 - 2 * lengthMm * x * x + x ** 3)) / (24 * EI) - (momentNmm * x * (lengthMm * lengthMm - x * x)) / (6 * EI * lengthMm);
}

describe("pattern loading: closed forms", () => {
  it("two equal spans, uniform live on both as given: each span is judged with only itself loaded", () => {
    const L = 6000;
    const member = createMember(createSpans([L, L]), createSupports("pinned", "roller", "roller"), [{ kind: "uniform", loadCase: "live", wNPerMm: W }]);
    const check = getCheck(checkMember(member, liveProfile).checks, "L", 0);
    // AISC Manual Table 3-23, "continuous beam, two equal spans, uniform load on one span":
    // largest deflection 0.0092 w L^4 / EI at 0.472 L (from memory).
    expectRelative(check.deflectionMm, (0.0092 * W * L ** 4) / EI, 0.01);
    // independent: three-moment equation, M_B = w L^2 / 16 with one span loaded, then the
    // largest deflection of the loaded span found numerically
    const reference = maximizeNumerically(getSpanWithEndMoment(W, L, (W * L * L) / 16), L);
    expectRelative(check.deflectionMm, reference.value, 1e-8);
    expect(Math.abs(check.atMm - reference.x)).toBeLessThan(0.01);
    expect(check.atMm / L).toBeCloseTo(0.472, 3);
    expect(check.loadedSpans).toEqual({ live: [0] });
    expect(getCheck(checkMember(member, liveProfile).checks, "L", 1).loadedSpans).toEqual({ live: [1] });
    // both spans loaded: w L^4 / (185 EI) (AISC Table 3-23, two equal spans, uniform on both;
    // from memory): the pattern gives the larger figure
    const full = getCheck(checkMember(member, unpatterned).checks, "L", 0);
    expectRelative(full.deflectionMm, (W * L ** 4) / (185 * EI), 0.002);
    expect(full.loadedSpans).toBeUndefined();
    expect(check.deflectionMm).toBeGreaterThan(1.6 * full.deflectionMm);
  });

  it("three equal spans: the middle span alone loaded for its own check, the outer two for theirs", () => {
    const L = 5000;
    const member = createMember(createSpans([L, L, L]), createSupports("pinned", "roller", "roller", "roller"), [{ kind: "uniform", loadCase: "live", wNPerMm: W }]);
    const checks = checkMember(member, liveProfile).checks;
    // three-moment equation, middle span loaded only: M_B = M_C = w L^2 / 20; midspan
    // 5 w L^4 / (384 EI) - M L^2 / (8 EI) = (5/384 - 1/160) w L^4 / EI (Clapeyron's theorem)
    const middle = getCheck(checks, "L", 1);
    expectRelative(middle.deflectionMm, ((5 / 384 - 1 / 160) * W * L ** 4) / EI, 1e-9);
    expectRelative(middle.atMm, 1.5 * L, 1e-9);
    expect(middle.loadedSpans).toEqual({ live: [1] });
    // outer spans loaded only: M_B = M_C = w L^2 / 20 again; the end span's largest deflection
    const outer = getCheck(checks, "L", 0);
    expectRelative(outer.deflectionMm, maximizeNumerically(getSpanWithEndMoment(W, L, (W * L * L) / 20), L).value, 1e-8);
    expect(outer.loadedSpans).toEqual({ live: [0, 2] });
  });

  it("overhang tip: worst downward with the back span unloaded, upward with the overhang unloaded", () => {
    // AISC Manual Table 3-23, "beam overhanging one support" (from memory):
    // uniform load on the overhang only: tip w a^3 (4 l + 3 a) / (24 EI) down;
    // uniform load between supports only: tip w l^3 a / (24 EI) up;
    // uniform load over the whole length: tip w a (4 a^2 l - l^3 + 3 a^3) / (24 EI).
    const l = 4000;
    const a = 2000;
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "live", wNPerMm: W }]);
    const tip = getCheck(checkMember(member, liveProfile).checks, "L", 1);
    expectRelative(tip.deflectionMm, (W * a ** 3 * (4 * l + 3 * a)) / (24 * EI), 1e-9);
    expectRelative(tip.atMm, l + a, 1e-12);
    expect(tip.loadedSpans).toEqual({ live: [1] });
    const whole = getCheck(checkMember(member, unpatterned).checks, "L", 1);
    expectRelative(whole.deflectionMm, (W * a * (4 * a * a * l - l ** 3 + 3 * a ** 3)) / (24 * EI), 1e-9);
    // a longer back span: the uplift of the tip under the back span alone governs
    const longBack = createMember(createSpans([6000, a]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "live", wNPerMm: W }]);
    const uplift = getCheck(checkMember(longBack, liveProfile).checks, "L", 1);
    expectRelative(uplift.deflectionMm, -(W * 6000 ** 3 * a) / (24 * EI), 1e-9);
    expect(uplift.loadedSpans).toEqual({ live: [0] });
  });

  it("a single span without an overhang is unchanged: no pattern, no field", () => {
    const member = createMember(createSpans([6000]), createSupports("pinned", "roller"), [
      { kind: "uniform", loadCase: "dead", wNPerMm: 4 },
      { kind: "uniform", loadCase: "live", wNPerMm: W, startMm: 1000, endMm: 4000 },
    ]);
    const patterned = checkMember(member, liveProfile);
    expect(patterned).toEqual(checkMember(member, unpatterned));
    for (const check of patterned.checks) expect(check.loadedSpans).toBeUndefined();
    // AISC Manual Table 3-23 case 1 (from memory): 5 w L^4 / (384 EI) for the dead part alone
    expectRelative(getCheck(checkMember({ ...member, loads: [member.loads[0]!] }, liveProfile).checks, "D+L", 0).deflectionMm, (5 * 4 * 6000 ** 4) / (384 * EI), 1e-9);
  });
});

describe("pattern loading: switches", () => {
  const twoSpans = (loads: Load[]): Member => createMember(createSpans([6000, 6000]), createSupports("pinned", "roller", "roller"), loads);

  it("a load marked fixed is always present in full", () => {
    const member = twoSpans([{ kind: "uniform", loadCase: "live", wNPerMm: W, fixed: true }]);
    const checks = checkMember(member, liveProfile).checks;
    expect(checks).toEqual(checkMember(member, unpatterned).checks);
    expectRelative(getCheck(checks, "L", 0).deflectionMm, (W * 6000 ** 4) / (185 * EI), 0.002); // AISC Table 3-23, two equal spans (from memory)
  });

  it("patternLoads: false loads every span at once; a user case is patterned only when listed variable", () => {
    const member = twoSpans([{ kind: "uniform", loadCase: "crowd", wNPerMm: W }]);
    const crowdProfile: LimitProfile = { ...liveProfile, combinations: [{ id: "C", label: "Crowd", factors: { crowd: 1 }, limitRatio: 360 }] };
    const permanent = getCheck(checkMember(member, crowdProfile).checks, "C", 0);
    expect(permanent.loadedSpans).toBeUndefined();
    const variable = getCheck(checkMember(member, { ...crowdProfile, variableCases: ["crowd"] }).checks, "C", 0);
    expect(variable.loadedSpans).toEqual({ crowd: [0] });
    expectRelative(variable.deflectionMm, maximizeNumerically(getSpanWithEndMoment(W, 6000, (W * 6000 * 6000) / 16), 6000).value, 1e-8);
    expect(getCheck(checkMember(member, { ...crowdProfile, variableCases: ["crowd"], patternLoads: false }).checks, "C", 0).loadedSpans).toBeUndefined();
  });

  it("snow and roof live are variable by name; dead never is", () => {
    const member = twoSpans([
      { kind: "uniform", loadCase: "dead", wNPerMm: 2 },
      { kind: "uniform", loadCase: "snow", wNPerMm: W },
      { kind: "uniform", loadCase: "roof_live", wNPerMm: W },
    ]);
    const profile: LimitProfile = { ...liveProfile, combinations: [{ id: "D+S+Lr", label: "Roof", factors: { dead: 1, snow: 1, roof_live: 0.5 }, limitRatio: 240 }] };
    expect(getCheck(checkMember(member, profile).checks, "D+S+Lr", 1).loadedSpans).toEqual({ snow: [1], roof_live: [1] });
  });
});

describe("pattern loading: chord and settlement on springs", () => {
  it("simply supported on two springs: chord deflection 5wL^4/(384EI), settlement wL/(2k) at each end", () => {
    const L = 6000;
    const k = 4000; // N/mm
    const supports: Support[] = [{ kind: "spring", springNPerMm: k }, { kind: "spring", springNPerMm: k }];
    const member = createMember(createSpans([L]), supports, [{ kind: "uniform", loadCase: "live", wNPerMm: W }]);
    const check = getCheck(checkMember(member, liveProfile).checks, "L", 0);
    const settlement = (W * L) / (2 * k); // statics: each spring carries w L / 2
    const chord = (5 * W * L ** 4) / (384 * EI); // AISC Table 3-23 case 1 (from memory)
    expectRelative(check.chordDeflectionMm!, chord, 1e-9);
    expectRelative(check.totalDeflectionMm!, chord + settlement, 1e-9);
    expect(check.supportSettlementMm!.length).toBe(2);
    expectRelative(check.supportSettlementMm![0]!, settlement, 1e-9);
    expectRelative(check.supportSettlementMm![1]!, settlement, 1e-9);
    // the larger of the two is judged (the conservative reading of span / N)
    expect(check.deflectionBasis).toBe("total");
    expectRelative(check.deflectionMm, chord + settlement, 1e-9);
  });

  it("a check never judges less than either extreme", () => {
    const member = createMember(createSpans([5000, 2500]), [{ kind: "pinned" }, { kind: "spring", springNPerMm: 800 }, { kind: "free" }], [
      { kind: "uniform", loadCase: "dead", wNPerMm: 3 },
      { kind: "uniform", loadCase: "live", wNPerMm: W },
    ]);
    for (const check of checkMember(member, liveProfile).checks) {
      expect(Math.abs(check.deflectionMm)).toBe(Math.max(Math.abs(check.chordDeflectionMm!), Math.abs(check.totalDeflectionMm!)));
      expect(check.supportSettlementMm!.length).toBe(check.spanKind === "cantilever" ? 1 : 2);
    }
  });
});

/** The variable loads restricted to the chosen (case, group) units: the brute force's own split. */
function restrictLoads(member: Member, variable: Set<string>, chosen: Set<string>): Load[] {
  const judgements = getSpanJudgements(member);
  const groupRanges: { startMm: number; endMm: number; group: number }[] = [];
  let x = 0;
  member.spans.forEach((span, e) => {
    const group = judgements[e]!.groupIndex;
    const last = groupRanges[groupRanges.length - 1];
    if (last !== undefined && last.group === group) last.endMm = x + span.lengthMm;
    else groupRanges.push({ startMm: x, endMm: x + span.lengthMm, group });
    x += span.lengthMm;
  });
  const loads: Load[] = [];
  for (const load of member.loads) {
    if (!variable.has(load.loadCase)) {
      loads.push(load);
      continue;
    }
    for (const range of groupRanges) {
      if (!chosen.has(`${load.loadCase}:${range.group}`)) continue;
      if (load.kind === "point" || load.kind === "moment") {
        if (load.atMm > range.startMm && load.atMm < range.endMm) loads.push(load);
        continue;
      }
      const start = load.startMm ?? 0;
      const end = load.endMm ?? x;
      const lo = Math.max(start, range.startMm);
      const hi = Math.min(end, range.endMm);
      if (!(hi > lo)) continue;
      if (load.kind === "uniform") loads.push({ kind: "uniform", loadCase: load.loadCase, wNPerMm: load.wNPerMm, startMm: lo, endMm: hi });
      else {
        const slope = (load.wEndNPerMm - load.wStartNPerMm) / (load.endMm - load.startMm);
        loads.push({ kind: "linear", loadCase: load.loadCase, startMm: lo, endMm: hi, wStartNPerMm: load.wStartNPerMm + slope * (lo - start), wEndNPerMm: load.wStartNPerMm + slope * (hi - start) });
      }
    }
  }
  return loads;
}

function createRandomMember(random: () => number): Member {
  const spanCount = 2 + Math.floor(random() * 3);
  const lengths = Array.from({ length: spanCount }, () => 2000 + random() * 5000);
  const supports: Support[] = Array.from({ length: spanCount + 1 }, () => ({ kind: "roller" as const }));
  supports[0] = { kind: random() < 0.3 ? "fixed" : "pinned" };
  if (random() < 0.35) supports[0] = { kind: "free" };
  if (random() < 0.35) supports[spanCount] = { kind: "free" };
  if (random() < 0.3) supports[1 + Math.floor(random() * (spanCount - 1))] = { kind: "spring", springNPerMm: 500 + random() * 5000 };
  if (supports[0].kind === "free" && supports[spanCount]!.kind === "free") supports[0] = { kind: "fixed" };
  const totalMm = lengths.reduce((sum, length) => sum + length, 0);
  const start = random() * totalMm * 0.6;
  const loads: Load[] = [
    { kind: "uniform", loadCase: "dead", wNPerMm: 1 + random() * 4 },
    { kind: "uniform", loadCase: "live", wNPerMm: 2 + random() * 8 },
    { kind: "uniform", loadCase: "live", wNPerMm: 2 + random() * 8, startMm: start, endMm: start + totalMm * 0.35 },
    { kind: "point", loadCase: "live", atMm: random() * totalMm, pN: 2000 + random() * 20000 },
    { kind: "linear", loadCase: "snow", startMm: 0, endMm: totalMm, wStartNPerMm: random() * 5, wEndNPerMm: random() * 5 },
    { kind: "moment", loadCase: "snow", atMm: random() * totalMm, mNmm: (random() - 0.5) * 4e7 },
  ];
  return createMember(createSpans(lengths), supports, loads);
}

describe("pattern loading: brute force over every arrangement (independent check)", () => {
  const profile: LimitProfile = {
    ...liveProfile,
    combinations: [
      { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
      { id: "D+L+S", label: "Dead + live + snow", factors: { dead: 1, live: 1, snow: 0.7 }, limitRatio: 240 },
    ],
  };

  it("no arrangement of 2^n beats the superposition result, and the reported arrangement reproduces it", () => {
    const random = createRandom(4242);
    const variable = new Set(["live", "snow"]);
    let patternMattered = 0;
    for (let trial = 0; trial < 30; trial++) {
      const member = createRandomMember(random);
      const groupCount = getSpanJudgements(member).at(-1)!.groupIndex + 1;
      const units: string[] = [];
      for (const name of variable) for (let g = 0; g < groupCount; g++) units.push(`${name}:${g}`);
      const patterned = checkMember(member, profile).checks;
      const bruteMax = patterned.map(() => 0);
      for (let mask = 0; mask < 1 << units.length; mask++) {
        const chosen = new Set(units.filter((_, u) => (mask >> u) & 1));
        const fixedChecks = checkMember({ ...member, loads: restrictLoads(member, variable, chosen) }, { ...profile, patternLoads: false }).checks;
        fixedChecks.forEach((check, i) => (bruteMax[i] = Math.max(bruteMax[i]!, Math.abs(check.deflectionMm))));
      }
      const scale = Math.max(...bruteMax);
      const allLoaded = checkMember(member, { ...profile, patternLoads: false }).checks;
      allLoaded.forEach((check, i) => {
        if (bruteMax[i]! > 1.01 * Math.abs(check.deflectionMm)) patternMattered++;
      });
      patterned.forEach((check, i) => {
        // never exceeded by any arrangement, and reached by one (the envelope is exact)
        expect(Math.abs(check.deflectionMm)).toBeGreaterThanOrEqual(bruteMax[i]! - 1e-9 * scale);
        expect(Math.abs(check.deflectionMm)).toBeLessThanOrEqual(bruteMax[i]! + 1e-9 * scale);
        // the reported arrangement, loaded on its own, gives the reported deflection
        const judgements = getSpanJudgements(member);
        const chosen = new Set<string>();
        for (const [name, spans] of Object.entries(check.loadedSpans ?? {})) for (const e of spans) chosen.add(`${name}:${judgements[e]!.groupIndex}`);
        for (const name of variable) if (!(name in (check.loadedSpans ?? {}))) for (let g = 0; g < groupCount; g++) chosen.add(`${name}:${g}`);
        const again = checkMember({ ...member, loads: restrictLoads(member, variable, chosen) }, { ...profile, patternLoads: false }).checks[i]!;
        expect(Math.abs(Math.abs(again.deflectionMm) - Math.abs(check.deflectionMm))).toBeLessThanOrEqual(1e-9 * scale);
      });
    }
    // the generated members exercise patterns: many checks are worse than with every span loaded
    expect(patternMattered).toBeGreaterThan(20);
  }, 120_000); // a generous bound: the brute force takes seconds on a loaded machine, and vitest's 5 s default is no speed target
});
