// Starts the built API (which serves the built web app) on a free port for the end-to-end tests, with
// the test database from `npm test`; builds first when dist/ is missing or older than the sources.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdirSync, openSync, closeSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { ensureBuilt } from '../../api/scripts/lib/build.mjs';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the built app is served, e.g. http://127.0.0.1:41234 (no trailing slash). */
    baseUrl: string;
  }
}

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const LOG_FILE = join(ROOT, '.data', 'e2e-server.log');

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() =>
        typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port')),
      );
    });
  });
}

function logTail(lines = 30): string {
  try {
    return readFileSync(LOG_FILE, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no server log)';
  }
}

async function waitUntilReady(url: string, server: ChildProcess, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = 'no answer';
  while (Date.now() < deadline) {
    if (server.exitCode !== null || server.signalCode !== null) {
      throw new Error(
        `the built API exited (${server.signalCode ?? server.exitCode}) before it was ready. ${LOG_FILE}:\n${logTail()}`,
      );
    }
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (response.status === 200) return;
      last = `HTTP ${response.status}`;
    } catch (error) {
      last = error instanceof Error ? error.message : String(error);
    }
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
  throw new Error(
    `the built API did not answer 200 at ${url} within ${timeoutMs / 1000} s (last: ${last}). ${LOG_FILE}:\n${logTail()}`,
  );
}

async function stop(server: ChildProcess): Promise<void> {
  if (server.exitCode !== null || server.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => server.once('exit', () => resolve()));
  server.kill('SIGTERM');
  const timer = setTimeout(() => server.kill('SIGKILL'), 10_000);
  await exited;
  clearTimeout(timer);
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    throw new Error(
      'DATABASE_URL is not set: run the end-to-end tests with `npm test -- --only e2e`, which makes a test database',
    );
  }
  await ensureBuilt(ROOT, ['web', 'api']);

  const port = await freePort();
  mkdirSync(join(ROOT, '.data'), { recursive: true });
  const log = openSync(LOG_FILE, 'w');
  const server = spawn(process.execPath, [join(ROOT, 'dist/api/start.js')], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      WEB_DIST: join(ROOT, 'dist/web'),
      SESSION_SECRET: randomBytes(48).toString('base64url'),
      // Every test comes from 127.0.0.1, and the API tests' requests before this run count against
      // the same per-address limits (they are kept in the database): only the per-e-mail ones apply.
      LOGIN_LIMIT_PER_IP: '100000',
      RESET_LIMIT_PER_IP: '100000',
    },
    stdio: ['ignore', log, log],
  });
  closeSync(log);

  const baseUrl = `http://127.0.0.1:${port}`;
  try {
    await waitUntilReady(`${baseUrl}/api/ready`, server, 60_000);
  } catch (error) {
    await stop(server);
    throw error;
  }
  project.provide('baseUrl', baseUrl);
  process.env.E2E_BASE_URL = baseUrl;

  return async () => {
    await stop(server);
  };
}
