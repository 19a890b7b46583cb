import { randomUUID } from "node:crypto";

import { DomainError, domainErrorCodes, type FieldError } from "@/lib/server/errors";

export const PROBLEM_BASE = "https://sagline.dev/problems/";

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
        type: PROBLEM_BASE + error.code.replaceAll("_", "-"),
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
    type: PROBLEM_BASE + "internal",
    title: "Internal error",
    status: 500,
    detail: "Something went wrong on our side. Quote the request id if you contact support.",
    requestId,
    ...(instance ? { instance } : {}),
  });
}

export function badOriginProblem(instance: string): Response {
  return problemResponse({
    type: PROBLEM_BASE + "bad-origin",
    title: "Cross-site request refused",
    status: 403,
    detail: "Cookie-authenticated writes must come from Sagline's own pages (Origin header).",
    instance,
  });
}
