// Recognises PostgreSQL's unique_violation (SQLSTATE 23505) through Drizzle's wrapped errors.
export function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
}
