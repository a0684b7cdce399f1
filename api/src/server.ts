import { createServer, type Server as HttpServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Logger } from 'pino';
import { createApp } from './app';
import type { Config } from './config';
import { noRealtime, type AppContext } from './context';
import { createDb, type DbHandle } from './db/client';
import { createLogger } from './lib/logger';
import { attachRealtime, type Io } from './realtime/io';
import { createJobs } from './lib/jobs';
import { jobQueueSettings, registerWorkers } from './workers';
import { DiskStorage, S3Storage, type FileStorage } from './features/attachments/storage';

/** S3 when a bucket is configured, else a folder on local disk. */
function createStorage(config: Config): FileStorage {
  if (config.S3_BUCKET) {
    return S3Storage.fromConfig({
      bucket: config.S3_BUCKET,
      region: config.S3_REGION,
      endpoint: config.S3_ENDPOINT,
      accessKeyId: config.S3_ACCESS_KEY_ID,
      secretAccessKey: config.S3_SECRET_ACCESS_KEY,
    });
  }
  return new DiskStorage(config.UPLOAD_DIR);
}

export interface RunningServer {
  url: string;
  port: number;
  ctx: AppContext;
  io: Io;
  http: HttpServer;
  stop(): Promise<void>;
}

/** Starts the API and the web app on one HTTP server; port 0 picks a free port (tests). */
export async function startServer(config: Config, options: { logger?: Logger } = {}): Promise<RunningServer> {
  const logger = options.logger ?? createLogger(config);
  const dbHandle: DbHandle = createDb(config.DATABASE_URL);
  const jobs = createJobs(config.DATABASE_URL, logger, {
    schema: config.JOBS_SCHEMA,
    queues: jobQueueSettings(config),
  });
  const ctx: AppContext = {
    config,
    db: dbHandle.db,
    logger,
    realtime: noRealtime,
    storage: createStorage(config),
    jobs,
  };
  const created = createApp(ctx);
  const http = createServer(created.app);
  const { io, realtime } = attachRealtime(ctx, http, created);
  ctx.realtime = realtime;
  // Workers start in the background: a database that is down must not stop the server starting.
  registerWorkers(ctx).catch((err: unknown) => logger.error({ err }, 'background workers did not start'));

  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(config.PORT, config.HOST, () => resolve());
  });
  const { port } = http.address() as AddressInfo;
  const url = `http://${config.HOST.includes(':') ? `[${config.HOST}]` : config.HOST}:${port}`;
  return { url, port, ctx, io, http, stop: () => stopServer({ io, http, dbHandle, jobs }) };
}

async function stopServer(parts: {
  io: Io;
  http: HttpServer;
  dbHandle: DbHandle;
  jobs: AppContext['jobs'];
}): Promise<void> {
  await new Promise<void>((resolve) => parts.io.close(() => resolve()));
  parts.http.closeAllConnections();
  await new Promise<void>((resolve) => parts.http.close(() => resolve()));
  await parts.jobs.stop();
  await parts.dbHandle.close();
}
