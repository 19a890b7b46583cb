import { randomUUID } from "node:crypto";

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

/** The one place a thrown error becomes RFC 9457 problem+json. Internals never leave the server. */
export function toProblem(error: unknown, instance?: string): Response {
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
