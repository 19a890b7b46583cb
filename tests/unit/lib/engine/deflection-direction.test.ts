// The engine's sign convention (lib/engine/model.ts): deflections are positive downward.
import { describe, expect, it } from "vitest";

import { formatSignedMm } from "@/app/(dashboard)/schedules/_components/format";
import { getDeflectionDirection } from "@/lib/engine/deflection-direction";

describe("deflection direction", () => {
  it.each([
    [12.3, "down"],
    [-4.5, "up"],
    [0, "none"],
    [Number.NaN, "none"],
  ] as const)("%d mm is %s", (value, direction) => {
    expect(getDeflectionDirection(value)).toBe(direction);
  });

  it("the dashboard prints magnitude and direction, never a bare sign", () => {
    expect(formatSignedMm(-4.5)).toBe("4.50 up");
    expect(formatSignedMm(152.4)).toBe("152 down");
    expect(formatSignedMm(0)).toBe("0.00");
    expect(formatSignedMm(null)).toBe("—");
  });
});
