import { describe, expect, it } from "vitest";

import {
  SYSTEM_DEFAULT_UNITS,
  QUANTITY_KINDS,
  convertFromInternal,
  convertToInternal,
  findUnit,
  listAcceptedUnits,
  normaliseUnitText,
  type QuantityKind,
} from "@/lib/engine/units";

function toInternal(value: number, kind: QuantityKind, unit: string): number {
  const result = convertToInternal(value, kind, unit);
  if (!result.ok) throw new Error(result.message);
  return result.value;
}

/** NIST factors are printed to 7 significant figures: compare to that precision. */
function expectRelative(actual: number, expected: number, tolerance = 6e-7): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(tolerance);
}

describe("exact defining factors", () => {
  it("1 ft = 0.3048 m exactly (NIST SP 811 Appendix B.8, from memory)", () => {
    expect(toInternal(1, "length", "ft")).toBe(304.8);
  });
  it("1 in = 25.4 mm exactly (NIST SP 811 Appendix B.8, from memory)", () => {
    expect(toInternal(1, "sectionDimension", "in")).toBe(25.4);
  });
  it("1 lbf = 0.453 592 37 kg x 9.806 65 m/s^2 = 4.448 221 615 260 5 N (NIST SP 811 Appendix B.8, from memory)", () => {
    expect(toInternal(1, "force", "lbf")).toBeCloseTo(0.45359237 * 9.80665, 12);
    expect(toInternal(1, "force", "lbf")).toBe(4.4482216152605);
  });
  it("1 kip = 1000 lbf = 4.448 221 615 kN (NIST SP 811 Appendix B.8: 4.448 222 E+03 N, from memory)", () => {
    expectRelative(toInternal(1, "force", "kip"), 4448.222);
    expect(toInternal(1, "force", "kip")).toBeCloseTo(4448.2216152605, 9);
  });
  it("1 in^2 = 6.4516 E-04 m^2 exactly (NIST SP 811 Appendix B.8, from memory)", () => {
    expect(toInternal(1, "area", "in^2")).toBeCloseTo(645.16, 10);
  });
});

describe("derived US customary factors against NIST SP 811 Appendix B.8 (from memory)", () => {
  const cases: [QuantityKind, string, number, string][] = [
    ["modulus", "psi", 6.894757e3 * 1e-6, "psi = 6.894 757 E+03 Pa"],
    ["modulus", "ksi", 6.894757e6 * 1e-6, "ksi = 6.894 757 E+06 Pa"],
    ["pressure", "psf", 4.788026e1 * 1e-6, "lbf/ft^2 = 4.788 026 E+01 Pa"],
    ["distributedLoad", "plf", 1.45939e1 * 1e-3, "lbf/ft = 1.459 390 E+01 N/m"],
    ["distributedLoad", "lb/in", 1.751268e2 * 1e-3, "lbf/in = 1.751 268 E+02 N/m"],
    ["moment", "lb*ft", 1.355818 * 1e3, "lbf*ft = 1.355 818 N*m"],
    ["moment", "lb*in", 1.129848e-1 * 1e3, "lbf*in = 1.129 848 E-01 N*m"],
    ["secondMoment", "in^4", 4.162314e-7 * 1e12, "in^4 = 4.162 314 E-07 m^4"],
    ["density", "lb/ft3", 1.601846e1, "lb/ft^3 = 1.601 846 E+01 kg/m^3"],
  ];
  it.each(cases)("%s %s (%s)", (kind, unit, expected) => {
    expectRelative(toInternal(1, kind, unit), expected);
  });

  it("klf and kip*ft are 1000 times plf and lb*ft (definition of the kip)", () => {
    expect(toInternal(1, "distributedLoad", "klf")).toBeCloseTo(1000 * toInternal(1, "distributedLoad", "plf"), 10);
    expect(toInternal(1, "moment", "kip*ft")).toBeCloseTo(1000 * toInternal(1, "moment", "lb*ft"), 6);
  });
});

describe("SI factors (the SI prefixes by definition, common practice)", () => {
  const cases: [QuantityKind, string, number][] = [
    ["length", "m", 1000],
    ["length", "cm", 10],
    ["force", "kN", 1000],
    ["distributedLoad", "kN/m", 1],
    ["distributedLoad", "N/m", 0.001],
    ["moment", "kN*m", 1e6],
    ["moment", "N*m", 1000],
    ["modulus", "GPa", 1000],
    ["modulus", "N/mm2", 1],
    ["pressure", "kPa", 0.001],
    ["pressure", "kN/m2", 0.001],
    ["pressure", "Pa", 1e-6],
    ["secondMoment", "cm^4", 1e4],
    ["secondMoment", "m^4", 1e12],
    ["area", "cm2", 100],
    ["area", "m2", 1e6],
    ["springStiffness", "kN/mm", 1000],
  ];
  it.each(cases)("%s %s -> %d internal", (kind, unit, expected) => {
    expect(toInternal(1, kind, unit)).toBeCloseTo(expected, 9);
  });
});

describe("unit spellings", () => {
  it.each([
    ["kN/m", "distributedLoad"],
    ["kN*m", "moment"],
    ["kNm", "moment"],
    ["kN m", "moment"],
    ["kN-m", "moment"],
    ["kN·m", "moment"],
    ["kip-ft", "moment"],
    ["in^4", "secondMoment"],
    ["in4", "secondMoment"],
    ["mm⁴", "secondMoment"],
    ["N/mm²", "modulus"],
    ["lbs", "force"],
    ["KIP", "force"],
    ["pcf", "density"],
  ] as [string, QuantityKind][])("accepts %s as %s", (text, kind) => {
    expect(findUnit(kind, text).ok).toBe(true);
  });

  it("folds case, spaces and multiplication marks to one key", () => {
    expect(normaliseUnitText(" kN · m ")).toBe("kn*m");
    expect(normaliseUnitText("in.")).toBe("in");
  });

  it("treats kNm and kN*m as the same unit", () => {
    expect(toInternal(2.5, "moment", "kNm")).toBe(toInternal(2.5, "moment", "kN*m"));
  });

  it("rejects an unknown unit and lists the accepted ones for the kind", () => {
    const result = findUnit("distributedLoad", "kN/mm3");
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.message).toContain('unknown distributed load unit "kN/mm3"');
      for (const symbol of listAcceptedUnits("distributedLoad")) expect(result.message).toContain(symbol);
    }
  });

  it("names the kind when a unit of another kind is given", () => {
    const result = findUnit("distributedLoad", "kN");
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.message).toMatch(/"kN" is a force unit, but a distributed load is expected/);
  });

  it("rejects non-finite values instead of converting them", () => {
    expect(convertToInternal(Number.NaN, "length", "m").ok).toBe(false);
    expect(convertToInternal(Number.POSITIVE_INFINITY, "length", "m").ok).toBe(false);
  });

  it("round-trips through the internal unit", () => {
    const internal = toInternal(12.5, "length", "ft");
    const back = convertFromInternal(internal, "length", "ft");
    expect(back.ok && back.value).toBeCloseTo(12.5, 12);
  });

  it("gives every kind a default unit in both systems, and each default is accepted", () => {
    for (const system of ["SI", "US"] as const) {
      for (const kind of QUANTITY_KINDS) {
        expect(findUnit(kind, SYSTEM_DEFAULT_UNITS[system][kind]).ok).toBe(true);
      }
    }
  });
});
