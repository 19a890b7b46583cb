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
  // Public API (api/v1): request shape and API-key authentication.
  bad_request: { status: 400, title: "Malformed request" },
  unsupported_media_type: { status: 415, title: "Unsupported media type" },
  api_key_in_url: { status: 400, title: "API key in URL refused" },
  api_key_required: { status: 401, title: "API key required" },
  invalid_api_key: { status: 401, title: "Invalid API key" },
  insufficient_scope: { status: 403, title: "Insufficient scope" },
  // Idempotency-Key (IETF draft): same key, other payload; same key while the first still runs.
  idempotency_key_reused: { status: 422, title: "Idempotency key reused with another request" },
  idempotency_in_flight: { status: 409, title: "Request with this idempotency key still in progress" },
  // A retired schedule format (CHANGELOG.md): refused before its fields are read with another meaning.
  schedule_format_retired: { status: 422, title: "Schedule format retired" },
  // Signed result-download links (webhooks): tampered or for another purpose, and past their expiry.
  download_link_invalid: { status: 403, title: "Download link refused" },
  download_link_expired: { status: 410, title: "Download link expired" },
} as const;

export type DomainErrorCode = keyof typeof domainErrorCodes;

export interface FieldError {
  /** JSON pointer or form field name; for CSV input the member's pointer when known. */
  pointer?: string;
  message: string;
  /** CSV input: spreadsheet row (header = 1), physical line, column header, and an error code. */
  row?: number;
  line?: number;
  column?: string;
  code?: string;
}

export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly errors: FieldError[] = [],
    readonly retryAfterSeconds?: number,
    /** Extra problem members, e.g. `errorCount` when the list is cut at its cap. */
    readonly extensions: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "DomainError";
  }
}

export function assertFound<T>(value: T | null | undefined, what: string): T {
  if (value === null || value === undefined) throw new DomainError("not_found", `${what} was not found.`);
  return value;
}
