// PostgreSQL failures the HTTP layer needs to tell apart, without ever seeing a Postgres code itself.

/** SQLSTATEs that mean "the server cannot serve you now", not "your request is wrong". */
const UNAVAILABLE_SQLSTATES = new Set([
  "57P01", // admin_shutdown: the server is stopping (a restart in progress)
  "57P02", // crash_shutdown
  "57P03", // cannot_connect_now: the server is starting up or recovering
  "53300", // too_many_connections
]);

/** Error codes of postgres-js for a lost or impossible connection, and the socket errors beneath them. */
const CONNECTION_CODES = new Set([
  "CONNECTION_CLOSED",
  "CONNECTION_ENDED",
  "CONNECTION_DESTROYED",
  "CONNECT_TIMEOUT",
  "ECONNREFUSED",
  "ECONNRESET",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "EAI_AGAIN",
]);

function isUnavailableCode(code: unknown): boolean {
  if (typeof code !== "string") return false;
  // Class 08: connection exception (the connection failed or was lost mid-way).
  return CONNECTION_CODES.has(code) || UNAVAILABLE_SQLSTATES.has(code) || /^08[0-9A-Z]{3}$/.test(code);
}

/**
 * True when the error (or one it wraps: Drizzle's query errors carry the driver's as `cause`, and a
 * connection to several addresses fails with an AggregateError) says the database could not be
 * reached or is restarting. Such a request may succeed unchanged a little later: 503, not 500.
 */
export function isDatabaseUnavailableError(error: unknown): boolean {
  const pending: unknown[] = [error];
  // Bounded: a cause chain or an aggregate is walked to a few levels at most.
  for (let seen = 0; pending.length > 0 && seen < 16; seen++) {
    const current = pending.shift();
    if (typeof current !== "object" || current === null) continue;
    const { code, cause, errors } = current as { code?: unknown; cause?: unknown; errors?: unknown };
    if (isUnavailableCode(code)) return true;
    if (cause !== undefined) pending.push(cause);
    if (Array.isArray(errors)) pending.push(...errors.slice(0, 4));
  }
  return false;
}
