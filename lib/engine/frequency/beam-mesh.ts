import type { Member } from "../model";
import { HALF_BANDWIDTH } from "../solver/banded-ldl";
import type { MassModel } from "./mass-model";

// read once: an imported binding read inside a loop costs a getter call under some loaders
const BAND = HALF_BANDWIDTH;
const ROW = BAND + 1;

/**
 * A member subdivided into beam elements for the eigenvalue: every span into elementsPerSpan
 * equal elements, two DOFs per node (v down, theta = dv/dx), matrices stored as upper bands in
 * the banded-ldl layout (band[i*4 + k] = A[i][i+k]). Units: stiffness N/mm, N, N*mm; mass kg,
 * kg*mm, kg*mm^2; so K x = lambda M x gives lambda in N/(mm kg) = 1000 / s^2.
 * DOFs held by supports have a unit stiffness diagonal and no mass (their eigenvalue is infinite).
 */
export interface BeamMesh {
  dofCount: number;
  elementsPerSpan: number;
  stiffness: Float64Array;
  mass: Float64Array;
  constrained: Uint8Array;
}

// 4-point Gauss-Legendre on [0, 1]: exact for the degree-7 integrand (linear mass x two cubics)
const GAUSS_XI = [0.06943184420297371, 0.33000947820757187, 0.6699905217924281, 0.9305681557970262];
const GAUSS_WEIGHT = [0.17392742256872692, 0.3260725774312731, 0.3260725774312731, 0.17392742256872692];

function addUpper(band: Float64Array, base: number, m: readonly number[]): void {
  // local (0,0),(0,1),(0,2),(0,3),(1,1),(1,2),(1,3),(2,2),(2,3),(3,3) at their band offsets
  band[base] = (band[base] as number) + (m[0] as number);
  band[base + 1] = (band[base + 1] as number) + (m[1] as number);
  band[base + 2] = (band[base + 2] as number) + (m[2] as number);
  band[base + 3] = (band[base + 3] as number) + (m[3] as number);
  band[base + ROW] = (band[base + ROW] as number) + (m[4] as number);
  band[base + ROW + 1] = (band[base + ROW + 1] as number) + (m[5] as number);
  band[base + ROW + 2] = (band[base + ROW + 2] as number) + (m[6] as number);
  band[base + 2 * ROW] = (band[base + 2 * ROW] as number) + (m[7] as number);
  band[base + 2 * ROW + 1] = (band[base + 2 * ROW + 1] as number) + (m[8] as number);
  band[base + 3 * ROW] = (band[base + 3 * ROW] as number) + (m[9] as number);
}

