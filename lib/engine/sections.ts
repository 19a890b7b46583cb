/**
 * Section properties from shape dimensions (mm in, mm^2 and mm^4 out), and catalogue lookup.
 *
 * Formulas (Sagline ENGINEERING.md "Section properties"; any mechanics-of-materials text):
 * rectangle A = bh, I = bh^3/12; hollow rectangle I = (BH^3 - bh^3)/12; round I = pi d^4/64;
 * tube I = pi (D^4 - d^4)/64; doubly symmetric I from plates, fillets ignored,
 * I = [bf d^3 - (bf - tw)(d - 2tf)^3]/12. Bending is about the axis parallel to b (h, H, d vertical).
 *
 * Shear areas for shear deformation (load parallel to the depth), the smaller of the published
 * choices since a smaller shear area gives the larger, conservative deflection:
 * - i_plate (welded I from plates): the web between the flanges, Av = hw tw with hw = d - 2tf,
 *   EN 1993-1-1:2005 6.2.6(3)(d) with eta = 1.0 (from memory; EN 1993-1-5 5.1 recommends 1.2,
 *   which would give a larger area and a smaller, unconservative shear deflection).
 * - hollow_rectangle: Av = A H / (B + H), EN 1993-1-1:2005 6.2.6(3)(f), rectangular hollow
 *   sections of uniform thickness, load parallel to the depth (from memory).
 * - rectangle k = 5/6 (Timoshenko), round about 0.9 and tube 0.5 (common practice; the tube's
 *   0.5 A is below EN 1993-1-1 6.2.6(3)(g)'s 2A/pi, so it errs on the conservative side).
 */
import type { CatalogueSection } from "./model";

export type SectionShape =
  | { shape: "rectangle"; bMm: number; hMm: number }
  /** Outer B x H with a concentric inner b x h void (corner radii ignored). */
  | { shape: "hollow_rectangle"; outerBMm: number; outerHMm: number; innerBMm: number; innerHMm: number }
  | { shape: "round"; dMm: number }
  | { shape: "tube"; outerDMm: number; wallMm: number }
  | { shape: "i_plate"; bfMm: number; tfMm: number; dMm: number; twMm: number }
  | { shape: "explicit"; iMm4: number; areaMm2: number | null; shearAreaMm2: number | null }
  /** Flanged (T) concrete outline: flange bf x hf on top of a web bw, overall depth h. */
  | { shape: "tee"; bfMm: number; hfMm: number; bwMm: number; hMm: number };

export interface SectionProperties {
  iMm4: number;
  /** null when an explicit section gives no area. */
  areaMm2: number | null;
  /** Effective shear area k*A (or web area), null when unknown. */
  shearAreaMm2: number | null;
}

/** A geometric problem, naming the public-format field (e.g. "t", "tw"). */
export interface SectionProblem {
  field: string;
  message: string;
}

/** Shear coefficient of a solid rectangle, Timoshenko beam theory (ENGINEERING.md: 5/6). */
export const RECTANGLE_SHEAR_COEFFICIENT = 5 / 6;
/** Solid circle, about 0.9 (common practice; Timoshenko's 6(1+nu)/(7+6nu) gives 0.89 at nu = 0.3). */
export const ROUND_SHEAR_COEFFICIENT = 0.9;
/** Thin-walled circular tube: 0.5 (common practice). */
export const TUBE_SHEAR_COEFFICIENT = 0.5;

/**
 * Returns the geometric problems of a shape (dimensions are already checked positive by intake).
 * An empty list means getSectionProperties gives a positive, finite I.
 */
export function findSectionProblems(section: SectionShape): SectionProblem[] {
  const problems: SectionProblem[] = [];
  switch (section.shape) {
    case "hollow_rectangle":
      if (section.innerBMm >= section.outerBMm) problems.push({ field: "b", message: "inner width must be less than the outer width B" });
      if (section.innerHMm >= section.outerHMm) problems.push({ field: "h", message: "inner height must be less than the outer height H" });
      break;
    case "tube":
      if (2 * section.wallMm >= section.outerDMm) problems.push({ field: "t", message: "wall thickness must be less than half the outer diameter D" });
      break;
    case "i_plate":
      if (2 * section.tfMm >= section.dMm) problems.push({ field: "tf", message: "two flanges must be thinner than the depth d" });
      if (section.twMm > section.bfMm) problems.push({ field: "tw", message: "web thickness must not exceed the flange width bf" });
      break;
    case "explicit":
      if (section.shearAreaMm2 !== null && section.areaMm2 !== null && section.shearAreaMm2 > section.areaMm2) {
        problems.push({ field: "shearArea", message: "shear area must not exceed the area A" });
      }
      break;
    case "tee":
      if (section.hfMm >= section.hMm) problems.push({ field: "hf", message: "the flange thickness hf must be less than the overall depth h" });
      if (section.bwMm > section.bfMm) problems.push({ field: "bw", message: "the web width bw must not exceed the flange width bf" });
      break;
    default:
      break;
  }
  return problems;
}

