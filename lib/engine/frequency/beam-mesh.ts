import type { Member } from "../model";
import { HALF_BANDWIDTH } from "../solver/banded-ldl";
import type { MassModel } from "./mass-model";

// read once: an imported binding read inside a loop costs a getter call under some loaders
const BAND = HALF_BANDWIDTH;
const ROW = BAND + 1;

/**
 * Where the nodes of a mesh lie: every support, every point mass (so the mode's kink under a point
 * mass falls on a node and the elements converge at their full rate), and equal subdivisions of
 * each span between them. Refining halves every element, so each mesh contains the previous one.
 */
export interface MeshLayout {
  /** Node positions from the member's left end, mm, ascending. */
  nodeXMm: number[];
  /** The span each element lies in. */
  elementSpan: number[];
  /** The node of each support (spans + 1). */
  supportNode: number[];
}

/**
 * A member subdivided into beam elements for the eigenvalue: two DOFs per node (v down,
 * theta = dv/dx), matrices stored as upper bands in the banded-ldl layout
 * (band[i*4 + k] = A[i][i+k]). Units: stiffness N/mm, N, N*mm; mass kg, kg*mm, kg*mm^2; so
 * K x = lambda M x gives lambda in N/(mm kg) = 1000 / s^2. DOFs held by supports have a unit
 * stiffness diagonal and no mass (their eigenvalue is infinite).
 */
export interface BeamMesh {
  dofCount: number;
  stiffness: Float64Array;
  mass: Float64Array;
  constrained: Uint8Array;
}

/**
 * The first layout: elementsPerSpan equal elements per span, with a node at every point mass: the
 * nearest equal-division node moves onto it when within a quarter element, otherwise a node is
 * added. No node comes closer than an eighth of an element to another (a point mass that close
 * stays inside its element), which keeps the stiffness well conditioned.
 */
export function createMeshLayout(member: Member, model: MassModel, elementsPerSpan: number): MeshLayout {
  const nodeXMm: number[] = [0];
  const elementSpan: number[] = [];
  const supportNode: number[] = [0];
  let x0 = 0;
  member.spans.forEach((span, e) => {
    const x1 = x0 + span.lengthMm;
    const h = span.lengthMm / elementsPerSpan;
    const cuts: number[] = [];
    const moved: boolean[] = [];
    for (let k = 1; k < elementsPerSpan; k++) {
      cuts.push(x0 + k * h);
      moved.push(false);
    }
    for (const p of model.points) {
      if (!(p.atMm > x0 && p.atMm < x1)) continue;
      const k = Math.round((p.atMm - x0) / h);
      if (k >= 1 && k < elementsPerSpan && !moved[k - 1] && Math.abs(p.atMm - (cuts[k - 1] as number)) < h / 4) {
        cuts[k - 1] = p.atMm;
        moved[k - 1] = true;
      } else {
        cuts.push(p.atMm);
      }
    }
    cuts.sort((a, b) => a - b);
    const minimumMm = h / 8;
    for (const x of cuts) {
      if (x - (nodeXMm[nodeXMm.length - 1] as number) < minimumMm || x1 - x < minimumMm) continue;
      nodeXMm.push(x);
      elementSpan.push(e);
    }
    nodeXMm.push(x1);
    elementSpan.push(e);
    supportNode.push(nodeXMm.length - 1);
    x0 = x1;
  });
  return { nodeXMm, elementSpan, supportNode };
}

