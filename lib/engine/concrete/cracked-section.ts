/**
 * Section properties of a reinforced concrete span for deflection: gross concrete I_g, the
 * cracked transformed I_cr and the cracking moment M_cr (ACI 318-19 24.2.3.5, from memory).
 * Internal units: mm, mm^2, mm^4, MPa, N*mm.
 *
 * The cracked section is the transformed section of elastic theory: concrete in compression
 * above the neutral axis, none in tension, steel transformed with n = E_s / E_c; compression
 * steel displaces concrete, so it counts (n - 1) A's (PCA Notes on ACI 318, Table 8-2 writes the
 * same formulas for rectangular and flanged sections).
 */
import type { ReinforcedConcreteSection } from "../model";
import { getTeeGrossProperties } from "../sections";

/** Which face is in compression: sagging (positive) moment puts the top, and any flange, there. */
export type MomentSign = "sagging" | "hogging";

export interface GrossConcreteProperties {
  areaMm2: number;
  /** Gross I about the centroid, reinforcement ignored (ACI 318-19 24.2.3.5 uses I_g so). */
  iGMm4: number;
  /** Centroid depth from the top face, mm. */
  centroidFromTopMm: number;
}

export interface CrackedSection {
  /** Neutral axis depth from the compression face (kd), mm. */
  neutralAxisMm: number;
  iCrMm4: number;
}

function hasFlange(section: ReinforcedConcreteSection): boolean {
  return section.flangeWidthMm !== undefined && section.flangeThicknessMm !== undefined;
}

/**
 * Gross area, I_g and centroid of a rectangle b_w x h, or of a T with flange b_f x h_f on top and
 * web b_w below it (parallel-axis theorem over the two rectangles; reinforcement ignored).
 */
export function getGrossConcreteProperties(section: ReinforcedConcreteSection): GrossConcreteProperties {
  const { webWidthMm: bw, depthMm: h } = section;
  if (!hasFlange(section)) return { areaMm2: bw * h, iGMm4: (bw * h ** 3) / 12, centroidFromTopMm: h / 2 };
  const tee = getTeeGrossProperties(section.flangeWidthMm!, section.flangeThicknessMm!, bw, h);
  return { areaMm2: tee.areaMm2, iGMm4: tee.iMm4, centroidFromTopMm: tee.centroidFromTopMm };
}

/**
 * Cracking moment M_cr = f_r I_g / y_t, N*mm (ACI 318-19 24.2.3.5 with f_r from 19.2.3.1). y_t is
 * taken to the farther face from the centroid, which gives the lower M_cr of the two moment signs
 * (the conservative choice for a flanged section under hogging, where the code would use the
 * nearer, flange face).
 */
export function getCrackingMomentNmm(section: ReinforcedConcreteSection): number {
  const gross = getGrossConcreteProperties(section);
  const yTMm = Math.max(gross.centroidFromTopMm, section.depthMm - gross.centroidFromTopMm);
  return (section.ruptureMpa * gross.iGMm4) / yTMm;
}

interface CompressionBlock {
  /** Width over the whole compression depth, mm. */
  widthMm: number;
  /** Extra width b_f - b_w over the first overhangDepthMm (a flange), 0 for a rectangle. */
  overhangWidthMm: number;
  overhangDepthMm: number;
}

interface SteelLayer {
  areaMm2: number;
  depthMm: number;
}

function getCompressionBlock(section: ReinforcedConcreteSection, sign: MomentSign): CompressionBlock {
  // Under hogging the flange is in tension and cracked: the web alone resists (conservative).
  if (!hasFlange(section) || sign === "hogging") return { widthMm: section.webWidthMm, overhangWidthMm: 0, overhangDepthMm: 0 };
  return { widthMm: section.webWidthMm, overhangWidthMm: section.flangeWidthMm! - section.webWidthMm, overhangDepthMm: section.flangeThicknessMm! };
}

/**
 * Which steel resists a hogging (negative) moment, depths from the bottom face. With top steel
 * (topSteelMm2): A_s,top at d_top in tension, the bottom tension steel at h - d in compression.
 * Without it, the layout as given: the layout of a member of overhangs only, whose given steel is
 * its top steel (model.ts). A span between supports without top steel never gets here with a
 * cracking hogging moment: hogging-causes.ts and cracked-state.ts refuse it.
 */
export function hasTopSteel(section: ReinforcedConcreteSection): boolean {
  return section.topSteelMm2 !== undefined && section.topEffectiveDepthMm !== undefined;
}

function getSteelLayers(section: ReinforcedConcreteSection, sign: MomentSign): SteelLayer[] {
  if (sign === "hogging" && hasTopSteel(section)) {
    return [
      { areaMm2: section.topSteelMm2!, depthMm: section.topEffectiveDepthMm! },
      { areaMm2: section.tensionSteelMm2, depthMm: section.depthMm - section.effectiveDepthMm },
    ];
  }
  const layers: SteelLayer[] = [{ areaMm2: section.tensionSteelMm2, depthMm: section.effectiveDepthMm }];
  if (section.compressionSteelMm2 !== undefined && section.compressionDepthMm !== undefined) {
    layers.push({ areaMm2: section.compressionSteelMm2, depthMm: section.compressionDepthMm });
  }
  return layers;
}

