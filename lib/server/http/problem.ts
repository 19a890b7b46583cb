import { randomUUID } from "node:crypto";

import { isDatabaseUnavailableError } from "@/db/errors";
import { DomainError, domainErrorCodes, type DomainErrorCode, type FieldError } from "@/lib/server/errors";

export const PROBLEM_BASE = "https://sagline.dev/problems/";

/** The problem `type` URI of a code, as toProblem writes it (and the OpenAPI document lists it). */
export function problemTypeUri(code: DomainErrorCode | "internal"): string {
  return PROBLEM_BASE + code.replaceAll("_", "-");
}

export interface ProblemBody {
  type: string;
  title: string;
  status: number;
  detail: string;
  instance?: string;
  errors?: FieldError[];
  requestId?: string;
  [extension: string]: unknown;
}

export function problemResponse(body: ProblemBody, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status: body.status,
    headers: { "content-type": "application/problem+json", "cache-control": "no-store", ...headers },
  });
}

/** Seconds a client is told to wait while PostgreSQL is unreachable: about one restart of it. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

let lastUnavailableLogMs = 0;

/** A lost database is the operator's news, once per 10 s, not a stack trace per request. */
function databaseUnavailable(error: unknown): DomainError {
  const nowMs = Date.now();
  if (nowMs - lastUnavailableLogMs > 10_000) {
    lastUnavailableLogMs = nowMs;
    // The driver's own words (a query error's cause), not the query it was running.
    const cause = error instanceof Error && error.cause instanceof Error ? error.cause : error;
    console.warn(`[sagline] PostgreSQL unavailable, answering 503: ${cause instanceof Error ? cause.message : String(cause)}`);
  }
  return new DomainError(
    "unavailable",
    "The database is not reachable right now. Send the request again after the Retry-After interval (a submission sent with the same Idempotency-Key is stored at most once).",
    [],
    DATABASE_RETRY_AFTER_SECONDS,
  );
}

/**
 * The one place a thrown error becomes RFC 9457 problem+json. Internals never leave the server.
 * A database that cannot be reached (stopped, restarting) is 503 with Retry-After, not 500: the
 * same request succeeds unchanged once it is back.
 */
export function toProblem(thrown: unknown, instance?: string): Response {
  const error = !(thrown instanceof DomainError) && isDatabaseUnavailableError(thrown) ? databaseUnavailable(thrown) : thrown;
  if (error instanceof DomainError) {
    const { status, title } = domainErrorCodes[error.code];
    const headers: Record<string, string> = {};
    if (error.retryAfterSeconds !== undefined) headers["retry-after"] = String(error.retryAfterSeconds);
    return problemResponse(
      {
        type: problemTypeUri(error.code),
        title,
        status,
        detail: error.message,
        ...(instance ? { instance } : {}),
        ...(error.errors.length ? { errors: error.errors } : {}),
        ...error.extensions,
      },
      headers,
    );
  }
  const requestId = randomUUID();
  console.error(`[sagline] unexpected error, request ${requestId}`, error);
  return problemResponse({
    type: problemTypeUri("internal"),
    title: "Internal error",
    status: 500,
    detail: "Something went wrong on our side. Quote the request id if you contact support.",
    requestId,
    ...(instance ? { instance } : {}),
  });
}

export function badOriginProblem(instance: string): Response {
  return toProblem(new DomainError("bad_origin", "Cookie-authenticated writes must come from Sagline's own pages (Origin header)."), instance);
}
