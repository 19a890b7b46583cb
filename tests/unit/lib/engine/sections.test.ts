import { describe, expect, it } from "vitest";

import type { CatalogueSection } from "@/lib/engine/model";
import { createCatalogueIndex, findSectionProblems, getSectionProperties } from "@/lib/engine/sections";

const IN_MM = 25.4; // NIST SP 811 Appendix B.8, exact

describe("shape formulas (any mechanics-of-materials text, e.g. Gere and Goodno, Mechanics of Materials, appendix of plane-area properties, from memory)", () => {
  it("rectangle 47 x 200: A = bh = 9,400 mm2, I = bh^3/12 = 31,333,333 mm4, shear area 5/6 A", () => {
    const p = getSectionProperties({ shape: "rectangle", bMm: 47, hMm: 200 });
    expect(p.areaMm2).toBe(9400);
    expect(p.iMm4).toBeCloseTo((47 * 200 ** 3) / 12, 6);
    expect(p.iMm4).toBeCloseTo(31333333.33, 1);
    expect(p.shearAreaMm2).toBeCloseTo((5 / 6) * 9400, 9);
  });
  it("hollow rectangle 100 x 200 with a 90 x 190 void: I = (BH^3 - bh^3)/12", () => {
    const p = getSectionProperties({ shape: "hollow_rectangle", outerBMm: 100, outerHMm: 200, innerBMm: 90, innerHMm: 190 });
    expect(p.iMm4).toBeCloseTo((100 * 200 ** 3 - 90 * 190 ** 3) / 12, 6);
    expect(p.areaMm2).toBe(100 * 200 - 90 * 190);
  });
  it("hollow rectangle shear area A H / (B + H) = 2,900 x 200 / 300 = 1,933.3 mm2 (EN 1993-1-1:2005 6.2.6(3)(f), from memory)", () => {
    const p = getSectionProperties({ shape: "hollow_rectangle", outerBMm: 100, outerHMm: 200, innerBMm: 90, innerHMm: 190 });
    expect(p.shearAreaMm2).toBeCloseTo((2900 * 200) / 300, 9);
    // the two webs over the full depth, (B - b) H = 2,000 mm2, would overstate the shear stiffness
    expect(p.shearAreaMm2).toBeLessThan(2000);
  });
  it("round d = 100: I = pi d^4 / 64 = 4,908,739 mm4", () => {
    const p = getSectionProperties({ shape: "round", dMm: 100 });
    expect(p.iMm4).toBeCloseTo(4908738.5, 0);
  });
  it("tube D = 100, t = 5: I = pi (D^4 - d^4)/64 with d = 90", () => {
    const p = getSectionProperties({ shape: "tube", outerDMm: 100, wallMm: 5 });
    expect(p.iMm4).toBeCloseTo((Math.PI * (100 ** 4 - 90 ** 4)) / 64, 6);
    expect(p.areaMm2).toBeCloseTo((Math.PI * (100 ** 2 - 90 ** 2)) / 4, 9);
  });
  it("i_plate: I = [bf d^3 - (bf - tw)(d - 2tf)^3]/12", () => {
    const p = getSectionProperties({ shape: "i_plate", bfMm: 150, tfMm: 10, dMm: 300, twMm: 7 });
    expect(p.iMm4).toBeCloseTo((150 * 300 ** 3 - 143 * 280 ** 3) / 12, 6);
    expect(p.areaMm2).toBe(2 * 150 * 10 + 280 * 7);
  });
  it("i_plate shear area is the web between the flanges, (d - 2tf) tw = 280 x 7 = 1,960 mm2 (EN 1993-1-1:2005 6.2.6(3)(d), eta = 1.0, from memory)", () => {
    const p = getSectionProperties({ shape: "i_plate", bfMm: 150, tfMm: 10, dMm: 300, twMm: 7 });
    expect(p.shearAreaMm2).toBe(1960);
  });
});

describe("against published rolled-shape tables (fillets ignored, so within a few percent, not exactly)", () => {
  it("W12x26: d 12.2 in, bf 6.49, tf 0.380, tw 0.230 gives Ix within 3% of 204 in^4 and A within 3% of 7.65 in^2 (AISC Manual Table 1-1, from memory)", () => {
    const p = getSectionProperties({ shape: "i_plate", bfMm: 6.49 * IN_MM, tfMm: 0.38 * IN_MM, dMm: 12.2 * IN_MM, twMm: 0.23 * IN_MM });
    const ixIn4 = p.iMm4 / IN_MM ** 4;
    const areaIn2 = (p.areaMm2 ?? 0) / IN_MM ** 2;
    expect(Math.abs(ixIn4 - 204) / 204).toBeLessThan(0.03);
    expect(Math.abs(areaIn2 - 7.65) / 7.65).toBeLessThan(0.03);
    // Ignoring the fillets can only lose material.
    expect(ixIn4).toBeLessThan(204);
  });
  it("IPE 300: h 300, b 150, tw 7.1, tf 10.7 gives Iy within 5% of 8,356 cm^4 (r = 15 mm fillets ignored; Euronorm 19-57 tables, from memory)", () => {
    const p = getSectionProperties({ shape: "i_plate", bfMm: 150, tfMm: 10.7, dMm: 300, twMm: 7.1 });
    expect(Math.abs(p.iMm4 / 1e4 - 8356) / 8356).toBeLessThan(0.05);
  });
});

describe("geometry problems", () => {
  it("flags a tube wall thicker than the radius, naming the field t", () => {
    expect(findSectionProblems({ shape: "tube", outerDMm: 100, wallMm: 50 })).toEqual([
      { field: "t", message: "wall thickness must be less than half the outer diameter D" },
    ]);
  });
  it("flags an I with flanges deeper than the section", () => {
    expect(findSectionProblems({ shape: "i_plate", bfMm: 100, tfMm: 60, dMm: 100, twMm: 5 }).map((p) => p.field)).toEqual(["tf"]);
  });
  it("flags a hollow rectangle whose void is not inside", () => {
    expect(findSectionProblems({ shape: "hollow_rectangle", outerBMm: 100, outerHMm: 100, innerBMm: 100, innerHMm: 80 }).map((p) => p.field)).toEqual(["b"]);
  });
  it("accepts a valid rectangle", () => {
    expect(findSectionProblems({ shape: "rectangle", bMm: 10, hMm: 10 })).toEqual([]);
  });
});

describe("catalogue lookup", () => {
  // Invented test rows, not catalogue data: only the names matter to the lookup.
  const catalogue: CatalogueSection[] = [
    { name: "TEST-C12x26", iMm4: 84.9e6, areaMm2: 4935, massKgPerM: 38.7 },
    { name: "TEST-C12x30", iMm4: 99.9e6, areaMm2: 5710, massKgPerM: 44.6 },
  ];
  it("matches ignoring case and spaces", () => {
    const find = createCatalogueIndex(catalogue);
    const found = find("test-c12 X 26");
    expect(found.ok && found.section.name).toBe("TEST-C12x26");
  });
  it("reports an unknown name", () => {
    const found = createCatalogueIndex(catalogue)("W99x1");
    expect(found).toEqual({ ok: false, message: 'unknown catalogue section "W99x1"' });
  });
  it("says when no catalogue was given", () => {
    const found = createCatalogueIndex([])("TEST-C12x26");
    expect(found.ok).toBe(false);
    if (!found.ok) expect(found.message).toContain("no catalogue was given");
  });
});
