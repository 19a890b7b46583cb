// The member diagrams, rendered on the server as the page does: supports by kind with overhang
// tips left free, one allowed-deflection line per span and combination, the maxima marked, and a
// text description for screen readers. Engine values are checked in the engine's own tests.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";

import { ShapeDiagram } from "@/app/(dashboard)/schedules/_components/shape-diagram";
import { resolveDisplayUnits } from "@/app/(dashboard)/schedules/_components/display-units";
import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";
import { runStoredMember } from "@/lib/server/schedules/run-stored-member";

const header = { format: "sagline.schedule/v2", name: "Invented diagram test", units: { system: "US" }, profile: { preset: "ibc-2021-floor" } };

function render(member: Record<string, unknown>) {
  const run = runStoredMember(header, member);
  if (!run.ok) throw new Error(JSON.stringify(run.issues));
  const checks: MemberCheckRow[] = run.result.checks.map((c) => ({ ...c, checkKey: `${c.combinationId}@${c.spanIndex}`, limitRatio: c.limitRatio ?? null, achievedRatio: c.achievedRatio ?? null }));
  const units = resolveDisplayUnits(run.model.unitSystem, run.model.unitDefaults);
  return { html: renderToStaticMarkup(createElement(ShapeDiagram, { shape: run.result.shape ?? [], model: run.model, checks, units })), run };
}

const member = {
  mark: "J-7",
  category: "floor_beam",
  quantity: 1,
  material: { name: "invented metal", E: 29000, creepFactor: 0 },
  section: { shape: "explicit", I: 100 },
  spans: [12, 10],
  overhangs: { right: 3 },
  supports: ["pinned", "roller", { kind: "spring", stiffness: 50 }],
  loads: [
    { case: "dead", type: "uniform", w: 0.2 },
    { case: "live", type: "point", P: 2, at: 6 },
  ],
};

describe("ShapeDiagram", () => {
  it("draws supports by kind and leaves the overhang tip free", () => {
    const { html } = render(member);
    const kinds = [...html.matchAll(/data-support-kind="([a-z]+)"/g)].map((m) => m[1]);
    expect(kinds).toEqual(["pinned", "roller", "spring"]);
    expect(html).not.toContain('data-support-kind="free"');
  });

  it("draws each span's allowed deflection and marks each check's maximum, per combination", () => {
    const { html, run } = render(member);
    const combinations = run.model.combinations.length;
    expect(combinations).toBeGreaterThan(1);
    expect(html.match(/data-allowed-span=/g)).toHaveLength(combinations * 3);
    expect(html.match(/data-maximum-span=/g)).toHaveLength(combinations * 3);
    expect(html.match(/data-testid="deflection-panel"/g)).toHaveLength(combinations);
  });

  it("labels every drawing for screen readers in the schedule's units", () => {
    const { html } = render(member);
    expect(html).toContain("<title");
    expect(html).toMatch(/<desc[^>]*>Supports: left end at 0 ft: pinned; node 2 at 12 ft: roller; node 3 at 22 ft: spring 50 kip\/in; right end at 25 ft: free end\./);
    expect(html).toMatch(/span 1: largest [0-9.]+ in down at [0-9.]+ ft, allowed 0\.4 in/);
    expect(html).toContain("live 2 kip");
  });

});
