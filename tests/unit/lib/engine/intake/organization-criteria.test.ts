// Intake with the organization's own criteria: `limits.profile` resolves through the caller's
// lookup (alone, never mixed with a preset), and an organization material id finds its material
// before the library.
import { describe, expect, it } from "vitest";

import { parseLimitProfile, parseSchedule } from "@/lib/engine/intake";
import type { Material } from "@/lib/engine/materials";
import { getPreset } from "@/lib/engine/presets";

const beam = (material: unknown) => ({
  mark: "B1",
  category: "floor_beam",
  quantity: 1,
  material,
  section: { shape: "rectangle", b: 100, h: 300 },
  spans: [4],
  supports: ["pinned", "roller"],
  loads: [{ case: "live", type: "uniform", w: 2 }],
});

const doc = (profile: unknown, material: unknown = "steel-s355") => ({
  format: "sagline.schedule/v2",
  name: "Organization criteria (invented)",
  units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m" },
  profile,
  members: [beam(material)],
});

describe("profile.id", () => {
  const profile = { ...getPreset("ibc-2021-floor")!, id: "lp_test.v3" };
  const organizationProfiles = new Map([["lp_test", profile]]);

  it("resolves to the caller's profile", () => {
    const parsed = parseSchedule(doc({ id: "lp_test" }), { organizationProfiles });
    expect(parsed.ok && parsed.schedule.profile).toEqual(profile);
  });

  it("names an unknown id and refuses a mix with a preset", () => {
    expect(parseSchedule(doc({ id: "lp_other" }), { organizationProfiles })).toMatchObject({
      ok: false,
      issues: [{ path: "profile.id", message: 'unknown limit profile "lp_other": not one of this organization\'s profiles (Settings, Limit profiles)' }],
    });
    expect(parseSchedule(doc({ id: "lp_test", preset: "ibc-2021-floor" }), { organizationProfiles })).toMatchObject({
      ok: false,
      issues: [{ path: "profile", message: expect.stringContaining("give id alone") }],
    });
  });
});

describe("organization materials", () => {
  // invented values
  const own: Material = { id: "mat_test", label: "Verrel alloy 7 (invented)", family: "custom", eMpa: 100_000, gMpa: null, densityKgPerM3: null, creepFactor: 0, source: "invented" };

  it("are found by id before the library, and are unknown without the lookup", () => {
    const parsed = parseSchedule(doc({ preset: "ibc-2021-floor" }, "mat_test"), { organizationMaterials: new Map([["mat_test", own]]) });
    expect(parsed.ok && parsed.schedule.members[0]!.spans[0]!.eMpa).toBe(100_000);
    const without = parseSchedule(doc({ preset: "ibc-2021-floor" }, "mat_test"));
    expect(without.ok).toBe(false);
    if (!without.ok) expect(without.issues[0]!.path).toBe("members[0].material");
  });
});

describe("parseLimitProfile", () => {
  it("reads a definition in the limits.custom format and names each problem's field", () => {
    const definition = { id: "lp_x.v1", label: "In-house", source: "test", combinations: [{ id: "live", label: "live", factors: { live: 1 }, limitRatio: 480, cap: { value: 20, unit: "mm" } }], cantileverSpanMultiplier: 2 };
    expect(parseLimitProfile(definition)).toMatchObject({ ok: true, profile: { id: "lp_x.v1", combinations: [{ id: "live", limitRatio: 480, capMm: 20 }] } });
    expect(parseLimitProfile({ ...definition, cantileverSpanMultiplier: 0 })).toMatchObject({ ok: false, issues: [{ path: "cantileverSpanMultiplier" }] });
  });
});
