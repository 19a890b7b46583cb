/**
 * Run in its own process (node --expose-gc --single-threaded-gc --import tsx) by csv-growth.test.ts: reads a CSV of
 * `rows` and of 10 x `rows` rows with the server's streaming reader and prints the least CPU time
 * of five reads of each as one JSON line. Collecting garbage before each read keeps an earlier
 * read's garbage, and the test runner's, out of the figure.
 */
import { parseScheduleCsvBytes } from "@/lib/schedule-csv/parse-schedule-csv-stream";

const HEADER = "mark,category,quantity,material,section,b [mm],h [mm],span_1 [m],supports,live_uniform [kN/m]";
const options = { delimiter: "," as const, name: "Invented growth test", profile: { preset: "ibc-2021-floor" }, units: {} };

function buildCsv(rows: number, span: string): Uint8Array {
  const lines = [HEADER];
  for (let i = 0; i < rows; i++) lines.push(`B-${i},floor_beam,1,steel-s355,rectangle,100,200,${span},pinned roller,1`);
  return Buffer.from(lines.join("\r\n") + "\r\n");
}

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error("run with --expose-gc");
const collect = gc;

async function measureLeastCpuMs(body: Uint8Array): Promise<number> {
  await parseScheduleCsvBytes(body, options); // warm up outside the measurement
  let least = Number.POSITIVE_INFINITY;
  for (let i = 0; i < 5; i++) {
    collect();
    const start = process.cpuUsage();
    await parseScheduleCsvBytes(body, options);
    const used = process.cpuUsage(start);
    least = Math.min(least, (used.user + used.system) / 1000);
  }
  return least;
}

const [span = "3.5", rowsText = "5000"] = process.argv.slice(2);
const rows = Number(rowsText);
const smallMs = await measureLeastCpuMs(buildCsv(rows, span));
const largeMs = await measureLeastCpuMs(buildCsv(10 * rows, span));
console.log(JSON.stringify({ rows, smallMs, largeMs }));
