import { describe, expect, it } from "vitest";

import { DEFAULT_SUSTAINED_LIVE_FRACTION, getPreset, listPresetIds, listPresets, listProfileLoadCases, presetTakesSustainedLiveFraction } from "@/lib/engine/presets";

function getPresetOrThrow(id: string) {
  const preset = getPreset(id);
  if (!preset) throw new Error(`no preset ${id}`);
  return preset;
}

describe("IBC 2021 Table 1604.3 (from memory)", () => {
  it("floor: live l/360; D + L row l/240 on the creep component of dead plus immediate live (footnote); cantilevers on twice their length", () => {
    const floor = getPresetOrThrow("ibc-2021-floor");
    expect(floor.source).toContain("IBC 2021 Table 1604.3");
    expect(floor.cantileverSpanMultiplier).toBe(2);
    expect(floor.combinations.map((c) => [c.factors, c.sustainedFactors, c.creep, c.limitRatio])).toEqual([
      [{ live: 1 }, undefined, undefined, 360],
      [{ live: 1 }, { dead: 1 }, "ibc_creep_component", 240],
    ]);
  });
  it.each([
    ["ibc-2021-roof-plaster-ceiling", 360, 240],
    ["ibc-2021-roof-ceiling", 240, 180],
    ["ibc-2021-roof-no-ceiling", 180, 120],
  ])("%s: roof live or snow l/%d, dead + either l/%d", (id, liveRatio, totalRatio) => {
    const roof = getPresetOrThrow(id);
    expect(roof.combinations.find((c) => c.id === "snow")?.limitRatio).toBe(liveRatio);
    expect(roof.combinations.find((c) => c.id === "roof_live")?.limitRatio).toBe(liveRatio);
    expect(roof.combinations.find((c) => c.id === "dead+snow")?.limitRatio).toBe(totalRatio);
  });
  it.each([
    ["ibc-2021-wall-plaster", 360],
    ["ibc-2021-wall-brittle", 240],
    ["ibc-2021-wall-flexible", 120],
  ])("%s: wind l/%d", (id, ratio) => {
    expect(getPresetOrThrow(id).combinations).toEqual([expect.objectContaining({ factors: { wind: 1 }, limitRatio: ratio })]);
  });
});

describe("EN 1995-1-1 7.2 timber floor", () => {
  const timber = getPresetOrThrow("en1995-timber-floor");
  it("uses the least strict end of the Table 7.2 ranges: w_inst l/300, w_net,fin l/250, w_fin l/150; cantilevers l/150, l/125, l/75 on their own length (from memory)", () => {
    expect(timber.combinations.map((c) => [c.id, c.limitRatio, c.cantileverLimitRatio])).toEqual([
      ["w_inst", 300, 150],
      ["w_net_fin", 250, 125],
      ["w_fin", 150, 75],
    ]);
    expect(timber.cantileverSpanMultiplier).toBe(1);
  });
  it("w_inst is the characteristic combination, dead + live (EN 1995-1-1 2.2.3(2), from memory)", () => {
    expect(timber.combinations[0]?.factors).toEqual({ dead: 1, live: 1 });
  });
  it("the national-annex variant limits the variable action alone, and says so", () => {
    const variant = getPresetOrThrow("en1995-timber-floor-na-variable-inst");
    expect(variant.combinations[0]).toMatchObject({ id: "w_inst_q", factors: { live: 1 }, limitRatio: 300, cantileverLimitRatio: 150 });
    expect(variant.label).toContain("national-annex");
    expect(variant.source).toContain("national-annex variant");
  });
  it("takes creep from the material on dead + psi2 live, psi2 = 0.3 (EN 1990 Table A1.1 category A, from memory)", () => {
    const wFin = timber.combinations.find((c) => c.id === "w_fin");
    expect(wFin?.creep).toBe("material");
    expect(wFin?.sustainedFactors).toEqual({ dead: 1, live: 0.3 });
  });
});

