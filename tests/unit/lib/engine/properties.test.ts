/**
 * Property tests of linear beam theory on generated members (seeded PRNG, 40 members each):
 * superposition, proportionality to load, mirror symmetry, L^4 / L^3 / L^2 scaling of uniform,
 * point and couple loads, and 1/E, 1/I. These are facts of linear elasticity with small
 * deflections (Euler-Bernoulli beam theory, e.g. Gere and Goodno, Mechanics of Materials, from
 * memory; common practice), independent of any particular table.
 */
import { describe, expect, it } from "vitest";
import type { Load, Member, Support, SupportKind } from "../../../../lib/engine/model";
import { createCaseFactors, deflectionAt, findSpanExtreme, solveMember } from "../../../../lib/engine/solver";
import { createRandom } from "./solver/random";

const random = createRandom(90210);

function createGeneratedMember(loadCase = "A"): Member {
  const spanCount = 1 + Math.floor(random() * 4);
  const spans = Array.from({ length: spanCount }, () => ({ lengthMm: 1500 + random() * 6000, eMpa: 8000 + random() * 200000, iMm4: 2e7 + random() * 4e8 }));
  const kinds: SupportKind[] = ["pinned", "roller", "fixed", "free", "spring"];
  let supports: Support[];
  do {
    supports = Array.from({ length: spanCount + 1 }, () => {
      const kind = kinds[Math.floor(random() * kinds.length)]!;
      return kind === "spring" ? { kind, springNPerMm: 200 + random() * 20000 } : { kind };
    });
  } while (!supports.some((s) => s.kind === "fixed") && supports.filter((s) => s.kind !== "free").length < 2);
  const total = spans.reduce((sum, s) => sum + s.lengthMm, 0);
  const loads: Load[] = [];
  for (let i = 0; i < 4; i++) {
    const a = random() * total;
    const b = a + random() * (total - a);
    const pick = random();
    if (pick < 0.25) loads.push({ kind: "uniform", loadCase, wNPerMm: 1 + random() * 10, startMm: a, endMm: Math.max(b, a + 1) });
    else if (pick < 0.5) loads.push({ kind: "linear", loadCase, startMm: a, endMm: Math.max(b, a + 1), wStartNPerMm: random() * 10, wEndNPerMm: random() * 10 });
    else if (pick < 0.75) loads.push({ kind: "point", loadCase, atMm: a, pN: 1000 + random() * 20000 });
    else loads.push({ kind: "moment", loadCase, atMm: a, mNmm: (random() - 0.5) * 4e7 });
  }
  return { mark: "G", category: "other", quantity: 1, spans, supports, loads };
}

function getShape(member: Member, xs: number[], factorsByCase: Record<string, number> = { A: 1 }): number[] {
  const solution = solveMember(member);
  const factors = createCaseFactors(solution, factorsByCase);
  return xs.map((x) => deflectionAt(solution, factors, x));
}

function getStations(member: Member): number[] {
  const total = member.spans.reduce((sum, s) => sum + s.lengthMm, 0);
  return Array.from({ length: 25 }, (_, k) => (total * k) / 24);
}

function expectSameShape(actual: number[], expected: number[], tol = 1e-10): void {
  const scale = Math.max(...expected.map(Math.abs));
  expect(scale).toBeGreaterThan(0);
  actual.forEach((value, k) => expect(Math.abs(value - expected[k]!)).toBeLessThanOrEqual(tol * scale));
}

const CASES = 40;