/** The layout with every element halved. */
export function refineMeshLayout(layout: MeshLayout): MeshLayout {
  const nodeXMm: number[] = [layout.nodeXMm[0] as number];
  const elementSpan: number[] = [];
  for (let e = 0; e < layout.elementSpan.length; e++) {
    const a = layout.nodeXMm[e] as number;
    const b = layout.nodeXMm[e + 1] as number;
    nodeXMm.push((a + b) / 2, b);
    elementSpan.push(layout.elementSpan[e] as number, layout.elementSpan[e] as number);
  }
  return { nodeXMm, elementSpan, supportNode: layout.supportNode.map((node) => 2 * node) };
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

/** Each point mass m N_i N_j on the element holding it (on a node: the element on its right). */
function addPointMasses(layout: MeshLayout, model: MassModel, mass: Float64Array): void {
  const last = layout.elementSpan.length - 1;
  for (const p of model.points) {
    let e = 0;
    while (e < last && p.atMm >= (layout.nodeXMm[e + 1] as number)) e += 1;
    const xa = layout.nodeXMm[e] as number;
    const h = (layout.nodeXMm[e + 1] as number) - xa;
    const xi = Math.min(1, Math.max(0, (p.atMm - xa) / h));
    for (let i = 0; i < 10; i++) local[i] = 0;
    setShape(xi, h);
    addShapeProduct(p.kg);
    addUpper(mass, 2 * e * ROW, local);
  }
}

const elementStiffness = [0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
const rotary = [0, 0, 0, 0, 0, 0, 0, 0, 0, 0];

// prettier-ignore
function setUpper(m: number[], a: number, b: number, c: number, d: number, e: number, f: number, g: number, h: number, i: number, j: number): void {
  m[0] = a; m[1] = b; m[2] = c; m[3] = d; m[4] = e; m[5] = f; m[6] = g; m[7] = h; m[8] = i; m[9] = j;
}

// two meshes live at once (the coarse mode warm-starts the finer mesh): one scratch per slot
const scratchMeshes: BeamMesh[] = [0, 1].map(() => ({ dofCount: 0, stiffness: new Float64Array(64), mass: new Float64Array(64), constrained: new Uint8Array(16) }));

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
 * Assembles the stiffness and consistent mass bands of the member on the layout's elements.
 * Stiffness: Euler-Bernoulli, or Timoshenko with phi = 12 EI / (kGA h^2) when
 * member.includeShearDeformation (the same element as the static solver; Przemieniecki, from
 * memory). Rotary inertia rho I of the member's own section is added, with the Hermite rotary
 * matrix rho I / (30 h) [36, 3h, -36, 3h; ...], only when shear deformation is included and the
 * self-weight is counted (Timoshenko beam theory takes both). Springs add to the v diagonal.
 * The mesh is scratch memory of the given slot, valid until the slot is assembled again.
 */
export function assembleBeamMesh(member: Member, model: MassModel, layout: MeshLayout, slot: 0 | 1): BeamMesh {
  const spanCount = member.spans.length;
  const elementCount = layout.elementSpan.length;
  const dofCount = 2 * (elementCount + 1);
  const mesh = getScratchMesh(slot, dofCount);
  mesh.dofCount = dofCount;
  const { stiffness, mass, constrained } = mesh;
  // plain loops: a fill() call per member costs more than clearing a few entries
  for (let i = 0; i < dofCount * ROW; i++) {
    stiffness[i] = 0;
    mass[i] = 0;
  }
  for (let i = 0; i < dofCount; i++) constrained[i] = 0;
  const withShear = member.includeShearDeformation === true;
  const withRotaryInertia = withShear && member.selfWeightCase !== undefined;
  const tolMm = (layout.nodeXMm[elementCount] as number) * 1e-9;
  for (let element = 0; element < elementCount; element++) {
    const span = member.spans[layout.elementSpan[element] as number]!;
    const xa = layout.nodeXMm[element] as number;
    const h = (layout.nodeXMm[element + 1] as number) - xa;
    const ei = span.eMpa * span.iMm4;
    const phi = withShear ? (12 * ei) / (span.gMpa! * span.shearAreaMm2! * h * h) : 0;
    const a = ei / ((1 + phi) * h * h * h);
    const k11 = 12 * a;
    const k12 = 6 * h * a;
    const k22 = (4 + phi) * h * h * a;
    const k24 = (2 - phi) * h * h * a;
    setUpper(elementStiffness, k11, k12, -k11, k12, k22, -k12, k24, k11, -k12, k22);
    const base = 2 * element * ROW;
    addUpper(stiffness, base, elementStiffness);
    setElementMass(model, xa, h, tolMm);
    addUpper(mass, base, local);
    if (withRotaryInertia) {
      const j = (span.densityKgPerM3! * 1e-9 * span.iMm4) / (30 * h);
      setUpper(rotary, 36 * j, 3 * h * j, -36 * j, 3 * h * j, 4 * h * h * j, -3 * h * j, -h * h * j, 36 * j, -3 * h * j, 4 * h * h * j);
      addUpper(mass, base, rotary);
    }
  }
  addPointMasses(layout, model, mass);
  for (let s = 0; s <= spanCount; s++) {
    const support = member.supports[s]!;
    const dof = 2 * (layout.supportNode[s] as number);
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