/** A, I and shear area of a shape, mm units. Call findSectionProblems first. */
export function getSectionProperties(section: SectionShape): SectionProperties {
  switch (section.shape) {
    case "rectangle": {
      const areaMm2 = section.bMm * section.hMm;
      return { areaMm2, iMm4: (section.bMm * section.hMm ** 3) / 12, shearAreaMm2: RECTANGLE_SHEAR_COEFFICIENT * areaMm2 };
    }
    case "hollow_rectangle": {
      const { outerBMm: bo, outerHMm: ho, innerBMm: bi, innerHMm: hi } = section;
      const areaMm2 = bo * ho - bi * hi;
      // EN 1993-1-1:2005 6.2.6(3)(f): Av = A h / (b + h), load parallel to the depth (from memory).
      return { areaMm2, iMm4: (bo * ho ** 3 - bi * hi ** 3) / 12, shearAreaMm2: (areaMm2 * ho) / (bo + ho) };
    }
    case "round": {
      const areaMm2 = (Math.PI * section.dMm ** 2) / 4;
      return { areaMm2, iMm4: (Math.PI * section.dMm ** 4) / 64, shearAreaMm2: ROUND_SHEAR_COEFFICIENT * areaMm2 };
    }
    case "tube": {
      const outer = section.outerDMm;
      const inner = outer - 2 * section.wallMm;
      const areaMm2 = (Math.PI * (outer ** 2 - inner ** 2)) / 4;
      return { areaMm2, iMm4: (Math.PI * (outer ** 4 - inner ** 4)) / 64, shearAreaMm2: TUBE_SHEAR_COEFFICIENT * areaMm2 };
    }
    case "i_plate": {
      const { bfMm, tfMm, dMm, twMm } = section;
      const webClearMm = dMm - 2 * tfMm;
      return {
        areaMm2: 2 * bfMm * tfMm + webClearMm * twMm,
        iMm4: (bfMm * dMm ** 3 - (bfMm - twMm) * webClearMm ** 3) / 12,
        // EN 1993-1-1:2005 6.2.6(3)(d), eta = 1.0: the web between the flanges, hw tw (from memory).
        // AISC 360-16 G2.1's Aw = d tw is a strength area and overstates the shear stiffness.
        shearAreaMm2: webClearMm * twMm,
      };
    }
    case "explicit":
      return { iMm4: section.iMm4, areaMm2: section.areaMm2, shearAreaMm2: section.shearAreaMm2 };
    case "tee": {
      const gross = getTeeGrossProperties(section.bfMm, section.hfMm, section.bwMm, section.hMm);
      // the web carries the shear: 5/6 of bw h (common practice)
      return { areaMm2: gross.areaMm2, iMm4: gross.iMm4, shearAreaMm2: RECTANGLE_SHEAR_COEFFICIENT * section.bwMm * section.hMm };
    }
  }
}

/**
 * Area and I about the centroid of a T (flange bf x hf on a web bw, overall depth h), by the
 * parallel-axis theorem over the flange and the web below it (any mechanics-of-materials text).
 */
export function getTeeGrossProperties(bfMm: number, hfMm: number, bwMm: number, hMm: number): { areaMm2: number; iMm4: number; centroidFromTopMm: number } {
  const flangeArea = bfMm * hfMm;
  const webDepth = hMm - hfMm;
  const webArea = bwMm * webDepth;
  const areaMm2 = flangeArea + webArea;
  const centroid = (flangeArea * (hfMm / 2) + webArea * (hfMm + webDepth / 2)) / areaMm2;
  const iMm4 = (bfMm * hfMm ** 3) / 12 + flangeArea * (centroid - hfMm / 2) ** 2 + (bwMm * webDepth ** 3) / 12 + webArea * (hfMm + webDepth / 2 - centroid) ** 2;
  return { areaMm2, iMm4, centroidFromTopMm: centroid };
}

/** The key catalogue names are matched and kept unique on: case and spaces ignored ("W12x26" = "w12 X 26"). */
export function normaliseSectionName(name: string): string {
  return name.trim().toLowerCase().replace(/\s+/g, "");
}

const CATALOGUE_LOOKUP_CACHE_LIMIT = 10_000;

export type FindCatalogueResult = { ok: true; section: CatalogueSection } | { ok: false; message: string };

/**
 * Returns a lookup of catalogue sections by name, ignoring case and spaces ("W12x26" = "w12 X 26"),
 * so a schedule of many members resolves in one pass over the catalogue.
 */
export function createCatalogueIndex(catalogue: readonly CatalogueSection[]): (name: string) => FindCatalogueResult {
  const byName = new Map<string, CatalogueSection[]>();
  for (const section of catalogue) {
    const key = normaliseSectionName(section.name);
    byName.set(key, [...(byName.get(key) ?? []), section]);
  }
  const find = (name: string): FindCatalogueResult => {
    const matches = byName.get(normaliseSectionName(name)) ?? [];
    if (matches.length === 1 && matches[0]) return { ok: true, section: matches[0] };
    if (matches.length > 1) return { ok: false, message: `section "${name}" matches ${matches.length} catalogue entries` };
    if (catalogue.length === 0) return { ok: false, message: `section "${name}" is a catalogue name, but no catalogue was given` };
    return { ok: false, message: `unknown catalogue section "${name}"` };
  };
  // Members repeat the same few names, spelled the same way: remember the answer per spelling.
  const foundByName = new Map<string, FindCatalogueResult>();
  return (name) => {
    let found = foundByName.get(name);
    if (!found) {
      found = find(name);
      if (foundByName.size < CATALOGUE_LOOKUP_CACHE_LIMIT) foundByName.set(name, found);
    }
    return found;
  };
}
