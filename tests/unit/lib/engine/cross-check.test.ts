/**
 * Cross-check of the stiffness solver on random continuous members (2 to 4 spans, EI varying per
 * span, pinned / roller / fixed / spring / free supports, uniform, partial, linear, point and
 * couple loads) against an independent force-method solution written here: the member is freed
 * at every support, the reactions become unknown loads, the deflection is the double integral of
 * the curvature -M/EI (composite Gauss-Legendre, exact for these polynomial moments), and the
 * compatibility and equilibrium equations are solved with the ml-matrix library. Nothing from the
 * engine's element formulas is used on this side.
 */
import { Matrix, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import type { Load, Member, Support, SupportKind } from "../../../../lib/engine/model";
import { createCaseFactors, findSpanExtreme, rotationAt, deflectionAt, solveMember } from "../../../../lib/engine/solver";
import { createRandom } from "./solver/random";

interface Action {
  kind: "point" | "couple" | "linear";
  at: number;
  end: number;
  value: number;
  valueEnd: number;
}

/** Sagging bending moment at x from every action left of x (free left end, statics only). */
function getMoment(actions: Action[], x: number): number {
  let m = 0;
  for (const a of actions) {
    if (a.kind === "point") {
      if (x > a.at) m -= a.value * (x - a.at);
    } else if (a.kind === "couple") {
      if (x > a.at) m += a.value;
    } else if (x > a.at) {
      // resultant of the trapezoid on [a.at, min(x, a.end)] and its lever arm to x
      const hi = Math.min(x, a.end);
      const slope = (a.valueEnd - a.value) / (a.end - a.at);
      const qHi = a.value + slope * (hi - a.at);
      const length = hi - a.at;
      const force = ((a.value + qHi) / 2) * length;
      const centroidFromStart = force === 0 ? 0 : (length * (a.value + 2 * qHi)) / (3 * (a.value + qHi));
      m -= force * (x - (a.at + centroidFromStart));
    }
  }
  return m;
}

const GAUSS_X = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
const GAUSS_W = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];

interface Reference {
  nodes: number[];
  ei: (x: number) => number;
  breaks: number[];
}

/** integral_0^x kernel(t) * (-M(t)/EI(t)) dt, pieces split at every discontinuity and at x. */
function integrateCurvature(ref: Reference, actions: Action[], x: number, withLever: boolean): number {
  const cuts = [0, ...ref.breaks.filter((b) => b > 0 && b < x), x];
  let total = 0;
  for (let i = 0; i + 1 < cuts.length; i++) {
    const lo = cuts[i]!;
    const hi = cuts[i + 1]!;
    if (hi <= lo) continue;
    const half = (hi - lo) / 2;
    GAUSS_X.forEach((g, k) => {
      const t = lo + half * (1 + g);
      const kernel = withLever ? x - t : 1;
      total += GAUSS_W[k]! * half * kernel * (-getMoment(actions, t) / ref.ei(t));
    });
  }
  return total;
}

interface ForceMethodResult {
  deflection: (x: number) => number;
  slope: (x: number) => number;
}

