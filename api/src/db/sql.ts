import { sql, type SQL, type SQLWrapper } from 'drizzle-orm';

/** A timestamp column as an ISO-8601 UTC string (null stays null), the way the API sends times. */
export const isoTime = (col: SQLWrapper | SQL) =>
  sql<string>`to_char((${col}) at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
