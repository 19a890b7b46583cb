/**
 * Engine throughput on one core: members checked per second for
 *  (a) single-span simply supported members, uniform dead + live, two checks (L/360, D+L/240);
 *  (b) three-span continuous members with uniform, partial, point and moment loads, three checks,
 *      the live load in its worst pattern for each check (pattern loading is on by default);
 *  (c) the members of (b) with a minimum first frequency as well (converged finite-element
 *      eigenvalue, mass of dead + 10 % live).
 * Members are generated from a seeded generator so runs are repeatable. The last line is the
 * machine-readable summary.
 */
import { checkMember } from "../../lib/engine/check-member";
import type { LimitProfile, Member } from "../../lib/engine/model";
import { createRandom } from "../unit/lib/engine/solver/random";

const floorProfile: LimitProfile = {
  id: "bench-floor",
  label: "Floor members (bench)",
  source: "IBC 2021 Table 1604.3 (from memory)",
  cantileverSpanMultiplier: 2,
  combinations: [
    { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
    { id: "D+L", label: "Dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
};

const continuousProfile: LimitProfile = {
  ...floorProfile,
  id: "bench-continuous",
  combinations: [
    ...floorProfile.combinations,
    { id: "LT", label: "Long term", factors: { dead: 1, live: 1 }, sustainedFactors: { dead: 1, live: 0.3 }, creep: 0.6, limitRatio: 250, capMm: 40 },
  ],
};

const continuousFrequencyProfile: LimitProfile = {
  ...continuousProfile,
  id: "bench-continuous-frequency",
  frequency: { minHz: 4, massFactors: { dead: 1, live: 0.1 } },
};

function createSingleSpanMembers(count: number, random: () => number): Member[] {
  const members: Member[] = [];
  for (let i = 0; i < count; i++) {
    const lengthMm = 3000 + random() * 6000;
    members.push({
      mark: `B${i}`,
      category: "floor_beam",
      quantity: 1,
      supports: [{ kind: "pinned" }, { kind: "roller" }],
      spans: [{ lengthMm, eMpa: 200000, iMm4: 5e7 + random() * 3e8 }],
      loads: [
        { kind: "uniform", loadCase: "dead", wNPerMm: 2 + random() * 8 },
        { kind: "uniform", loadCase: "live", wNPerMm: 2 + random() * 10 },
      ],
    });
  }
  return members;
}

function createContinuousMembers(count: number, random: () => number): Member[] {
  const members: Member[] = [];
  for (let i = 0; i < count; i++) {
    const spans = [0, 1, 2].map(() => ({ lengthMm: 3000 + random() * 5000, eMpa: 200000, iMm4: 8e7 + random() * 3e8 }));
    const totalMm = spans.reduce((sum, span) => sum + span.lengthMm, 0);
    const partialStart = random() * totalMm * 0.5;
    members.push({
      mark: `C${i}`,
      category: "floor_beam",
      quantity: 1,
      supports: [{ kind: "pinned" }, { kind: "roller" }, { kind: "roller" }, { kind: random() < 0.5 ? "roller" : "fixed" }],
      spans,
      loads: [
        { kind: "uniform", loadCase: "dead", wNPerMm: 2 + random() * 6 },
        { kind: "uniform", loadCase: "live", wNPerMm: 1 + random() * 3 },
        { kind: "uniform", loadCase: "live", wNPerMm: 1 + random() * 6, startMm: partialStart, endMm: partialStart + totalMm * 0.4 },
        { kind: "point", loadCase: "live", atMm: random() * totalMm, pN: 5000 + random() * 20000 },
        { kind: "moment", loadCase: "dead", atMm: random() * totalMm, mNmm: (random() - 0.5) * 2e7 },
      ],
    });
  }
  return members;
}

interface BenchFigure {
  /** Members per second of this process's CPU time (user + system): one core's throughput. */
  perCpuSecond: number;
  /** Members per second of wall-clock time (lower when other processes share the core). */
  perWallSecond: number;
  failing: number;
  checksum: number;
}

function measure(members: Member[], profile: LimitProfile, seconds: number): BenchFigure {
  let done = 0;
  let failing = 0;
  let checksum = 0;
  const start = performance.now();
  const cpuStart = process.cpuUsage();
  const stopAt = start + seconds * 1000;
  let now = start;
  while (now < stopAt) {
    for (let k = 0; k < 2000; k++) {
      const result = checkMember(members[(done + k) % members.length]!, profile);
      checksum += result.governing === null ? 0 : result.governing.utilization;
      if (!result.pass) failing += 1;
    }
    done += 2000;
    now = performance.now();
  }
  const cpu = process.cpuUsage(cpuStart);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  return { perCpuSecond: done / cpuSeconds, perWallSecond: (done * 1000) / (now - start), failing: failing / done, checksum };
}

const random = createRandom(20261201);
const singleSpan = createSingleSpanMembers(4096, random);
const continuous = createContinuousMembers(4096, random);
const seconds = Number(process.env.BENCH_SECONDS ?? "4");

measure(singleSpan, floorProfile, 1);
const a = measure(singleSpan, floorProfile, seconds);
console.log(`(a) single-span simply supported, uniform D + L, 2 checks: ${Math.round(a.perCpuSecond)} members per CPU-second, ${Math.round(a.perWallSecond)} per wall-second (${(a.failing * 100).toFixed(1)}% failing, each with a minimum-I suggestion; checksum ${a.checksum.toExponential(3)})`);
measure(continuous, continuousProfile, 1);
const b = measure(continuous, continuousProfile, seconds);
console.log(`(b) three-span continuous, uniform + partial + point + moment, 3 checks, live patterned span by span: ${Math.round(b.perCpuSecond)} members per CPU-second, ${Math.round(b.perWallSecond)} per wall-second (${(b.failing * 100).toFixed(1)}% failing; checksum ${b.checksum.toExponential(3)})`);
measure(continuous, continuousFrequencyProfile, 1);
const c = measure(continuous, continuousFrequencyProfile, seconds);
console.log(`(c) the members of (b) with a first-frequency check (>= 4 Hz, finite-element eigenvalue): ${Math.round(c.perCpuSecond)} members per CPU-second, ${Math.round(c.perWallSecond)} per wall-second (${(c.failing * 100).toFixed(1)}% failing; checksum ${c.checksum.toExponential(3)})`);
console.log(`node ${process.version}, one thread, ${seconds} s per measurement after 1 s warm-up; the summary uses CPU time so other processes on the machine do not skew it; the diagram shape is not sampled (checkMember samples it only on request, for a member's own page)`);
console.log(`bench:engine single_span_per_s=${Math.round(a.perCpuSecond)} continuous_per_s=${Math.round(b.perCpuSecond)} continuous_freq_per_s=${Math.round(c.perCpuSecond)}`);
