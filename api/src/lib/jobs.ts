import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Executor } from '../db/client';

/**
 * Background work kept in PostgreSQL (pg-boss): a job sent inside a transaction is stored with the
 * change that caused it, or not at all, and it survives restarts until a worker completes it.
 */
export interface Jobs {
  /** Stores a job; pass the transaction (`tx`) so the job commits or rolls back with the change. */
  send(queue: string, data: object, options?: SendOptions, tx?: Executor): Promise<string | null>;
  /** Runs `handler` for each job of the queue; a throw retries the job with backoff. */
  work<T extends object>(
    queue: string,
    handler: (data: T, job: PgBoss.Job<T>) => Promise<void>,
  ): Promise<void>;
  /** Waits until the queue has nothing left to do (tests and the reindex script). */
  drain(queue: string, timeoutMs?: number): Promise<void>;
  /** Sends a job to the queue on a cron schedule (UTC); one schedule per queue, kept in PostgreSQL. */
  schedule(queue: string, cron: string): Promise<void>;
  stop(): Promise<void>;
  readonly boss: PgBoss | null;
}

export type SendOptions = Pick<
  PgBoss.SendOptions,
  'startAfter' | 'singletonKey' | 'singletonSeconds' | 'retryLimit' | 'retryDelay'
>;

/** How a queue retries: eight more attempts, 5 s, 10 s, 20 s, … apart (about 20 min in all); kept a week. */
const QUEUE_DEFAULTS = { retryLimit: 8, retryDelay: 5, retryBackoff: true, retentionMinutes: 7 * 24 * 60 };

/**
 * A queue's own settings, over the defaults. `short`: at most one job per `singletonKey` waits at a
 * time (a second send while one waits is dropped and returns null). Retry settings also go on every
 * job sent, so they hold even where the queue was created earlier with other values.
 */
export interface QueueSettings {
  policy?: 'standard' | 'short';
  retryLimit?: number;
  retryDelay?: number;
  retryBackoff?: boolean;
}

export interface JobsOptions {
  /** The PostgreSQL schema pg-boss keeps its tables in (one per isolated set of workers). */
  schema?: string;
  queues?: Record<string, QueueSettings>;
}

/** Lets pg-boss write into a Drizzle transaction: it only needs `executeSql(text, values)`. */
function asBossDb(tx: Executor): PgBoss.Db {
  // Drizzle does not expose the transaction's client in its types; node-postgres sessions keep it
  // as `client` (a pg.Pool for the root handle, a pg.PoolClient inside a transaction).
  const client = (tx as unknown as { session: { client: { query: PgBoss.Db['executeSql'] } } }).session
    .client;
  return { executeSql: (text, values) => client.query(text, values) };
}

export function createJobs(databaseUrl: string, logger: Logger, options: JobsOptions = {}): Jobs {
  const settingsOf = (queue: string): QueueSettings => options.queues?.[queue] ?? {};
  const retryOf = (queue: string) => {
    const { retryLimit, retryDelay, retryBackoff } = settingsOf(queue);
    return Object.fromEntries(
      Object.entries({ retryLimit, retryDelay, retryBackoff }).filter(([, v]) => v !== undefined),
    );
  };
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: options.schema ?? 'pgboss',
    max: 4,
    application_name: 'lightoff-jobs',
    // A finished job (an e-mail's text, with any link in it) is not kept: archived after 10 minutes,
    // deleted an hour later. Waiting and retrying jobs are kept as long as their queue says.
    archiveCompletedAfterSeconds: 600,
    deleteAfterHours: 1,
  });
  boss.on('error', (err) => logger.error({ err }, 'job queue error'));
  // Started on first use, so the server still starts (and reports not-ready) when the database is
  // down; a failed start is tried again by the next use.
  let started: Promise<unknown> | null = null;
  const start = () =>
    (started ??= boss.start().catch((err: unknown) => {
      started = null;
      throw err;
    }));
  const created = new Set<string>();
  const ensureQueue = async (queue: string) => {
    await start();
    if (created.has(queue)) return;
    // Several servers may create the same queue at once on one database; a deadlock between
    // them is harmless, so look again and retry.
    for (let attempt = 1; ; attempt++) {
      try {
        if (!(await boss.getQueue(queue)))
          await boss.createQueue(queue, { name: queue, ...QUEUE_DEFAULTS, ...settingsOf(queue) });
        break;
      } catch (err) {
        if ((err as { code?: string }).code !== '40P01' || attempt >= 5) throw err;
        await new Promise((r) => setTimeout(r, 50 * attempt));
      }
    }
    created.add(queue);
  };

  return {
    boss,
    async send(queue, data, sendOptions = {}, tx) {
      await ensureQueue(queue);
      return boss.send(queue, data, {
        ...retryOf(queue),
        ...sendOptions,
        ...(tx ? { db: asBossDb(tx) } : {}),
      });
    },
    async work(queue, handler) {
      await ensureQueue(queue);
      await boss.work<object>(queue, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
        for (const job of jobs) {
          try {
            await handler(job.data as never, job as never);
          } catch (err) {
            logger.warn({ err, queue, jobId: job.id }, 'job failed; it will be retried');
            throw err;
          }
        }
      });
    },
    async drain(queue, timeoutMs = 15_000) {
      await ensureQueue(queue);
      const until = Date.now() + timeoutMs;
      for (;;) {
        const left = await boss.getQueueSize(queue, { before: 'completed' });
        if (left === 0) return;
        if (Date.now() > until)
          throw new Error(`queue ${queue} still has ${left} job(s) after ${timeoutMs} ms`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
    async schedule(queue, cron) {
      await ensureQueue(queue);
      await boss.schedule(queue, cron, {}, { tz: 'UTC' });
    },
    async stop() {
      if (!started) return;
      await started.catch(() => {});
      await boss.stop({ graceful: true, wait: true, timeout: 5_000 });
    },
  };
}