const local = [0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
const shape = [0, 0, 0, 0];

/** Hermite cubic shape functions at xi of an element of length h (v0, theta0, v1, theta1). */
function setShape(xi: number, h: number): void {
  const xi2 = xi * xi;
  const xi3 = xi2 * xi;
  shape[0] = 1 - 3 * xi2 + 2 * xi3;
  shape[1] = h * (xi - 2 * xi2 + xi3);
  shape[2] = 3 * xi2 - 2 * xi3;
  shape[3] = h * (xi3 - xi2);
}

/** local += kg * N N^T (upper entries) at the current shape values. */
function addShapeProduct(kg: number): void {
  const n0 = shape[0] as number;
  const n1 = shape[1] as number;
  const n2 = shape[2] as number;
  const n3 = shape[3] as number;
  local[0] = (local[0] as number) + kg * n0 * n0;
  local[1] = (local[1] as number) + kg * n0 * n1;
  local[2] = (local[2] as number) + kg * n0 * n2;
  local[3] = (local[3] as number) + kg * n0 * n3;
  local[4] = (local[4] as number) + kg * n1 * n1;
  local[5] = (local[5] as number) + kg * n1 * n2;
  local[6] = (local[6] as number) + kg * n1 * n3;
  local[7] = (local[7] as number) + kg * n2 * n2;
  local[8] = (local[8] as number) + kg * n2 * n3;
  local[9] = (local[9] as number) + kg * n3 * n3;
}

/** local += the uniform-mass element matrix m h / 420 [156, 22h, 54, -13h; ...] (upper entries). */
function addUniformMass(kgPerMm: number, h: number): void {
  const c = (kgPerMm * h) / 420;
  local[0] = (local[0] as number) + 156 * c;
  local[1] = (local[1] as number) + 22 * h * c;
  local[2] = (local[2] as number) + 54 * c;
  local[3] = (local[3] as number) - 13 * h * c;
  local[4] = (local[4] as number) + 4 * h * h * c;
  local[5] = (local[5] as number) + 13 * h * c;
  local[6] = (local[6] as number) - 3 * h * h * c;
  local[7] = (local[7] as number) + 156 * c;
  local[8] = (local[8] as number) - 22 * h * c;
  local[9] = (local[9] as number) + 4 * h * h * c;
}

/**
 * Consistent translational mass of one element on [xa, xa + h] (member mm) into `local`: the
 * integral of m(x) N_i N_j over each overlapping mass segment (Przemieniecki, Theory of Matrix
 * Structural Analysis, consistent mass of a beam element, from memory; for uniform m it is the
 * familiar m h / 420 [156, 22h, 54, -13h; ...] matrix).
 */
function setElementMass(model: MassModel, xa: number, h: number, tolMm: number): void {
  for (let i = 0; i < 10; i++) local[i] = 0;
  const xb = xa + h;
  for (const s of model.segments) {
    const lo = s.startMm > xa ? s.startMm : xa;
    const hi = s.endMm < xb ? s.endMm : xb;
    if (!(hi - lo > tolMm)) continue;
    const slope = (s.endKgPerMm - s.startKgPerMm) / (s.endMm - s.startMm);
    if (slope === 0 && lo - xa <= tolMm && xb - hi <= tolMm) {
      addUniformMass(s.startKgPerMm, h);
      continue;
    }
    const width = hi - lo;
    for (let g = 0; g < 4; g++) {
      const x = lo + width * (GAUSS_XI[g] as number);
      setShape((x - xa) / h, h);
      addShapeProduct((GAUSS_WEIGHT[g] as number) * width * (s.startKgPerMm + slope * (x - s.startMm)));
    }
  }
}

/** Each point mass m N_i N_j on the element holding it (a shared node: the element on its right). */
function addPointMasses(member: Member, model: MassModel, elementsPerSpan: number, mass: Float64Array): void {
  const spanCount = member.spans.length;
  for (const p of model.points) {
    let x0 = 0;
    let e = 0;
    while (e < spanCount - 1 && p.atMm >= x0 + member.spans[e]!.lengthMm) {
      x0 += member.spans[e]!.lengthMm;
      e += 1;
    }
    const h = member.spans[e]!.lengthMm / elementsPerSpan;
    const k = Math.min(elementsPerSpan - 1, Math.max(0, Math.floor((p.atMm - x0) / h)));
    const xi = Math.min(1, Math.max(0, (p.atMm - x0 - k * h) / h));
    for (let i = 0; i < 10; i++) local[i] = 0;
    setShape(xi, h);
    addShapeProduct(p.kg);
    addUpper(mass, 2 * (e * elementsPerSpan + k) * ROW, local);
  }
}

const elementStiffness = [0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
const rotary = [0, 0, 0, 0, 0, 0, 0, 0, 0, 0];

// prettier-ignore
function setUpper(m: number[], a: number, b: number, c: number, d: number, e: number, f: number, g: number, h: number, i: number, j: number): void {
  m[0] = a; m[1] = b; m[2] = c; m[3] = d; m[4] = e; m[5] = f; m[6] = g; m[7] = h; m[8] = i; m[9] = j;
}

// two meshes live at once (the coarse mode warm-starts the finer mesh): one scratch per slot
const scratchMeshes: BeamMesh[] = [0, 1].map(() => ({ dofCount: 0, elementsPerSpan: 0, stiffness: new Float64Array(64), mass: new Float64Array(64), constrained: new Uint8Array(16) }));

function getScratchMesh(slot: 0 | 1, dofCount: number): BeamMesh {
  const mesh = scratchMeshes[slot]!;
  if (mesh.constrained.length < dofCount) {
    mesh.stiffness = new Float64Array(2 * dofCount * ROW);
    mesh.mass = new Float64Array(2 * dofCount * ROW);
    mesh.constrained = new Uint8Array(2 * dofCount);
  }
  return mesh;
}

/**
 * Assembles the stiffness and consistent mass bands of the member with elementsPerSpan equal
 * elements per span. Stiffness: Euler-Bernoulli, or Timoshenko with phi = 12 EI / (kGA h^2) when
 * member.includeShearDeformation (the same element as the static solver; Przemieniecki, from
 * memory). Rotary inertia rho I of the member's own section is added, with the Hermite rotary
 * matrix rho I / (30 h) [36, 3h, -36, 3h; ...], only when shear deformation is included and the
 * self-weight is counted (Timoshenko beam theory takes both). Springs add to the v diagonal.
 * The mesh is scratch memory of the given slot, valid until the slot is assembled again.
 */
export function assembleBeamMesh(member: Member, model: MassModel, elementsPerSpan: number, slot: 0 | 1): BeamMesh {
  const spanCount = member.spans.length;
  const nodeCount = spanCount * elementsPerSpan + 1;
  const dofCount = 2 * nodeCount;
  const mesh = getScratchMesh(slot, dofCount);
  mesh.dofCount = dofCount;
  mesh.elementsPerSpan = elementsPerSpan;
  const { stiffness, mass, constrained } = mesh;
  // plain loops: a fill() call per member costs more than clearing a few entries
  for (let i = 0; i < dofCount * ROW; i++) {
    stiffness[i] = 0;
    mass[i] = 0;
  }
  for (let i = 0; i < dofCount; i++) constrained[i] = 0;
  const withShear = member.includeShearDeformation === true;
  const withRotaryInertia = withShear && member.selfWeightCase !== undefined;
  let totalMm = 0;
  for (const span of member.spans) totalMm += span.lengthMm;
  const tolMm = totalMm * 1e-9;
  let xStart = 0;
  let element = 0;
  for (let e = 0; e < spanCount; e++) {
    const span = member.spans[e]!;
    const h = span.lengthMm / elementsPerSpan;
    const ei = span.eMpa * span.iMm4;
    const phi = withShear ? (12 * ei) / (span.gMpa! * span.shearAreaMm2! * h * h) : 0;
    const a = ei / ((1 + phi) * h * h * h);
    const k11 = 12 * a;
    const k12 = 6 * h * a;
    const k22 = (4 + phi) * h * h * a;
    const k24 = (2 - phi) * h * h * a;
    setUpper(elementStiffness, k11, k12, -k11, k12, k22, -k12, k24, k11, -k12, k22);
    const j = withRotaryInertia ? (span.densityKgPerM3! * 1e-9 * span.iMm4) / (30 * h) : 0;
    setUpper(rotary, 36 * j, 3 * h * j, -36 * j, 3 * h * j, 4 * h * h * j, -3 * h * j, -h * h * j, 36 * j, -3 * h * j, 4 * h * h * j);
    for (let k = 0; k < elementsPerSpan; k++) {
      const base = 2 * element * ROW;
      const xa = k === elementsPerSpan - 1 ? xStart + span.lengthMm - h : xStart + k * h;
      addUpper(stiffness, base, elementStiffness);
      setElementMass(model, xa, h, tolMm);
      addUpper(mass, base, local);
      if (withRotaryInertia) addUpper(mass, base, rotary);
      element += 1;
    }
    xStart += span.lengthMm;
  }
  addPointMasses(member, model, elementsPerSpan, mass);
  for (let s = 0; s <= spanCount; s++) {
    const support = member.supports[s]!;
    const dof = 2 * s * elementsPerSpan;
    if (support.kind === "pinned" || support.kind === "roller" || support.kind === "fixed") constrained[dof] = 1;
    if (support.kind === "fixed") constrained[dof + 1] = 1;
    if (support.kind === "spring") stiffness[dof * ROW] = (stiffness[dof * ROW] as number) + support.springNPerMm!;
  }
  for (let i = 0; i < dofCount; i++) {
    if (constrained[i] !== 1) continue;
    for (let k = 0; k <= BAND; k++) {
      if (i + k < dofCount) {
        stiffness[i * ROW + k] = 0;
        mass[i * ROW + k] = 0;
      }
      if (i - k >= 0) {
        stiffness[(i - k) * ROW + k] = 0;
        mass[(i - k) * ROW + k] = 0;
      }
    }
    stiffness[i * ROW] = 1;
  }
  return mesh;
}