function solveByForceMethod(member: Member, loadCase: string): ForceMethodResult {
  const nodes = [0];
  member.spans.forEach((span) => nodes.push(nodes[nodes.length - 1]! + span.lengthMm));
  const total = nodes[nodes.length - 1]!;
  const ei = (x: number): number => {
    for (let e = 0; e < member.spans.length; e++) if (x <= nodes[e + 1]!) return member.spans[e]!.eMpa * member.spans[e]!.iMm4;
    return member.spans[member.spans.length - 1]!.eMpa * member.spans[member.spans.length - 1]!.iMm4;
  };
  const loads: Action[] = [];
  for (const load of member.loads) {
    if (load.loadCase !== loadCase) continue;
    if (load.kind === "point") loads.push({ kind: "point", at: load.atMm, end: load.atMm, value: load.pN, valueEnd: 0 });
    else if (load.kind === "moment") loads.push({ kind: "couple", at: load.atMm, end: load.atMm, value: load.mNmm, valueEnd: 0 });
    else if (load.kind === "uniform") loads.push({ kind: "linear", at: load.startMm ?? 0, end: load.endMm ?? total, value: load.wNPerMm, valueEnd: load.wNPerMm });
    else loads.push({ kind: "linear", at: load.startMm, end: load.endMm, value: load.wStartNPerMm, valueEnd: load.wEndNPerMm });
  }
  const breaks = [...nodes, ...loads.flatMap((a) => [a.at, a.end])].sort((a, b) => a - b);
  const ref: Reference = { nodes, ei, breaks };
  // unknowns: v0, theta0, then a reaction force (upward) per restrained node, a couple per fixed node
  const unknowns: Action[] = [];
  const unknownNodes: { node: number; kind: "force" | "couple" }[] = [];
  member.supports.forEach((support, node) => {
    if (support.kind === "free") return;
    unknowns.push({ kind: "point", at: nodes[node]!, end: nodes[node]!, value: -1, valueEnd: 0 });
    unknownNodes.push({ node, kind: "force" });
    if (support.kind === "fixed") {
      unknowns.push({ kind: "couple", at: nodes[node]!, end: nodes[node]!, value: 1, valueEnd: 0 });
      unknownNodes.push({ node, kind: "couple" });
    }
  });
  const n = 2 + unknowns.length;
  const rows: number[][] = [];
  const rhs: number[] = [];
  // each equation: sum_k A_k u_k + (load part) = target
  const deflectionRow = (x: number): { row: number[]; load: number } => ({
    row: [1, x, ...unknowns.map((u) => integrateCurvature(ref, [u], x, true))],
    load: integrateCurvature(ref, loads, x, true),
  });
  const slopeRow = (x: number): { row: number[]; load: number } => ({
    row: [0, 1, ...unknowns.map((u) => integrateCurvature(ref, [u], x, false))],
    load: integrateCurvature(ref, loads, x, false),
  });
  unknownNodes.forEach(({ node, kind }, k) => {
    const support = member.supports[node] as Support;
    const x = nodes[node]!;
    if (kind === "force") {
      const { row, load } = deflectionRow(x);
      if (support.kind === "spring") row[2 + k] = row[2 + k]! - 1 / support.springNPerMm!; // v = R / k
      rows.push(row);
      rhs.push(-load);
    } else {
      const { row, load } = slopeRow(x);
      rows.push(row);
      rhs.push(-load);
    }
  });
  // equilibrium: moment just beyond the right end and the net vertical force vanish
  const beyond = total * (1 + 1e-12) + 1e-9;
  rows.push([0, 0, ...unknowns.map((u) => getMoment([u], beyond))]);
  rhs.push(-getMoment(loads, beyond));
  const netForce = (actions: Action[]): number => actions.reduce((sum, a) => sum + (a.kind === "point" ? a.value : a.kind === "linear" ? ((a.value + a.valueEnd) / 2) * (a.end - a.at) : 0), 0);
  rows.push([0, 0, ...unknowns.map((u) => netForce([u]))]);
  rhs.push(-netForce(loads));
  expect(rows).toHaveLength(n);
  const solution = solve(new Matrix(rows), Matrix.columnVector(rhs)).getColumn(0);
  const actions = [...loads, ...unknowns.map((u, k) => ({ ...u, value: u.value * solution[2 + k]! }))];
  return {
    deflection: (x) => solution[0]! + solution[1]! * x + integrateCurvature(ref, actions, x, true),
    slope: (x) => solution[1]! + integrateCurvature(ref, actions, x, false),
  };
}

