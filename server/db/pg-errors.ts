/**
 * PostgreSQL error codes the services turn into answers. Drizzle wraps the driver's error, so the code is read
 * from the error itself or from its cause.
 */
const UNIQUE_VIOLATION = "23505";

/** True when `err` is a unique-key violation (SQLSTATE 23505), e.g. the loser of a race for the same row. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null | undefined;
  return e?.code === UNIQUE_VIOLATION || e?.cause?.code === UNIQUE_VIOLATION;
}
