#!/usr/bin/env node
// Sets up everything Lightoff needs on this machine and runs it. Plain Node, no dependencies: it runs
// before `npm ci` on a fresh clone.
//
//   npm start   install dependencies if needed, start our PostgreSQL on 127.0.0.1 (data in .data/),
//               migrate, seed the demo, start the SMTP sink, build what changed, serve the built app.
//               `npm start -- --rebuild` builds even when nothing changed.
//   npm run dev the same with the API under `node --watch` and the Vite dev server.
//   npm test    typecheck, lint, unit + API tests, build, end-to-end tests in Chromium, each against a
//               throwaway database that is dropped afterwards. Subsets:
//                 npm test -- --only unit            (steps: typecheck, lint, unit, api, e2e)
//                 npm test -- --only unit,api        --skip typecheck,lint
//                 npm test -- --only api tests/api/auth.test.ts   (extra arguments go to vitest)
//
// Environment: PORT (3000), LIGHTOFF_PGPORT (54329), SMTP_PORT (1025), MAILDEV_WEB_PORT (1080),
// VITE_PORT (5173, dev only), NODE_ENV (development), CHROMIUM_PATH (/usr/bin/chromium),
// LIGHTOFF_TEST_TIMEOUT_MIN (15: the whole test run is stopped and fails past it).
import { cleanUp, installSignalHandlers, isInterrupted, isServing } from './lib/lifecycle.mjs';
import { BootstrapError, red } from './lib/log.mjs';
import { dev, start } from './lib/serve.mjs';
import { test } from './lib/test-run.mjs';

async function main() {
  const [mode, ...args] = process.argv.slice(2);
  const modes = { start, dev, test: () => test(args) };
  if (!modes[mode]) {
    process.stderr.write(
      'usage: node api/scripts/bootstrap.mjs start|dev|test [options]  (see the comment at the top)\n',
    );
    return 2;
  }
  installSignalHandlers();
  try {
    await modes[mode]();
    // A server stopped on request has done its job; an interrupted set-up or test run has not.
    return isInterrupted() && !isServing() ? 130 : 0;
  } catch (error) {
    if (isInterrupted()) return 130;
    if (error instanceof BootstrapError) process.stderr.write(`\n${red('lightoff ›')} ${error.message}\n`);
    else process.stderr.write(`\n${red('lightoff ›')} unexpected failure:\n${error.stack ?? error}\n`);
    return error.exitCode ?? 1;
  } finally {
    await cleanUp();
  }
}

// Exit explicitly: a lingering socket or timer must not keep a finished run alive.
process.exit(await main());
