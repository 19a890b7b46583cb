/**
 * An independent first-frequency reference for the engine tests (test code only): a fine
 * Euler-Bernoulli beam finite-element model assembled here, with its own mesh (nodes at every
 * support, mass discontinuity and point mass, elements no longer than 1/40 of their span), its own
 * quadrature (5-point Gauss-Legendre per element), the held DOFs removed rather than penalised, and
 * the eigenvalues from the ml-matrix library (Cholesky K = L L^T, then the symmetric eigenvalue
 * decomposition of L^-1 M L^-T, whose largest eigenvalue is 1 / lambda_1). Nothing from the
 * engine's frequency code is used. Element matrices: Przemieniecki, Theory of Matrix Structural
 * Analysis, beam stiffness and consistent mass (from memory).
 */
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import type { Member } from "../../../../lib/engine/model";

const G = 9.80665;
const GX = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
const GW = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];

interface Piece { a: number; b: number; q0: number; q1: number }

/** Mass per length (kg/mm) at x from the member's loads times the factors, plus self-weight. */
function massAt(pieces: Piece[], x: number): number {
  let m = 0;
  for (const p of pieces) if (x >= p.a && x <= p.b) m += p.q0 + ((p.q1 - p.q0) * (x - p.a)) / (p.b - p.a);
  return m;
}

/** First natural frequency (Hz) of an Euler-Bernoulli member (no shear deformation). */
export function getReferenceFrequencyHz(member: Member, massFactors: Record<string, number>, elementsPerSpan = 40): number {
  const total = member.spans.reduce((s, span) => s + span.lengthMm, 0);
  const pieces: Piece[] = [];
  const points: { x: number; kg: number }[] = [];
  for (const load of member.loads) {
    const f = massFactors[load.loadCase] ?? 0;
    if (f === 0) continue;
    if (load.kind === "uniform") pieces.push({ a: load.startMm ?? 0, b: load.endMm ?? total, q0: (f * load.wNPerMm) / G, q1: (f * load.wNPerMm) / G });
    if (load.kind === "linear") pieces.push({ a: load.startMm, b: load.endMm, q0: (f * load.wStartNPerMm) / G, q1: (f * load.wEndNPerMm) / G });
    if (load.kind === "point") points.push({ x: load.atMm, kg: (f * load.pN) / G });
  }
  const supportsX: number[] = [0];
  for (const span of member.spans) supportsX.push(supportsX[supportsX.length - 1]! + span.lengthMm);
  if (member.selfWeightCase !== undefined) {
    member.spans.forEach((span, e) => {
      const q = (span.areaMm2! * span.densityKgPerM3! * 1e-9 * G) / G;
      pieces.push({ a: supportsX[e]!, b: supportsX[e + 1]!, q0: q, q1: q });
    });
  }
  // mesh: per span, cut at every discontinuity, then subdivide
  const nodes: number[] = [0];
  const ei: number[] = [];
  member.spans.forEach((span, e) => {
    const a = supportsX[e]!;
    const b = supportsX[e + 1]!;
    const cuts = new Set<number>([a, b]);
    for (const p of pieces) for (const c of [p.a, p.b]) if (c > a && c < b) cuts.add(c);
    for (const p of points) if (p.x > a && p.x < b) cuts.add(p.x);
    const sorted = [...cuts].sort((u, v) => u - v);
    for (let i = 0; i + 1 < sorted.length; i++) {
      const n = Math.max(1, Math.ceil(((sorted[i + 1]! - sorted[i]!) / span.lengthMm) * elementsPerSpan));
      for (let k = 1; k <= n; k++) {
        nodes.push(k === n ? sorted[i + 1]! : sorted[i]! + ((sorted[i + 1]! - sorted[i]!) * k) / n);
        ei.push(span.eMpa * span.iMm4);
      }
    }
  });
  const size = 2 * nodes.length;
  const K = Matrix.zeros(size, size);
  const M = Matrix.zeros(size, size);
  for (let el = 0; el + 1 < nodes.length; el++) {
    const x0 = nodes[el]!;
    const h = nodes[el + 1]! - x0;
    const c = ei[el]! / h ** 3;
    const k = [
      [12, 6 * h, -12, 6 * h],
      [6 * h, 4 * h * h, -6 * h, 2 * h * h],
      [-12, -6 * h, 12, -6 * h],
      [6 * h, 2 * h * h, -6 * h, 4 * h * h],
    ];
    const dofs = [2 * el, 2 * el + 1, 2 * el + 2, 2 * el + 3];
    for (let g = 0; g < 5; g++) {
      const s = (1 + GX[g]!) / 2;
      const x = x0 + s * h;
      const n = [1 - 3 * s * s + 2 * s ** 3, h * (s - 2 * s * s + s ** 3), 3 * s * s - 2 * s ** 3, h * (s ** 3 - s * s)];
      const w = (GW[g]! / 2) * h * massAt(pieces, x);
      for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) M.set(dofs[i]!, dofs[j]!, M.get(dofs[i]!, dofs[j]!) + w * n[i]! * n[j]!);
    }
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) K.set(dofs[i]!, dofs[j]!, K.get(dofs[i]!, dofs[j]!) + c * k[i]![j]!);
  }
  for (const p of points) {
    const node = nodes.findIndex((x) => Math.abs(x - p.x) < 1e-9 * total);
    M.set(2 * node, 2 * node, M.get(2 * node, 2 * node) + p.kg);
  }
  const held = new Set<number>();
  member.supports.forEach((support, j) => {
    const node = nodes.findIndex((x) => Math.abs(x - supportsX[j]!) < 1e-9 * total);
    if (support.kind === "pinned" || support.kind === "roller" || support.kind === "fixed") held.add(2 * node);
    if (support.kind === "fixed") held.add(2 * node + 1);
    if (support.kind === "spring") K.set(2 * node, 2 * node, K.get(2 * node, 2 * node) + support.springNPerMm!);
  });
  const free = [...Array(size).keys()].filter((i) => !held.has(i));
  const k = K.selection(free, free);
  const m = M.selection(free, free);
  const lower = new CholeskyDecomposition(k).lowerTriangularMatrix;
  const lowerInverse = inverse(lower);
  const a = lowerInverse.mmul(m).mmul(lowerInverse.transpose());
  const symmetric = a.add(a.transpose()).div(2);
  const largest = Math.max(...new EigenvalueDecomposition(symmetric, { assumeSymmetric: true }).realEigenvalues);
  // lambda in N/(mm kg): omega^2 = 1000 lambda (1/s^2)
  return Math.sqrt(1000 / largest) / (2 * Math.PI);
}