describe("ACI 318-19 Table 24.2.2 (from memory)", () => {
  it("floor: immediate live l/360; after attachment l/240 on lambda x (dead + sustained live) + immediate live; cantilevers on their own length", () => {
    const floor = getPresetOrThrow("aci-318-19-floor");
    expect(floor.combinations.map((c) => c.limitRatio)).toEqual([360, 240]);
    expect(floor.combinations[1]).toMatchObject({ factors: { live: 1 }, sustainedFactors: { dead: 1, live: DEFAULT_SUSTAINED_LIVE_FRACTION }, creep: "material" });
    expect(floor.cantileverSpanMultiplier).toBe(1);
    expect(DEFAULT_SUSTAINED_LIVE_FRACTION).toBe(1);
    expect(floor.source).toContain("sustained live fraction 1 (default");
  });
  it("takes the sustained live fraction as an option, and only the ACI presets read it", () => {
    expect(getPreset("aci-318-19-floor", { sustainedLiveFraction: 0.25 })?.combinations[1]?.sustainedFactors).toEqual({ dead: 1, live: 0.25 });
    expect(getPreset("aci-318-19-roof", { sustainedLiveFraction: 0 })?.combinations.find((c) => c.id === "after_attachment_snow")?.sustainedFactors).toEqual({ dead: 1, snow: 0 });
    expect(presetTakesSustainedLiveFraction("aci-318-19-floor")).toBe(true);
    expect(presetTakesSustainedLiveFraction("ibc-2021-floor")).toBe(false);
  });
  it("sensitive floor: after attachment l/480; flat roof l/180", () => {
    expect(getPresetOrThrow("aci-318-19-floor-sensitive").combinations[1]?.limitRatio).toBe(480);
    expect(getPresetOrThrow("aci-318-19-roof").combinations[0]?.limitRatio).toBe(180);
  });
});

it("the conservative immediate dead + live l/240 is its own profile, never labelled as the IBC D + L row", () => {
  const conservative = getPresetOrThrow("floor-conservative-immediate-total");
  const immediate = conservative.combinations.find((c) => c.id === "dead+live_immediate");
  expect(immediate).toMatchObject({ factors: { dead: 1, live: 1 }, limitRatio: 240 });
  expect(immediate?.creep).toBeUndefined();
  expect(immediate?.label).toContain("not the IBC D + L row");
  expect(conservative.label).toContain("conservative variant");
  // it keeps the code's rows too, so it is never less strict than ibc-2021-floor
  expect(conservative.combinations.slice(0, 2)).toEqual(getPresetOrThrow("ibc-2021-floor").combinations);
  // no IBC-labelled preset judges immediate dead load: its D + L rows take the creep component
  const ibcPresets = listPresets().filter((p) => p.id.startsWith("ibc-2021"));
  expect(ibcPresets.length).toBeGreaterThan(5);
  for (const preset of ibcPresets) for (const c of preset.combinations) expect(c.factors.dead).toBeUndefined();
});

it("floor vibration preset asks for at least 4 Hz (common practice)", () => {
  expect(getPresetOrThrow("ibc-2021-floor-vibration").frequency?.minHz).toBe(4);
});

it("returns copies, so editing one profile cannot change the preset", () => {
  const edited = getPresetOrThrow("ibc-2021-floor");
  const first = edited.combinations[0];
  if (first) {
    first.limitRatio = 1;
    first.factors.live = 99;
  }
  expect(getPresetOrThrow("ibc-2021-floor").combinations[0]?.limitRatio).toBe(360);
  expect(getPresetOrThrow("ibc-2021-floor").combinations[0]?.factors.live).toBe(1);
});

it("every preset has a unique id, a source, positive ratios and a cantilever multiplier", () => {
  const ids = listPresetIds();
  expect(new Set(ids).size).toBe(ids.length);
  for (const preset of listPresets()) {
    expect(preset.source.length).toBeGreaterThan(10);
    expect(preset.cantileverSpanMultiplier).toBeGreaterThan(0);
    for (const c of preset.combinations) expect(c.limitRatio).toBeGreaterThan(0);
  }
  expect(getPreset("nope")).toBeNull();
});

it("lists the load cases a profile reads", () => {
  expect([...listProfileLoadCases(getPresetOrThrow("ibc-2021-floor-vibration"))].sort()).toEqual(["dead", "live"]);
});
