/** Failures the domain knows about. The HTTP layer and the actions map each code to one answer. */
export const domainErrorCodes = {
  unauthenticated: { status: 401, title: "Sign-in required" },
  forbidden: { status: 403, title: "Not permitted" },
  not_found: { status: 404, title: "Not found" },
  conflict: { status: 409, title: "Conflict" },
  invalid_input: { status: 422, title: "Invalid input" },
  too_large: { status: 413, title: "Request too large" },
  rate_limited: { status: 429, title: "Too many requests" },
  bad_origin: { status: 403, title: "Cross-site request refused" },
  unavailable: { status: 503, title: "Service unavailable" },
} as const;

export type DomainErrorCode = keyof typeof domainErrorCodes;

export interface FieldError {
  /** JSON pointer or form field name. */
  pointer: string;
  message: string;
}

export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly errors: FieldError[] = [],
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
    this.name = "DomainError";
  }
}

export function assertFound<T>(value: T | null | undefined, what: string): T {
  if (value === null || value === undefined) throw new DomainError("not_found", `${what} was not found.`);
  return value;
}
