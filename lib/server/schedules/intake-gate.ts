import { DomainError } from "@/lib/server/errors";

/** Stated in the API docs: the largest body POST /api/v1/schedules (and the upload) reads. */
export const MAX_SCHEDULE_BODY_BYTES = 64 * 1024 * 1024;

/**
 * What one submission of the largest body can hold at its peak: the body, about as much again
 * for its chunk texts, and the per-member bookkeeping up to the member cap
 * (tests/hostile/stalls/intake-memory.test.ts measures 2x the body plus 64 MiB).
 */
export const INTAKE_PEAK_BYTES = 2 * MAX_SCHEDULE_BODY_BYTES + 64 * 1024 * 1024;

/** Memory the web process may spend on submissions at once; README's reliability section states it. */
export const DEFAULT_INTAKE_MEMORY_MB = 512;

/** Seconds a refused submitter is told to wait: about one intake of the largest body. */
export const INTAKE_RETRY_AFTER_SECONDS = 5;

/** Submissions read and checked at once by this process: the budget over one intake's peak, at least one. */
export function computeIntakePermits(memoryMb: number): number {
  return Math.max(1, Math.floor((memoryMb * 1024 * 1024) / INTAKE_PEAK_BYTES));
}

interface IntakeGate {
  permits: number;
  inUse: number;
}

// One gate per process: Next can load a module once per bundle layer, so it lives on globalThis.
const GATE_KEY = Symbol.for("sagline.scheduleIntakeGate");

function getGate(): IntakeGate {
  const holder = globalThis as unknown as Record<symbol, IntakeGate | undefined>;
  const memoryMb = Number(process.env.SCHEDULE_INTAKE_MEMORY_MB ?? DEFAULT_INTAKE_MEMORY_MB);
  holder[GATE_KEY] ??= { permits: computeIntakePermits(Number.isFinite(memoryMb) && memoryMb > 0 ? memoryMb : DEFAULT_INTAKE_MEMORY_MB), inUse: 0 };
  return holder[GATE_KEY];
}

/**
 * Runs one submission's body reading, intake and storing under a permit, or refuses at once with
 * 503 and Retry-After when every permit is taken (before the body is read, so a refused body is
 * never held). Six of the largest bodies at once cannot take the process past its budget.
 */
export async function withIntakePermit<T>(run: () => Promise<T>): Promise<T> {
  const gate = getGate();
  if (gate.inUse >= gate.permits) {
    throw new DomainError(
      "unavailable",
      `The server is reading ${gate.inUse} other schedule${gate.inUse === 1 ? "" : "s"} and takes no more at once; nothing was stored. Send it again after the Retry-After interval.`,
      [],
      INTAKE_RETRY_AFTER_SECONDS,
    );
  }
  gate.inUse += 1;
  try {
    return await run();
  } finally {
    gate.inUse -= 1;
  }
}
