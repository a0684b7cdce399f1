import { sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Db } from '../db/client';

/**
 * express-rate-limit store on our own PostgreSQL table, so limits hold across API instances.
 * Written here because the published Postgres store runs its own migration tool and pins an
 * older `pg`; this one is a single upsert on a table our Drizzle migrations own.
 */
export class PgRateLimitStore implements Store {
  private windowMs = 60_000;
  readonly localKeys = false;

  constructor(
    private readonly db: Db,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const { rows } = await this.db.$client.query<{ hits: number; reset_at: Date }>(
      'select hits, reset_at from rate_limit_hits where key = $1 and reset_at > now()',
      [this.prefix + key],
    );
    const row = rows[0];
    return row ? { totalHits: row.hits, resetTime: row.reset_at } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const result = await this.db.execute<{ hits: number; reset_at: Date }>(sql`
      insert into rate_limit_hits (key, hits, reset_at)
      values (${this.prefix + key}, 1, now() + make_interval(secs => ${this.windowMs / 1000}))
      on conflict (key) do update set
        hits = case when rate_limit_hits.reset_at <= now() then 1 else rate_limit_hits.hits + 1 end,
        reset_at = case when rate_limit_hits.reset_at <= now() then excluded.reset_at else rate_limit_hits.reset_at end
      returning hits, reset_at`);
    const row = result.rows[0]!;
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await this.db.execute(
      sql`update rate_limit_hits set hits = greatest(hits - 1, 0) where key = ${this.prefix + key}`,
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.db.execute(sql`delete from rate_limit_hits where key = ${this.prefix + key}`);
  }
}
