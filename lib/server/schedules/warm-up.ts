import { encodeCsvLine } from "@/lib/server/copy-rows";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

import { checkMembers, checkRows, outcomeRows } from "./check-chunk";
import { assertMatchesScheduleSchema } from "./read-schedule-body";
import { CHUNK_SIZE, collectScheduleIssues } from "./submit-schedule";

/** Rounds over the generated members: enough for the hot paths to reach the optimising compiler. */
const WARM_UP_ROUNDS = 4;

function createWarmUpDoc() {
  const members = Array.from({ length: 2000 }, (_, i) => ({
    mark: `WARM-${i}`,
    category: "floor_beam",
    quantity: 1,
    material: i % 2 === 0 ? "steel-s355" : "timber-c24",
    section: i % 2 === 0 ? { shape: "i_plate", bf: 150, tf: 10.7, d: 300, tw: 7.1 } : { shape: "rectangle", b: 100, h: 200 + (i % 7) },
    spans: i % 5 === 0 ? [3 + (i % 5), 4] : [3 + (i % 5)],
    supports: i % 5 === 0 ? ["pinned", "roller", "roller"] : ["pinned", "roller"],
    loads: [
      { case: "dead", type: "uniform", w: 1 + (i % 4) },
      { case: "live", type: "uniform", w: 1 + (i % 3) },
    ],
  }));
  return { format: SCHEDULE_FORMAT, name: "warm-up", units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" }, profile: { preset: "ibc-2021-floor" }, members };
}

/**
 * Runs the schema validator, intake and member serialisation over a generated schedule, so the
 * first real submission does not pay for compiling the JSON Schema and for running the intake's
 * hot paths unoptimised.
 */
export function warmUpScheduleIntake(): void {
  const doc = createWarmUpDoc();
  for (let round = 0; round < WARM_UP_ROUNDS; round++) {
    assertMatchesScheduleSchema(doc);
    collectScheduleIssues(doc);
    // As the submission stores them: one JSON text per chunk.
    for (let first = 0; first < doc.members.length; first += CHUNK_SIZE) JSON.stringify(doc.members.slice(first, first + CHUNK_SIZE));
  }
}

/** The same for a worker process: intake, the engine and the COPY encoding of results. */
export function warmUpScheduleChecks(): void {
  const { members, ...header } = createWarmUpDoc();
  for (let round = 0; round < WARM_UP_ROUNDS; round++) {
    const outcomes = checkMembers(header, 0, members);
    for (const row of outcomeRows("warm-up", outcomes)) encodeCsvLine(row);
    for (const row of checkRows("warm-up", outcomes)) encodeCsvLine(row);
  }
}

/**
 * For the module that handles submissions, at load. Next loads route modules when the server
 * starts, and each bundle layer has its own copy of these modules, so the warm-up has to run from
 * the route's own layer (the instrumentation hook's copy would warm a different one). Skipped
 * while `next build` loads modules to collect page data.
 */
export function warmUpScheduleIntakeAtServerStart(): void {
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  setTimeout(() => {
    try {
      const started = performance.now();
      warmUpScheduleIntake();
      console.log(`[sagline] schedule intake warmed up in ${Math.round(performance.now() - started)} ms`);
    } catch (error) {
      console.error("[sagline] schedule intake warm-up failed", error);
    }
  }, 0);
}

/**
 * For the instrumentation hook. Next loads a route module on its first request, so this asks the
 * server for the submission route once it listens (an unauthenticated GET, answered 401): the
 * route then loads, and warms its own copy of the intake, before any real submission arrives.
 */
export function loadScheduleRouteAtServerStart(): void {
  let attempts = 0;
  const attempt = () => {
    attempts += 1;
    const port = process.env.PORT;
    const retry = () => {
      if (attempts < 40) setTimeout(attempt, 250).unref();
      else console.error("[sagline] could not load the schedule route at start; the first submission will warm it");
    };
    if (!port) return retry();
    fetch(`http://127.0.0.1:${port}/api/v1/schedules`, { signal: AbortSignal.timeout(5000) }).then((response) => void response.body?.cancel(), retry);
  };
  setTimeout(attempt, 100).unref();
}