/** Transformed factor of a steel layer: n - 1 above the neutral axis (in compressed concrete), n below. */
function getLayerFactor(modularRatio: number, layer: SteelLayer, neutralAxisMm: number): number {
  return layer.depthMm < neutralAxisMm ? modularRatio - 1 : modularRatio;
}

/** First moment of the transformed section about a trial neutral axis c: zero at the true one, increasing in c. */
function getFirstMoment(block: CompressionBlock, layers: SteelLayer[], modularRatio: number, c: number): number {
  let moment = (block.widthMm * c * c) / 2;
  const flangeDepth = Math.min(c, block.overhangDepthMm);
  moment += block.overhangWidthMm * flangeDepth * (c - flangeDepth / 2);
  for (const layer of layers) moment += getLayerFactor(modularRatio, layer, c) * layer.areaMm2 * (c - layer.depthMm);
  return moment;
}

/**
 * Neutral axis of the cracked transformed section: the first moment is a quadratic in c between
 * the breakpoints (flange underside, steel layers), so the root is found exactly in the interval
 * where it changes sign: (A2) c^2 + (A1) c + A0 = 0.
 */
function findNeutralAxisMm(block: CompressionBlock, layers: SteelLayer[], modularRatio: number, depthMm: number): number {
  const breakpoints = [0, block.overhangDepthMm, ...layers.map((layer) => layer.depthMm), depthMm].filter((x) => x >= 0 && x <= depthMm).sort((a, b) => a - b);
  let hi = depthMm;
  let lo = 0;
  for (const point of breakpoints) {
    if (getFirstMoment(block, layers, modularRatio, point) >= 0) {
      hi = point;
      break;
    }
    lo = point;
  }
  const mid = (lo + hi) / 2;
  let a2 = block.widthMm / 2;
  let a1 = 0;
  let a0 = 0;
  if (mid < block.overhangDepthMm) a2 += block.overhangWidthMm / 2;
  else {
    a1 += block.overhangWidthMm * block.overhangDepthMm;
    a0 -= (block.overhangWidthMm * block.overhangDepthMm ** 2) / 2;
  }
  for (const layer of layers) {
    const factor = getLayerFactor(modularRatio, layer, mid) * layer.areaMm2;
    a1 += factor;
    a0 -= factor * layer.depthMm;
  }
  // the larger root, in the cancellation-free form 2(-A0) / (A1 + sqrt(A1^2 - 4 A2 A0))
  return (-2 * a0) / (a1 + Math.sqrt(a1 * a1 - 4 * a2 * a0));
}

/**
 * Cracked transformed section for a moment of the given sign: neutral axis kd from the first
 * moment of the transformed section, then
 *   I_cr = b_w kd^3/3 + (b_f - b_w)(kd^3 - (kd - h_f)^3)/3 + n A_s (d - kd)^2 + (n - 1) A's (kd - d')^2
 * (flange term only while kd > h_f; b_f kd^3/3 when kd <= h_f), n = E_s / E_c. A compression layer
 * that falls below the neutral axis is counted as tension steel (n A's). Under hogging a flanged
 * section is taken as its web alone (flange cracked), which is conservative, and the steel is that
 * of getSteelLayers (the top steel when given).
 */
export function getCrackedSection(section: ReinforcedConcreteSection, concreteEMpa: number, sign: MomentSign): CrackedSection {
  const modularRatio = section.steelEMpa / concreteEMpa;
  const block = getCompressionBlock(section, sign);
  const layers = getSteelLayers(section, sign);
  const kd = findNeutralAxisMm(block, layers, modularRatio, section.depthMm);
  const flangeDepth = Math.min(kd, block.overhangDepthMm);
  let iCrMm4 = (block.widthMm * kd ** 3) / 3 + (block.overhangWidthMm * (kd ** 3 - (kd - flangeDepth) ** 3)) / 3;
  for (const layer of layers) iCrMm4 += getLayerFactor(modularRatio, layer, kd) * layer.areaMm2 * (kd - layer.depthMm) ** 2;
  return { neutralAxisMm: kd, iCrMm4 };
}

/**
 * Compression reinforcement ratio rho' = A's / (b d) for ACI 318-19 24.2.4.1.1, b the width of
 * the compression face (b_f for a flanged section: the wider face gives the smaller rho', hence
 * the larger, conservative long-term factor). 0 without compression steel.
 */
export function getCompressionSteelRatio(section: ReinforcedConcreteSection): number {
  if (section.compressionSteelMm2 === undefined) return 0;
  const width = section.flangeWidthMm ?? section.webWidthMm;
  return section.compressionSteelMm2 / (width * section.effectiveDepthMm);
}
