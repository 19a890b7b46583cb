import { describe, expect, it } from "vitest";

import { createConcrete, findMaterial, getCreepFactor, getCreepMethodsForFamily, type Material } from "@/lib/engine/materials";

function getMaterial(id: string): Material {
  const found = findMaterial(id);
  if (!found.ok) throw new Error(found.message);
  return found.material;
}

// 1 ksi = 6.894 757 MPa (NIST SP 811 Appendix B.8, from memory).
const MPA_PER_KSI = 6.894757;

describe("steel", () => {
  it("EN 1993-1-1:2005 3.2.6: E 210,000 MPa, G 81,000 MPa (from memory)", () => {
    const steel = getMaterial("steel-s355");
    expect(steel.eMpa).toBe(210000);
    expect(steel.gMpa).toBe(81000);
    expect(steel.source).toContain("EN 1993-1-1:2005 3.2.6");
  });
  it("EN 1991-1-1:2002 Table A.4: steel 77.0 to 78.5 kN/m3, so 7,850 kg/m3 (77.0 kN/m3 at g = 9.81) is inside the range (from memory)", () => {
    const steel = getMaterial("steel-s355");
    expect(steel.densityKgPerM3).toBe(7850);
    const unitWeightKnPerM3 = ((steel.densityKgPerM3 ?? 0) * 9.81) / 1000;
    expect(unitWeightKnPerM3).toBeGreaterThanOrEqual(77.0);
    expect(unitWeightKnPerM3).toBeLessThanOrEqual(78.5);
    expect(steel.source).toContain("EN 1991-1-1:2002 Table A.4");
  });
  it("AISC 360-16 / Steel Construction Manual: E 29,000 ksi, G 11,200 ksi (from memory)", () => {
    const steel = getMaterial("steel-aisc");
    expect(steel.eMpa).toBeCloseTo(29000 * MPA_PER_KSI, 0);
    expect(steel.gMpa).toBeCloseTo(11200 * MPA_PER_KSI, 0);
    expect(steel.source).toContain("AISC");
  });
});

describe("aluminium", () => {
  it("Aluminum Design Manual 2020 Table A.3.1: E 10,100 ksi, about 69,600 MPa (from memory)", () => {
    const alu = getMaterial("aluminum-adm");
    expect(alu.eMpa).toBeCloseTo(10100 * MPA_PER_KSI, 0);
    expect(Math.abs(alu.eMpa - 69600) / 69600).toBeLessThan(0.001);
  });
  it("EN 1999-1-1 3.2.5: E 70,000 MPa (from memory)", () => {
    expect(getMaterial("aluminium-en1999").eMpa).toBe(70000);
  });
});

describe("concrete, ACI 318-19 19.2.2.1", () => {
  it("Ec = 4,700 sqrt(f'c) MPa: f'c 30 MPa gives 25,743 MPa", () => {
    expect(getMaterial("concrete-fc30").eMpa).toBeCloseTo(4700 * Math.sqrt(30), 6);
    expect(getMaterial("concrete-fc30").eMpa).toBeCloseTo(25743, 0);
  });
  it("agrees within 1% with the inch-pound form 57,000 sqrt(f'c psi) psi (ACI 318-19 19.2.2.1, from memory)", () => {
    const fcPsi = 30 / (MPA_PER_KSI / 1000);
    const ecMpa = (57000 * Math.sqrt(fcPsi) * MPA_PER_KSI) / 1000;
    expect(Math.abs(createConcrete(30).eMpa - ecMpa) / ecMpa).toBeLessThan(0.01);
  });
  it("rejects f'c below 17 MPa (ACI 318-19 Table 19.2.1.1 minimum, from memory)", () => {
    const found = findMaterial("concrete-fc10");
    expect(found.ok).toBe(false);
    if (!found.ok) expect(found.message).toContain("between 17 and 120 MPa");
  });
});

describe("timber, EN 338:2016 Table 1 and EN 14080:2013 Table 5 (from memory)", () => {
  it.each([
    ["timber-c16", 8000, 500, 370],
    ["timber-c18", 9000, 560, 380],
    ["timber-c22", 10000, 630, 410],
    ["timber-c24", 11000, 690, 420],
    // EN 338:2016 gives C27 430 kg/m3; 450 was EN 338:2009's value (both from memory)
    ["timber-c27", 11500, 720, 430],
    ["timber-c30", 12000, 750, 460],
    ["glulam-gl24h", 11500, 650, 420],
    ["glulam-gl28h", 12600, 650, 460],
    ["glulam-gl32h", 14200, 650, 490],
  ] as const)("%s: E0,mean %d MPa, Gmean %d MPa, mean density %d kg/m3", (id, e, g, rho) => {
    const timber = getMaterial(id);
    expect(timber.family).toBe("timber");
    expect([timber.eMpa, timber.gMpa, timber.densityKgPerM3]).toEqual([e, g, rho]);
    expect(timber.source).toMatch(/EN 338|EN 14080/);
  });
  it("finds C24 whatever the case of its id", () => {
    expect(getMaterial("TIMBER-C24").eMpa).toBe(11000);
  });
  it("EN 338:2016 Table 1: Gmean = E0,mean / 16, rounded to 10 MPa, for every softwood class (from memory)", () => {
    for (const id of ["timber-c16", "timber-c18", "timber-c22", "timber-c24", "timber-c27", "timber-c30"]) {
      const timber = getMaterial(id);
      expect(Math.abs((timber.gMpa ?? 0) - timber.eMpa / 16), id).toBeLessThanOrEqual(5);
    }
  });
});

describe("creep factors", () => {
  it.each([
    [1, 0.6],
    [2, 0.8],
    [3, 2.0],
  ] as const)("EN 1995-1-1 Table 3.2: service class %d k_def = %d (from memory)", (serviceClass, kdef) => {
    expect(getCreepFactor({ method: "en1995", serviceClass })).toBe(kdef);
  });
  it("NDS 3.5.2: K_cr 1.5 (seasoned, dry) gives an added factor K_cr - 1 = 0.5 (from memory)", () => {
    expect(getCreepFactor({ method: "nds", condition: "seasoned_dry" })).toBeCloseTo(0.5, 12);
    expect(getCreepFactor({ method: "nds", condition: "unseasoned_or_wet" })).toBeCloseTo(1.0, 12);
  });
  it("ACI 318-19 24.2.4.1: lambda = xi / (1 + 50 rho'), xi 2.0 at 5 years (from memory)", () => {
    expect(getCreepFactor({ method: "aci", durationMonths: 60, compressionRatio: 0 })).toBe(2);
    expect(getCreepFactor({ method: "aci", durationMonths: 60, compressionRatio: 0.01 })).toBeCloseTo(2 / 1.5, 12);
    expect(getCreepFactor({ method: "aci", durationMonths: 12, compressionRatio: 0 })).toBe(1.4);
  });
  it("offers no timber or concrete creep method for steel", () => {
    expect(getCreepMethodsForFamily("steel")).toEqual(["factor"]);
    expect(getCreepMethodsForFamily("timber")).toContain("en1995");
  });
});

it("rejects an unknown material id and lists the library", () => {
  const found = findMaterial("steel-s999");
  expect(found.ok).toBe(false);
  if (!found.ok) expect(found.message).toMatch(/unknown material "steel-s999"; library ids: .*steel-s355/);
});
