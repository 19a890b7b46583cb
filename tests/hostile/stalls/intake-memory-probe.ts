/**
 * Run in its own process (node --expose-gc --import tsx) by intake-memory.test.ts: builds one
 * valid schedule body (JSON or CSV) of the given member count, then takes it through the server's
 * intake as a submission does, up to the text of every chunk it would store: reading the body,
 * the JSON Schema, intake and the engine's member checks, and each chunk's text in turn. Prints
 * the peak of live heap plus array buffers above the baseline taken once the body was built
 * (garbage is collected before each reading: what is left is what the intake holds), plus the
 * body itself, as one JSON line.
 *
 * Intake is synchronous, so a timer cannot sample it: the members array is wrapped to sample
 * every 5,000 reads, and the chunk loop samples after each chunk (the text still held).
 */
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

import { MAX_MEMBERS } from "@/lib/engine/intake";
import { assertMatchesScheduleSchema, readScheduleCsv } from "@/lib/server/schedules/read-schedule-body";
import { scanScheduleJson } from "@/lib/server/schedules/scan-schedule-json";
import { CHUNK_SIZE, prepareSchedule } from "@/lib/server/schedules/submit-schedule";

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error("run with --expose-gc");

const CSV_HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m],notes";

function buildBody(kind: string, members: number): Uint8Array {
  if (kind === "json") {
    // Invented marks; a few non-Latin notes so some chunk texts are two-byte strings.
    const list = Array.from({ length: members }, (_, i) => ({ ...createBeam(`HV-${i}`, 3 + (i % 9) * 0.5), notes: i % 997 === 0 ? "Прогон, перевірити" : "check bearing" }));
    return Buffer.from(JSON.stringify(createScheduleDoc(list, "Harrowvale Sheds (invented), memory probe")));
  }
  const rows = Array.from({ length: members }, (_, i) => `HV-${i},floor_beam,1,steel-s355,rectangle,100,${200 + (i % 7) * 10},${3 + (i % 9) * 0.5},pinned roller,1,2,${i % 997 === 0 ? "Прогон" : "check bearing"}\n`);
  return Buffer.from(`${CSV_HEADER}\n${rows.join("")}`);
}

const used = () => {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
};

const [kind = "json", countText = "10000"] = process.argv.slice(2);
let body: Uint8Array | null = buildBody(kind, Number(countText));
const bodyBytes = body.byteLength;
gc();
const baseline = used();
let peak = 0;
const sample = () => {
  gc();
  peak = Math.max(peak, used() - baseline);
};
const timer = setInterval(sample, 500);

function sampled(members: unknown[]): unknown[] {
  let reads = 0;
  return new Proxy(members, {
    get(target, property) {
      if (++reads % 5000 === 0) sample();
      return Reflect.get(target, property) as unknown;
    },
  });
}

let doc: Record<string, unknown>;
let toFieldErrors: Parameters<typeof prepareSchedule>[0]["toFieldErrors"];
if (kind === "json") {
  const scanned = scanScheduleJson(body, MAX_MEMBERS);
  if (!scanned) throw new Error("the scan did not follow the body");
  doc = { ...scanned, members: sampled(scanned.members as unknown[]) };
  assertMatchesScheduleSchema(doc);
} else {
  const csv = await readScheduleCsv(body, { name: "Harrowvale Sheds (invented)", profile: { preset: "ibc-2021-floor" }, delimiter: "," });
  doc = { ...csv.doc, members: sampled(csv.doc.members as unknown[]) };
  toFieldErrors = csv.toFieldErrors;
}
const prepared = prepareSchedule({ doc, toFieldErrors });
let chunkChars = 0;
for (let chunk = 0; chunk < prepared.chunkCount; chunk++) {
  const first = chunk * CHUNK_SIZE;
  const text = prepared.members.chunkText(first, Math.min(first + CHUNK_SIZE, prepared.members.count));
  sample();
  chunkChars += text.length;
}
sample();
clearInterval(timer);
body = null;
console.log(JSON.stringify({ kind, members: prepared.members.count, bodyBytes, peakBytes: bodyBytes + peak, chunkChars }));
