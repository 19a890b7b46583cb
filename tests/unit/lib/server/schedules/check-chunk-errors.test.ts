import { describe, expect, it } from "vitest";

import { checkMembers } from "@/lib/server/schedules/check-chunk";
import { runStoredMember } from "@/lib/server/schedules/run-stored-member";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

const header = { format: SCHEDULE_FORMAT, name: "Invented cantilever uplift test", units: { system: "SI", length: "m", distributedLoad: "kN/m" }, profile: { preset: "ibc-2021-floor" } };

// A 2 m concrete cantilever under an upward 60 kN/m (less its self-weight, 0.15 m^2 x about
// 24 kN/m^3 = 3.6 kN/m, common practice): M = w L^2 / 2 = 113 kN*m net, far past
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

  it("the member page's re-run and what-if name the same field", () => {
    const run = runStoredMember(header, cantilever);
    expect(run.ok).toBe(false);
    if (run.ok) return;
    expect(run.issues.map((issue) => issue.path)).toEqual(["members[0].reinforcement.topSteel"]);
    expect(run.issues[0]?.message).toMatch(/this overhang sags/);
  });

  it("the same member passes once the upward load is gone (the refusal is the uplift, not the input)", () => {
    const [outcome] = checkMembers(header, 0, [{ ...cantilever, loads: [{ case: "dead", type: "uniform", w: 5 }] }]);
    expect(outcome?.error).toBeNull();
    expect(outcome?.result?.checks.length).toBeGreaterThan(0);
  });
});
