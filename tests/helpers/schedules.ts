import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

import { APP_URL } from "./app";

/** A simply supported steel floor beam (invented mark), SI units, span in metres, loads in kN/m. */
export function createBeam(mark: string, spanM = 6, liveKnPerM = 7.5) {
  return {
    mark,
    category: "floor_beam",
    quantity: 1,
    material: "steel-s355",
    section: { shape: "i_plate", bf: 150, tf: 10.7, d: 300, tw: 7.1 },
    spans: [spanM],
    supports: ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 3 },
      { case: "live", type: "uniform", w: liveKnPerM },
    ],
  };
}

export function createScheduleDoc(members: unknown[], name = "Test schedule, Fenwick Quay") {
  return {
    format: SCHEDULE_FORMAT,
    name,
    units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" },
    profile: { preset: "ibc-2021-floor" },
    members,
  };
}

export async function waitForSchedule(key: string, id: string, timeoutMs = 60_000): Promise<{ status: string; [k: string]: unknown }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await fetch(`${APP_URL}/api/v1/schedules/${id}`, { headers: { authorization: `Bearer ${key}` } });
    const body = (await response.json()) as { status: string };
    if (body.status === "completed" || body.status === "failed") return body;
    if (Date.now() > deadline) throw new Error(`schedule ${id} still ${body.status}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