describe("linear beam theory properties", () => {
  it("superposition: case A + case B equals A and B loaded together", () => {
    for (let n = 0; n < CASES; n++) {
      const a = createGeneratedMember("A");
      const b = { ...createGeneratedMember("B"), spans: a.spans, supports: a.supports };
      const total = a.spans.reduce((sum, s) => sum + s.lengthMm, 0);
      b.loads = b.loads.map((load) => (load.kind === "point" || load.kind === "moment" ? { ...load, atMm: Math.min(load.atMm, total) } : load)).filter((load) => load.kind === "point" || load.kind === "moment" || (load.startMm ?? 0) < total);
      b.loads = b.loads.map((load) => (load.kind === "uniform" || load.kind === "linear" ? { ...load, startMm: Math.min(load.startMm ?? 0, total - 1), endMm: Math.min(load.endMm ?? total, total) } : load)) as Load[];
      const both: Member = { ...a, loads: [...a.loads, ...b.loads] };
      const xs = getStations(a);
      const separate = getShape(both, xs, { A: 1, B: 1 });
      const shapeA = getShape(a, xs);
      const shapeB = getShape(b, xs, { B: 1 });
      const sum = shapeA.map((v, k) => v + shapeB[k]!);
      expectSameShape(separate, sum);
      // combination factors act linearly too: 1.3 A - 0.4 B
      const combined = getShape(both, xs, { A: 1.3, B: -0.4 });
      const manual = shapeA.map((v, k) => 1.3 * v - 0.4 * shapeB[k]!);
      expectSameShape(combined, manual);
    }
  });

  it("deflection is proportional to load", () => {
    for (let n = 0; n < CASES; n++) {
      const member = createGeneratedMember();
      const factor = 0.1 + random() * 5;
      const scaled: Member = {
        ...member,
        loads: member.loads.map((load): Load => {
          switch (load.kind) {
            case "uniform":
              return { ...load, wNPerMm: load.wNPerMm * factor };
            case "linear":
              return { ...load, wStartNPerMm: load.wStartNPerMm * factor, wEndNPerMm: load.wEndNPerMm * factor };
            case "point":
              return { ...load, pN: load.pN * factor };
            case "moment":
              return { ...load, mNmm: load.mNmm * factor };
          }
        }),
      };
      const xs = getStations(member);
      expectSameShape(getShape(scaled, xs), getShape(member, xs).map((v) => v * factor));
    }
  });

  it("mirror symmetry: reversing the member mirrors the shape (couples change sense)", () => {
    for (let n = 0; n < CASES; n++) {
      const member = createGeneratedMember();
      const total = member.spans.reduce((sum, s) => sum + s.lengthMm, 0);
      const mirrored: Member = {
        ...member,
        spans: [...member.spans].reverse(),
        supports: [...member.supports].reverse(),
        loads: member.loads.map((load): Load => {
          switch (load.kind) {
            case "uniform":
              return { ...load, startMm: total - (load.endMm ?? total), endMm: total - (load.startMm ?? 0) };
            case "linear":
              return { ...load, startMm: total - load.endMm, endMm: total - load.startMm, wStartNPerMm: load.wEndNPerMm, wEndNPerMm: load.wStartNPerMm };
            case "point":
              return { ...load, atMm: total - load.atMm };
            case "moment":
              return { ...load, atMm: total - load.atMm, mNmm: -load.mNmm };
          }
        }),
      };
      const xs = getStations(member);
      expectSameShape(getShape(mirrored, xs.map((x) => total - x)), getShape(member, xs));
      // span maxima mirror as well
      const original = solveMember(member);
      const reflected = solveMember(mirrored);
      const spanCount = member.spans.length;
      for (let span = 0; span < spanCount; span++) {
        const a = findSpanExtreme(original, createCaseFactors(original, { A: 1 }), span);
        const b = findSpanExtreme(reflected, createCaseFactors(reflected, { A: 1 }), spanCount - 1 - span);
        expect(Math.abs(Math.abs(a.deflectionMm) - Math.abs(b.deflectionMm))).toBeLessThanOrEqual(1e-10 * Math.abs(a.deflectionMm) + 1e-300);
      }
    }
  });

  it("geometric scaling by s: uniform load x s^4, point load x s^3, couple x s^2 (springs scaled by 1/s^3)", () => {
    for (let n = 0; n < CASES; n++) {
      const base = createGeneratedMember();
      const s = 0.5 + random() * 2;
      const scaleMember = (member: Member): Member => ({
        ...member,
        spans: member.spans.map((span) => ({ ...span, lengthMm: span.lengthMm * s })),
        // a spring keeps its ratio to the beam's stiffness EI/L^3
        supports: member.supports.map((support) => (support.kind === "spring" ? { ...support, springNPerMm: support.springNPerMm! / s ** 3 } : support)),
        loads: member.loads.map((load): Load => (load.kind === "uniform" ? { ...load, startMm: (load.startMm ?? 0) * s, endMm: load.endMm === undefined ? undefined : load.endMm * s } : load.kind === "linear" ? { ...load, startMm: load.startMm * s, endMm: load.endMm * s } : { ...load, atMm: load.atMm * s })),
      });
      const xs = getStations(base);
      for (const [kind, power] of [["uniform", 4], ["linear", 4], ["point", 3], ["moment", 2]] as const) {
        const only: Member = { ...base, loads: base.loads.filter((load) => load.kind === kind) };
        if (only.loads.length === 0) continue;
        expectSameShape(getShape(scaleMember(only), xs.map((x) => x * s)), getShape(only, xs).map((v) => v * s ** power));
      }
    }
  });

  it("deflection is proportional to 1/E and to 1/I (springs scaled alike)", () => {
    for (let n = 0; n < CASES; n++) {
      const member = createGeneratedMember();
      const f = 0.2 + random() * 4;
      const springs = member.supports.map((support) => (support.kind === "spring" ? { ...support, springNPerMm: support.springNPerMm! * f } : support));
      const xs = getStations(member);
      const expected = getShape(member, xs).map((v) => v / f);
      expectSameShape(getShape({ ...member, supports: springs, spans: member.spans.map((span) => ({ ...span, eMpa: span.eMpa * f })) }, xs), expected);
      expectSameShape(getShape({ ...member, supports: springs, spans: member.spans.map((span) => ({ ...span, iMm4: span.iMm4 * f })) }, xs), expected);
    }
  });
});
