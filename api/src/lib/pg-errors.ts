// Recognising PostgreSQL's refusals (drizzle wraps the driver's error in `cause`).

/** Postgres unique violation (23505) on the named constraint or index. */
export function isUniqueViolation(err: unknown, constraint?: string): boolean {
  const e = (err as { cause?: unknown })?.cause ?? err;
  const pgErr = e as { code?: string; constraint?: string };
  return pgErr?.code === '23505' && (!constraint || pgErr.constraint === constraint);
}

/** Postgres foreign-key violation (23503). */
export function isForeignKeyViolation(err: unknown): boolean {
  const e = ((err as { cause?: unknown })?.cause ?? err) as { code?: string };
  return e?.code === '23503';
}
