import { DomainError } from "@/lib/server/errors";

/** Stated in the API docs: the largest body POST /api/v1/schedules (and the upload) reads. */
export const MAX_SCHEDULE_BODY_BYTES = 64 * 1024 * 1024;

/** Memory the web process may spend on submissions at once; README's reliability section states it. */
export const DEFAULT_INTAKE_MEMORY_MB = 512;

/** Seconds a refused submitter is told to wait: about one intake of the largest body. */
export const INTAKE_RETRY_AFTER_SECONDS = 5;

/**
 * Memory set aside for one submission: its peak of 2x the body plus the per-member bookkeeping,
 * which is at most about 4x a small body (a member is at least about 100 bytes of JSON and keeps
 * about 400) and 64 MiB at the member cap. A body without a declared length may be the largest.
 */
export function computeIntakeReservationBytes(declaredBytes: number | null): number {
  const bodyBytes = declaredBytes === null ? MAX_SCHEDULE_BODY_BYTES : Math.min(declaredBytes, MAX_SCHEDULE_BODY_BYTES);
  return 2 * bodyBytes + Math.min(4 * bodyBytes, 64 * 1024 * 1024) + 1024 * 1024;
}

interface IntakeGate {
  budgetBytes: number;
  reservedBytes: number;
  running: number;
}

// One gate per process: Next can load a module once per bundle layer, so it lives on globalThis.
const GATE_KEY = Symbol.for("sagline.scheduleIntakeGate");

function getGate(): IntakeGate {
  const holder = globalThis as unknown as Record<symbol, IntakeGate | undefined>;
  const memoryMb = Number(process.env.SCHEDULE_INTAKE_MEMORY_MB ?? DEFAULT_INTAKE_MEMORY_MB);
  const budgetMb = Number.isFinite(memoryMb) && memoryMb > 0 ? memoryMb : DEFAULT_INTAKE_MEMORY_MB;
  holder[GATE_KEY] ??= { budgetBytes: budgetMb * 1024 * 1024, reservedBytes: 0, running: 0 };
  return holder[GATE_KEY];
}

function readDeclaredLength(request: Request): number | null {
  const declared = Number(request.headers.get("content-length") ?? "");
  return request.headers.has("content-length") && Number.isInteger(declared) && declared >= 0 ? declared : null;
}

/**
 * Runs one submission's body reading, intake and storing under a reservation from the process's
 * intake budget (sized from its declared length), or refuses at once with 503 and Retry-After
 * when the reservation does not fit beside those running (before the body is read, so a refused
 * body is never held). With the default budget two of the largest bodies run at once and a
 * third waits for its retry; small submissions fit by the hundred. One always runs when none does.
 */
export async function withIntakePermit<T>(request: Request, run: () => Promise<T>): Promise<T> {
  const gate = getGate();
  const reservation = computeIntakeReservationBytes(readDeclaredLength(request));
  if (gate.running > 0 && gate.reservedBytes + reservation > gate.budgetBytes) {
    throw new DomainError(
      "unavailable",
      `The server is already reading ${gate.running} other schedule${gate.running === 1 ? "" : "s"} and has no room for this one now; nothing was stored. Send it again after the Retry-After interval.`,
      [],
      INTAKE_RETRY_AFTER_SECONDS,
    );
  }
  gate.running += 1;
  gate.reservedBytes += reservation;
  try {
    return await run();
  } finally {
    gate.running -= 1;
    gate.reservedBytes -= reservation;
  }
}
