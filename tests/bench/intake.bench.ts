/**
 * Intake throughput on one core: members per second that parseSchedule validates and converts,
 * for one document of 100,000 simple members (single span, I from plates, uniform dead + live,
 * a library material, SI defaults). Spans and loads vary with the index so no two neighbours are
 * identical. Each parse is timed after a warm-up; the summary takes the median of the runs in
 * CPU time (user + system) so other processes on the machine do not skew it. The last line is
 * the machine-readable summary.
 */
import { parseSchedule } from "../../lib/engine/intake";

const MEMBER_COUNT = 100_000;

function createMembers(count: number): unknown[] {
  const members: unknown[] = [];
  for (let i = 0; i < count; i++) {
    members.push({
      mark: `TW-${i}`,
      category: "floor_beam",
      quantity: 1,
      material: "steel-s355",
      section: { shape: "i_plate", bf: 150, tf: 10.7, d: 300, tw: 7.1 },
      spans: [3 + (i % 13) * 0.5],
      supports: ["pinned", "roller"],
      loads: [
        { case: "dead", type: "uniform", w: 3 + (i % 7) * 0.25 },
        { case: "live", type: "uniform", w: 7.5 + (i % 5) * 0.5 },
      ],
    });
  }
  return members;
}

function createDocument(count: number): unknown {
  return {
    format: "sagline.schedule/v2",
    name: "Bench",
    units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" },
    profile: { preset: "ibc-2021-floor" },
    members: createMembers(count),
  };
}

interface RunFigure {
  cpuSeconds: number;
  wallSeconds: number;
  checksum: number;
}

function measureOnce(doc: unknown): RunFigure {
  const cpuStart = process.cpuUsage();
  const wallStart = performance.now();
  const result = parseSchedule(doc);
  const wallSeconds = (performance.now() - wallStart) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  if (!result.ok) throw new Error(`bench document did not parse: ${JSON.stringify(result.issues.slice(0, 3))}`);
  const { members } = result.schedule;
  if (members.length !== MEMBER_COUNT) throw new Error(`expected ${MEMBER_COUNT} members, got ${members.length}`);
  // Touch the output so the work cannot be skipped, and so a wrong conversion shows as a changed checksum.
  let checksum = 0;
  for (const member of members) checksum += (member.spans[0]?.lengthMm ?? 0) + (member.loads[1]?.kind === "uniform" ? member.loads[1].wNPerMm : 0);
  return { cpuSeconds: (cpu.user + cpu.system) / 1e6, wallSeconds, checksum };
}

function getMedian(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
}

const doc = createDocument(MEMBER_COUNT);
const warmups = Number(process.env.BENCH_WARMUPS ?? "2");
const runs = Number(process.env.BENCH_RUNS ?? "5");
for (let k = 0; k < warmups; k++) measureOnce(doc);
const figures: RunFigure[] = [];
for (let k = 0; k < runs; k++) figures.push(measureOnce(doc));
const cpuMedian = getMedian(figures.map((f) => f.cpuSeconds));
const wallMedian = getMedian(figures.map((f) => f.wallSeconds));
for (const [k, f] of figures.entries()) {
  console.log(`run ${k + 1}: ${MEMBER_COUNT} members in ${(f.cpuSeconds * 1000).toFixed(0)} ms CPU, ${(f.wallSeconds * 1000).toFixed(0)} ms wall (checksum ${f.checksum.toFixed(3)})`);
}
const cpuBest = Math.min(...figures.map((f) => f.cpuSeconds));
console.log(
  `node ${process.version}, one thread, ${warmups} warm-up parses then ${runs} timed; per ${MEMBER_COUNT}-member schedule: median ${(cpuMedian * 1000).toFixed(0)} ms CPU (best ${(cpuBest * 1000).toFixed(0)} ms, ${Math.round(MEMBER_COUNT / cpuBest)} members/s), median ${(wallMedian * 1000).toFixed(0)} ms wall`,
);
console.log(`bench:intake members_per_s=${Math.round(MEMBER_COUNT / cpuMedian)}`);
