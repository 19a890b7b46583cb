import { parseSchedule } from "@/lib/engine/intake";

import { assertMatchesScheduleSchema } from "./read-schedule-body";

/**
 * Runs the schema validator and intake once over a small generated schedule when the server
 * starts, so the first real submission does not pay for compiling the JSON Schema and for
 * optimising the intake's hot paths.
 */
export function warmUpScheduleIntake(): void {
  const members = Array.from({ length: 2000 }, (_, i) => ({
    mark: `WARM-${i}`,
    category: "floor_beam",
    quantity: 1,
    material: "steel-s355",
    section: { shape: "rectangle", b: 100, h: 200 + (i % 7) },
    spans: [3 + (i % 5)],
    supports: ["pinned", "roller"],
    loads: [{ case: "live", type: "uniform", w: 1 + (i % 3) }],
  }));
  const doc = { format: "sagline.schedule/v1", name: "warm-up", units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" }, limits: { preset: "ibc-2021-floor" }, members };
  assertMatchesScheduleSchema(doc);
  parseSchedule(doc);
}
