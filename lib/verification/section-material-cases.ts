/**
 * Input rules checked against their published source: the shear areas used for shear
 * deformation and the mean densities of the EN 338 strength classes. Each engine value is read
 * from the library the schedules use (lib/engine/sections.ts, lib/engine/materials.ts); each
 * reference value is the published formula or table value written out, recalled from memory of
 * the named publication.
 */
import { findMaterial } from "@/lib/engine/materials";
import { getSectionProperties, type SectionShape } from "@/lib/engine/sections";

import type { ClosedFormCase } from "./closed-form-cases";

function getShearAreaMm2(section: SectionShape): number {
  return getSectionProperties(section).shearAreaMm2 ?? Number.NaN;
}

function getDensityKgPerM3(id: string): number {
  const found = findMaterial(id);
  return found.ok ? (found.material.densityKgPerM3 ?? Number.NaN) : Number.NaN;
}

// Invented plate girder: bf 150, tf 10, d 300, tw 7 mm.
const PLATE = { bfMm: 150, tfMm: 10, dMm: 300, twMm: 7 };
// A 200 x 100 x 6.3 mm hollow rectangle (H x B x t), corner radii ignored.
const RHS = { outerBMm: 100, outerHMm: 200, innerBMm: 100 - 2 * 6.3, innerHMm: 200 - 2 * 6.3 };
const RHS_AREA_MM2 = RHS.outerBMm * RHS.outerHMm - RHS.innerBMm * RHS.innerHMm;

// EN 338:2016 Table 1, mean density rho_mean, kg/m^3 (from memory; C27 changed from 450 in EN 338:2009).
const EN338_MEAN_DENSITIES: [id: string, label: string, densityKgPerM3: number][] = [
  ["timber-c16", "C16", 370],
  ["timber-c18", "C18", 380],
  ["timber-c22", "C22", 410],
  ["timber-c24", "C24", 420],
  ["timber-c27", "C27", 430],
  ["timber-c30", "C30", 460],
];

export const sectionMaterialCases: ClosedFormCase[] = [
  {
    id: "shear-area-i-plate",
    title: "Welded I from plates, bf 150, tf 10, d 300, tw 7 mm",
    quantity: "shear area for shear deformation",
    formula: "Av = (d - 2tf) tw (eta = 1.0)",
    source: "EN 1993-1-1:2005 6.2.6(3)(d), welded I sections, load parallel to the web (from memory)",
    expected: (PLATE.dMm - 2 * PLATE.tfMm) * PLATE.twMm,
    unit: "mm^2",
    compute: () => getShearAreaMm2({ shape: "i_plate", ...PLATE }),
  },
  {
    id: "shear-area-hollow-rectangle",
    title: "Hollow rectangle 200 x 100 x 6.3 mm (H x B x t)",
    quantity: "shear area for shear deformation",
    formula: "Av = A H / (B + H)",
    source: "EN 1993-1-1:2005 6.2.6(3)(f), rectangular hollow sections of uniform thickness, load parallel to the depth (from memory)",
    expected: (RHS_AREA_MM2 * RHS.outerHMm) / (RHS.outerBMm + RHS.outerHMm),
    unit: "mm^2",
    compute: () => getShearAreaMm2({ shape: "hollow_rectangle", ...RHS }),
  },
  ...EN338_MEAN_DENSITIES.map(
    ([id, label, densityKgPerM3]): ClosedFormCase => ({
      id: `density-${id}`,
      title: `Softwood ${label}`,
      quantity: "mean density (self-weight and frequency mass)",
      formula: "rho_mean",
      source: "EN 338:2016 Table 1 (from memory)",
      expected: densityKgPerM3,
      unit: "kg/m^3",
      compute: () => getDensityKgPerM3(id),
    }),
  ),
];
