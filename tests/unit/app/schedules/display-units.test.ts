// Engine values (internal mm, N, MPa) shown in a schedule's own units. Conversion factors: NIST
// SP 811 (2008) Appendix B (1 in = 25.4 mm, 1 ft = 304.8 mm, 1 lbf = 4.448 221 615 260 5 N, exact).
import { describe, expect, it } from "vitest";

import { formatQuantity, formatSignificant, prettyUnit, resolveDisplayUnits } from "@/app/(dashboard)/schedules/_components/display-units";
import { formatEntered, formatSection, formatSupport } from "@/app/(dashboard)/schedules/_components/entered-values";

describe("display units", () => {
  it("shows a US schedule in its own units", () => {
    const units = resolveDisplayUnits("US", {});
    expect(formatQuantity(25.4, "deflection", units)).toBe("1 in");
    expect(formatQuantity(3048, "length", units)).toBe("10 ft");
    // 29,000 ksi = 199,948 MPa (AISC E for steel, from memory)
    expect(formatQuantity(29000 * 6.894757293168361, "modulus", units)).toBe("29,000 ksi");
    expect(formatQuantity(25.4 ** 4 * 100, "secondMoment", units)).toBe("100 in⁴");
  });

  it("keeps a unit the schedule declared for a kind, and falls back to SI without a system", () => {
    expect(resolveDisplayUnits("SI", { length: "mm" }).length).toBe("mm");
    expect(resolveDisplayUnits(null, { length: "not a unit" }).length).toBe("m");
  });

  it("writes large second moments as powers of ten and never NaN", () => {
    expect(formatSignificant(1.2346e8)).toBe("1.235 × 10⁸");
    expect(formatSignificant(Number.NaN)).toBe("—");
    expect(prettyUnit("kN*m")).toBe("kN·m");
  });

  it("shows inputs as entered, each bare number with the schedule's unit for its kind", () => {
    const units = resolveDisplayUnits("US", {});
    expect(formatEntered(12, "length", units)).toBe("12 ft");
    expect(formatEntered({ value: 3.5, unit: "m" }, "length", units)).toBe("3.5 m");
    expect(formatSection({ shape: "rectangle", b: 3.5, h: 11.25 }, units)).toBe("rectangle: b 3.5 in, h 11.25 in");
    expect(formatSection({ shape: "explicit", I: 98, A: 12 }, units)).toBe("explicit: I 98 in⁴, A 12 in²");
    expect(formatSupport({ kind: "spring", stiffness: 50 }, units)).toBe("spring, stiffness 50 kip/in");
  });
});
