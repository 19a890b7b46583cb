/** PostgreSQL's unique_violation (SQLSTATE 23505), as postgres-js reports it. */
export function isUniqueViolation(error: unknown): boolean {
  return typeof error === "object" && error !== null && (error as { code?: unknown }).code === "23505";
}
