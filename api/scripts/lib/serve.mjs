// `npm start` (the built app) and `npm run dev` (watchers): database, demo seed, mail sink, servers,
// then serve until Ctrl+C or until a server dies.
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuilt } from './build.mjs';
import { loginsTable } from './demo.mjs';
import { allOrThrow, interruption, markServing, onCleanup } from './lifecycle.mjs';
import { BootstrapError, bold, green, say, seconds, step } from './log.mjs';
import { startMailSink } from './maildev.mjs';
import { isPortFree, parsePort, waitForHttp } from './net.mjs';
import { isAlive, killLeftover, startService, stopService } from './proc.mjs';
import { readOrCreateSecret } from './secrets.mjs';
import { DATA, ROOT, migrate, node, preparePostgres } from './setup.mjs';

const SERVER_STATE = join(DATA, 'server.json');

function serverEnv({ port, databaseUrl, sessionSecret, mail, nodeEnv }) {
  return {
    ...process.env,
    NODE_ENV: nodeEnv,
    PORT: String(port),
    HOST: '127.0.0.1',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: sessionSecret,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
    MAIL_WEB_URL: mail.webUrl,
    APP_URL: process.env.APP_URL ?? `http://localhost:${port}`,
    // The terminal shows warnings and errors; LOG_LEVEL=info adds a line per request.
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
  };
}

/** A server an earlier run left behind (its bootstrap was killed) still holds the port: stop it. */
async function stopLeftoverServer() {
  let state;
  try {
    state = JSON.parse(readFileSync(SERVER_STATE, 'utf8'));
  } catch {
    return; // no record
  }
  // A live owner is another run in this checkout: its server is none of our business.
  if (isAlive(state.owner)) return;
  if (await killLeftover(state.pid, state.mark)) {
    say(`stopped a server left running by an earlier run (pid ${state.pid})`);
  }
  rmSync(SERVER_STATE, { force: true });
}

/** Set up the database, mail sink and (for start) the build: the part `start` and `dev` share. */
async function prepareServing({ build }) {
  const results = [];
  const port = parsePort(process.env.PORT, 3000, 'PORT');
  const pg = await preparePostgres(results);
  await stopLeftoverServer();
  if (!(await isPortFree(port)))
    throw new BootstrapError(`port ${port} on 127.0.0.1 is in use: set PORT to a free port`);
  const sessionSecret = readOrCreateSecret(join(DATA, 'session-secret'), 48);
  const smtpPort = parsePort(process.env.SMTP_PORT, 1025, 'SMTP_PORT');
  const webPort = parsePort(process.env.MAILDEV_WEB_PORT, 1080, 'MAILDEV_WEB_PORT');
  let mail;
  const databaseUrl = pg.url('lightoff');
  const nodeEnv = process.env.NODE_ENV || 'development';
  await allOrThrow([
    step(
      'database',
      async () => {
        await pg.ensureDatabase('lightoff');
        const env = {
          ...process.env,
          NODE_ENV: nodeEnv,
          DATABASE_URL: databaseUrl,
          SESSION_SECRET: sessionSecret,
        };
        await migrate(env);
        await node(['--import', 'tsx', 'api/scripts/seed.ts'], { env, output: '[seed] ' });
      },
      results,
    ),
    step(
      'mail sink',
      async () => {
        mail = await startMailSink({
          root: ROOT,
          smtpPort,
          webPort,
          stateFile: join(DATA, 'maildev.json'),
          logFile: join(DATA, 'maildev.log'),
        });
        onCleanup('stop the mail sink', () => mail.stop());
      },
      results,
    ),
    build
      ? step(
          'build',
          () => ensureBuilt(ROOT, ['web', 'api'], { force: process.argv.includes('--rebuild') }),
          results,
        )
      : null,
  ]);
  return { port, env: serverEnv({ port, databaseUrl, sessionSecret, mail, nodeEnv }), mail };
}

function runServer(command, args, env, mark) {
  const server = startService(command, args, { cwd: ROOT, env });
  mkdirSync(DATA, { recursive: true });
  writeFileSync(SERVER_STATE, JSON.stringify({ pid: server.pid, owner: process.pid, mark }));
  onCleanup('stop the server', async () => {
    await stopService(server, 10_000);
    rmSync(SERVER_STATE, { force: true });
  });
  return server;
}

/** Serve until interrupted (exit 0) or until a service dies (exit 1, the rest stopped). */
async function serveUntilStopped(watched) {
  markServing();
  const outcome = await Promise.race([
    interruption.then(() => null),
    ...watched.map(([name, child]) => child.exited.then((result) => ({ name, result }))),
  ]);
  if (outcome) {
    const { name, result } = outcome;
    throw new BootstrapError(
      `${name} stopped unexpectedly (${result.signal ?? `exit code ${result.code}`}); stopping the rest`,
    );
  }
}

function banner(lines) {
  process.stdout.write(`\n${lines.join('\n')}\n\n`);
}

export async function start() {
  const begun = Date.now();
  const { port, env, mail } = await prepareServing({ build: true });
  const entry = join(ROOT, 'dist/api/start.js');
  const server = runServer(
    process.execPath,
    [entry],
    { ...env, WEB_DIST: join(ROOT, 'dist/web') },
    'dist/api/start.js',
  );
  await waitForHttp(`http://127.0.0.1:${port}/api/ready`, {
    child: server,
    timeoutMs: 60_000,
    what: 'the API server',
  });
  banner([
    `${green(bold('Lightoff is running'))} ${seconds(Date.now() - begun)} after start`,
    '',
    `  app        ${bold(`http://localhost:${port}`)}`,
    `  mail sink  ${mail.webUrl}   (every e-mail the app sends lands here)`,
    '',
    'Demo sign-ins:',
    loginsTable(),
    '',
    'Ctrl+C stops the server, the mail sink and the database (data stays in .data/).',
  ]);
  await serveUntilStopped([['the API server', server]]);
}

export async function dev() {
  const { port, env, mail } = await prepareServing({ build: false });
  const vitePort = parsePort(process.env.VITE_PORT, 5173, 'VITE_PORT');
  if (!(await isPortFree(vitePort)))
    throw new BootstrapError(`port ${vitePort} is in use: set VITE_PORT to a free port`);
  const api = runServer(
    process.execPath,
    ['--import', 'tsx', '--watch', 'api/src/start.ts'],
    env,
    'api/src/start.ts',
  );
  const apiUrl = `http://127.0.0.1:${port}`;
  const vite = startService(
    process.execPath,
    [
      join(ROOT, 'node_modules/vite/bin/vite.js'),
      '--host',
      '127.0.0.1',
      '--port',
      String(vitePort),
      '--strictPort',
    ],
    { cwd: ROOT, env: { ...process.env, API_PORT: String(port), API_URL: apiUrl } },
  );
  onCleanup('stop Vite', () => stopService(vite, 5_000));
  await waitForHttp(`${apiUrl}/api/ready`, { child: api, timeoutMs: 60_000, what: 'the API server' });
  await waitForHttp(`http://127.0.0.1:${vitePort}/`, {
    child: vite,
    timeoutMs: 60_000,
    what: 'the Vite dev server',
  });
  banner([
    green(bold('Lightoff dev servers are running')),
    `  app (Vite, hot reload)  ${bold(`http://localhost:${vitePort}`)}`,
    `  API (restarts on save)  ${apiUrl}`,
    `  mail sink               ${mail.webUrl}`,
    '',
    loginsTable(),
  ]);
  await serveUntilStopped([
    ['the API server', api],
    ['the Vite dev server', vite],
  ]);
}
