/**
 * Run in its own process (node --expose-gc --import tsx) by csv-memory.test.ts: builds one CSV
 * body, reads it with the server's streaming reader, and prints the peak of heap plus array
 * buffers while reading, above the baseline taken once the body was built, plus the body itself
 * (garbage not yet collected counts, so the figure errs high). Prints one JSON line.
 */
import { parseScheduleCsvBytes } from "@/lib/schedule-csv/parse-schedule-csv-stream";

const HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m],notes";

function buildBody(kind: string, targetBytes: number): Uint8Array {
  if (kind === "blank-lines") return Buffer.concat([Buffer.from(HEADER), new Uint8Array(targetBytes).fill(0x0a)]);
  if (kind === "open-quote") return Buffer.from(`${HEADER}\n"${"x".repeat(targetBytes)}`);
  if (kind === "good-rows") {
    const good = `B-%,floor_beam,1,steel-s355,rectangle,100,200,3.5,pinned roller,1,${"n".repeat(120)}\n`;
    return Buffer.from(HEADER + "\n" + Array.from({ length: Math.floor(targetBytes / good.length) }, (_, i) => good.replace("%", String(i))).join(""));
  }
  // Rows that each fail (a decimal comma in the span): members are dropped, errors capped.
  const row = `B-%,floor_beam,1,steel-s355,rectangle,100,200,"3,5",pinned roller,1,${"n".repeat(120)}\n`;
  const count = Math.floor(targetBytes / row.length);
  return Buffer.from(HEADER + "\n" + Array.from({ length: count }, (_, i) => row.replace("%", String(i))).join(""));
}

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error("run with --expose-gc");
const used = () => {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
};
const [kind = "blank-lines", sizeText = "17000000"] = process.argv.slice(2);
const body = buildBody(kind, Number(sizeText));
gc();
const baseline = used();
let peak = 0;
const sample = () => (peak = Math.max(peak, used() - baseline));
const timer = setInterval(sample, 1);
const result = await parseScheduleCsvBytes(body, { delimiter: ",", name: "Invented probe", profile: { preset: "ibc-2021-floor" }, units: {} });
sample();
clearInterval(timer);
const firstError = result.ok ? null : result.errors[0];
console.log(JSON.stringify({ kind, bodyBytes: body.byteLength, peakBytes: body.byteLength + peak, ok: result.ok, code: firstError?.code ?? null, errorCount: result.ok ? 0 : (result.errorCount ?? result.errors.length) }));
