import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };

export interface DbHandle {
  db: Db;
  pool: pg.Pool;
  close(): Promise<void>;
}

/** One pool per process; Drizzle maps camelCase fields to snake_case columns. */
export function createDb(url: string, options: { max?: number } = {}): DbHandle {
  const pool = new pg.Pool({
    connectionString: url,
    max: options.max ?? 10,
    idleTimeoutMillis: 30_000,
    connectionTimeoutMillis: 5_000,
    // Title suggestions use pg_trgm's `<%` (word similarity, index-backed) at this threshold; set
    // once per connection so a suggestion is one statement rather than a transaction of three.
    options: '-c pg_trgm.word_similarity_threshold=0.45',
  });
  // An idle client that loses its connection must not crash the process.
  pool.on('error', () => {});
  const db = drizzle(pool, { schema, casing: 'snake_case' }) as Db;
  return { db, pool, close: () => pool.end() };
}

/** A transaction handle; repositories accept either so services decide where transactions go. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type Executor = Db | Tx;