function createRandomMember(random: () => number, index: number): Member {
  const spanCount = 2 + Math.floor(random() * 3);
  const spans = Array.from({ length: spanCount }, () => ({ lengthMm: Math.round(2000 + random() * 6000), eMpa: 10_000 + random() * 200_000, iMm4: 1e7 + random() * 5e8 }));
  const kinds: SupportKind[] = ["pinned", "roller", "fixed", "free", "spring"];
  let supports: Support[];
  do {
    supports = Array.from({ length: spanCount + 1 }, () => {
      const kind = kinds[Math.floor(random() * kinds.length)]!;
      return kind === "spring" ? { kind, springNPerMm: 10 ** (2 + 3 * random()) } : { kind };
    });
  } while (!supports.some((s) => s.kind === "fixed") && supports.filter((s) => s.kind !== "free").length < 2);
  const nodes = [0];
  spans.forEach((span) => nodes.push(nodes[nodes.length - 1]! + span.lengthMm));
  const total = nodes[spanCount]!;
  const position = (): number => (random() < 0.2 ? nodes[Math.floor(random() * nodes.length)]! : Math.round(random() * total));
  const loads: Load[] = [];
  const loadCount = 1 + Math.floor(random() * 6);
  for (let i = 0; i < loadCount; i++) {
    const pick = random();
    const a = position();
    const b = position();
    const [lo, hi] = a < b ? [a, b] : [b, a === b ? Math.min(total, a + 500) : a];
    if (pick < 0.2) loads.push({ kind: "uniform", loadCase: "A", wNPerMm: 1 + random() * 20 });
    else if (pick < 0.4 && hi > lo) loads.push({ kind: "uniform", loadCase: "A", wNPerMm: -5 + random() * 25, startMm: lo, endMm: hi });
    else if (pick < 0.6 && hi > lo) loads.push({ kind: "linear", loadCase: "A", startMm: lo, endMm: hi, wStartNPerMm: random() * 20, wEndNPerMm: -4 + random() * 20 });
    else if (pick < 0.8) loads.push({ kind: "point", loadCase: "A", atMm: position(), pN: -5000 + random() * 40000 });
    else loads.push({ kind: "moment", loadCase: "A", atMm: position(), mNmm: (random() - 0.5) * 6e7 });
  }
  return { mark: `X-${index}`, category: "other", quantity: 1, spans, supports, loads };
}

describe("cross-check against an independent force-method solution (ml-matrix)", () => {
  const random = createRandom(4242);
  const members = Array.from({ length: 60 }, (_, i) => createRandomMember(random, i));

  it.each(members.map((member, i) => [i, member] as const))("random member %i: deflections, slopes and span maxima agree", (_i, member) => {
    const reference = solveByForceMethod(member, "A");
    const solution = solveMember(member);
    const factors = createCaseFactors(solution, { A: 1 });
    const total = solution.nodeXMm[solution.spanCount]!;
    const xs = Array.from({ length: 41 }, (_, k) => (total * k) / 40).concat(solution.nodeXMm);
    const referenceValues = xs.map((x) => reference.deflection(x));
    const scale = Math.max(...referenceValues.map(Math.abs));
    expect(scale).toBeGreaterThan(0);
    xs.forEach((x, k) => {
      expect(Math.abs(deflectionAt(solution, factors, x) - referenceValues[k]!)).toBeLessThanOrEqual(1e-9 * scale);
    });
    const slopeScale = Math.max(...xs.map((x) => Math.abs(reference.slope(x))));
    solution.nodeXMm.forEach((x) => {
      // slopes are continuous at nodes (no hinges): compare just inside the member
      const inside = Math.min(Math.max(x, 1e-9), total - 1e-9);
      expect(Math.abs(rotationAt(solution, factors, inside) - reference.slope(inside))).toBeLessThanOrEqual(1e-8 * slopeScale);
    });
    for (let span = 0; span < solution.spanCount; span++) {
      const extreme = findSpanExtreme(solution, factors, span);
      const x0 = solution.nodeXMm[span]!;
      const length = solution.lengthMm[span]!;
      expect(Math.abs(extreme.deflectionMm - reference.deflection(extreme.atMm))).toBeLessThanOrEqual(1e-9 * scale);
      // no sample of the reference in the span exceeds the reported maximum
      let sampledMax = 0;
      for (let k = 0; k <= 400; k++) sampledMax = Math.max(sampledMax, Math.abs(reference.deflection(x0 + (length * k) / 400)));
      expect(Math.abs(extreme.deflectionMm)).toBeGreaterThanOrEqual(sampledMax - 1e-9 * scale);
    }
  });
});
