/**
 * Whether a database error is PostgreSQL's unique_violation (SQLSTATE 23505) on the named
 * constraint. Drizzle wraps the driver's error, so the code may sit on its `cause`.
 */
export function isUniqueViolation(err: unknown, constraint: string): boolean {
  for (let e: unknown = err, depth = 0; e && typeof e === 'object' && depth < 3; depth++) {
    const { code, constraint: name } = e as { code?: unknown; constraint?: unknown };
    if (code === '23505') return name === constraint;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}
