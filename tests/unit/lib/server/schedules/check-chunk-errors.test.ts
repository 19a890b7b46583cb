import { describe, expect, it } from "vitest";

import { checkMembers } from "@/lib/server/schedules/check-chunk";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

const header = { format: SCHEDULE_FORMAT, name: "Invented cantilever uplift test", units: { system: "SI", length: "m", distributedLoad: "kN/m" }, profile: { preset: "ibc-2021-floor" } };

// A 2 m concrete cantilever under a net upward 60 kN/m: M = w L^2 / 2 = 120 kN*m, far past
// (2/3) M_cr of a 300 x 500 fc30 section (f_r = 0.62 sqrt(30) MPa, ACI 318-19 19.2.3.1, from
// memory; M_cr about 42 kN*m). It sags, and in a member of overhangs only the given steel is top
// steel, so the bottom steel is unknown and the solver refuses it after intake accepted it.
const cantilever = {
  mark: "RC4",
  category: "floor_beam",
  quantity: 1,
  material: "concrete-fc30",
  section: { shape: "rectangle", b: 300, h: 500 },
  spans: [2],
  supports: ["fixed", "free"],
  reinforcement: { tensionSteel: 1473, effectiveDepth: 440 },
  loads: [{ case: "dead", type: "uniform", w: -60 }],
};
const { reinforcement: _memberLevel, ...bare } = cantilever;
const spanReinforced = { ...bare, mark: "RC5", spans: [{ length: 2, reinforcement: cantilever.reinforcement }] };

describe("errors found while checking", () => {
  it("name the schedule's field and the member's index in the whole schedule, not the engine's", () => {
    const [memberLevel, spanLevel] = checkMembers(header, 7, [cantilever, spanReinforced]);
    expect(memberLevel?.result).toBeNull();
    expect(memberLevel?.error).toMatch(/^members\[7\]\.reinforcement\.topSteel: is required: this overhang sags/);
    expect(spanLevel?.error).toMatch(/^members\[8\]\.spans\[0\]\.reinforcement\.topSteel: is required/);
    for (const outcome of [memberLevel, spanLevel]) expect(outcome?.error).not.toMatch(/reinforcedConcrete|Mm2/);
  });

  it("the same member passes once the upward load is gone (the refusal is the uplift, not the input)", () => {
    const [outcome] = checkMembers(header, 0, [{ ...cantilever, loads: [{ case: "dead", type: "uniform", w: 5 }] }]);
    expect(outcome?.error).toBeNull();
    expect(outcome?.result?.checks.length).toBeGreaterThan(0);
  });
});
