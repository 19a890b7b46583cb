import { expect } from "vitest";

import { APP_URL, type Agent } from "@/tests/helpers/app";

export type UploadFields = { name?: string; reference?: string; profile?: string; delimiter?: string; units?: string };

/** POSTs a CSV to the dashboard's upload route the way the upload page does (multipart, same origin). */
export function uploadCsv(agent: Agent, csv: string, fields: UploadFields = {}, origin: string | null = APP_URL) {
  let req = agent.post("/api/schedules/upload");
  if (origin !== null) req = req.set("Origin", origin);
  const values = { name: "UI upload test", profile: "ibc-2021-floor", delimiter: "comma", units: "SI", ...fields };
  for (const [key, value] of Object.entries(values)) if (value !== undefined) req = req.field(key, value);
  return req.attach("file", Buffer.from(csv, "utf8"), { filename: "schedule.csv", contentType: "text/csv" });
}

/** Polls the progress route until the workers finish the schedule (or the time runs out). */
export async function waitForSchedule(agent: Agent, id: string, timeoutMs = 45_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const response = await agent.get(`/api/schedules/${id}/progress`);
    expect(response.status).toBe(200);
    if (response.body.status === "completed" || response.body.status === "failed") return response.body;
    if (Date.now() > until) throw new Error(`schedule ${id} still ${response.body.status} after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** A comma CSV from rows of cells, quoting what needs it (RFC 4180). */
export function toCsv(rows: string[][]): string {
  const cell = (v: string) => (/[",\r\n]/.test(v) ? `"${v.replaceAll('"', '""')}"` : v);
  return rows.map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}

export const BEAM_HEADER = ["mark", "category", "quantity", "material", "section", "b [mm]", "h [mm]", "span_1 [m]", "supports", "live_uniform [kN/m]"];

/** A simply supported S355 rectangle beam, 4 m span, 5 kN/m live load; b x h in mm. */
export function beamRow(mark: string, bMm: number, hMm: number): string[] {
  return [mark, "floor_beam", "1", "steel-s355", "rectangle", String(bMm), String(hMm), "4", "pinned roller", "5"];
}
