// `npm test`: typecheck, lint, unit, API and end-to-end tests against a throwaway database, stopping
// at the first failure, always cleaning up, and ending with one line per step and its duration.
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { ensureBuilt } from './build.mjs';
import { allOrThrow, cleanUp, isInterrupted, onCleanup } from './lifecycle.mjs';
import { BootstrapError, bold, green, red, say, seconds, step, warn } from './log.mjs';
import { startMailSink } from './maildev.mjs';
import { freePort } from './net.mjs';
import { isAlive, killCommands, run } from './proc.mjs';
import { randomSecret } from './secrets.mjs';
import { DATA, ROOT, migrate, preparePostgres } from './setup.mjs';
import { ensureChromium, ensureNodeModules } from './system.mjs';

export const TEST_STEPS = ['typecheck', 'lint', 'unit', 'api', 'e2e'];

function parseTestArgs(args) {
  const pick = (flag) => {
    const values = [];
    for (let i = 0; i < args.length; i++) {
      if (args[i] === flag) values.push(...(args[++i] ?? '').split(','));
      else if (args[i].startsWith(`${flag}=`)) values.push(...args[i].slice(flag.length + 1).split(','));
    }
    return values.filter(Boolean);
  };
  const only = pick('--only');
  const skip = pick('--skip');
  for (const name of [...only, ...skip]) {
    if (!TEST_STEPS.includes(name))
      throw new BootstrapError(`unknown test step "${name}"; steps are ${TEST_STEPS.join(', ')}`);
  }
  const filters = [];
  for (let i = 0; i < args.length; i++) {
    if (args[i] === '--only' || args[i] === '--skip') i++;
    else if (!args[i].startsWith('--only=') && !args[i].startsWith('--skip=')) filters.push(args[i]);
  }
  const selected = new Set(
    TEST_STEPS.filter((name) => (only.length === 0 || only.includes(name)) && !skip.includes(name)),
  );
  return { selected, filters };
}

export async function test(args) {
  const begun = Date.now();
  const { selected, filters } = parseTestArgs(args);
  const results = [];
  const vitest = join(ROOT, 'node_modules/vitest/vitest.mjs');
  const npmRun = (script) => run('npm', ['run', '--silent', script], { cwd: ROOT });
  let testDb;
  // A hung step (say, a test that never ends) must not hold CI forever: the whole run has 15 minutes.
  const limitMin = Number(process.env.LIGHTOFF_TEST_TIMEOUT_MIN) || 15;
  const watchdog = setTimeout(() => {
    warn(`the test run passed its limit of ${limitMin} min: stopping it`);
    results.push({ name: `time limit (${limitMin} min)`, ok: false, ms: Date.now() - begun });
    killCommands('SIGTERM');
  }, limitMin * 60_000);
  watchdog.unref();
  try {
    const needDb = ['unit', 'api', 'e2e'].some((name) => selected.has(name));
    let env = { ...process.env, NODE_ENV: 'test', SESSION_SECRET: randomSecret(48) };
    if (needDb) {
      const pg = await preparePostgres(results);
      const [name, mail] = await allOrThrow([
        step(
          'test database',
          async () => {
            await dropAbandonedTestDatabases(pg);
            const db = `lightoff_test_${process.pid}_${randomBytes(3).toString('hex')}`;
            await pg.ensureDatabase(db);
            onCleanup(`drop the test database ${db}`, () => pg.dropDatabase(db));
            testDb = db;
            await migrate({ ...env, DATABASE_URL: pg.url(db) });
            return db;
          },
          results,
        ),
        step(
          'mail sink',
          async () => {
            const [smtpPort, webPort] = [await freePort(), await freePort()];
            const sink = await startMailSink({
              root: ROOT,
              smtpPort,
              webPort,
              logFile: join(DATA, 'maildev-test.log'),
            });
            onCleanup('stop the mail sink', () => sink.stop());
            return sink;
          },
          results,
        ),
      ]);
      env = {
        ...env,
        DATABASE_URL: pg.url(name),
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: String(mail.smtpPort),
        MAIL_WEB_URL: mail.webUrl,
      };
    } else {
      await step('dependencies', () => ensureNodeModules(ROOT), results);
    }
    if (selected.has('typecheck'))
      await step('typecheck', () => npmRun('typecheck'), results, { announce: true });
    if (selected.has('lint')) await step('lint', () => npmRun('lint'), results, { announce: true });
    // One vitest run per project: each gets its own summary line, and the projects' differing
    // worker settings never have to be reconciled in one run.
    for (const project of ['unit', 'api'].filter((name) => selected.has(name))) {
      await step(
        `vitest ${project}`,
        () => run(process.execPath, [vitest, 'run', '--project', project, ...filters], { cwd: ROOT, env }),
        results,
        { announce: true },
      );
    }
    if (selected.has('e2e')) {
      await step('build web + api', () => ensureBuilt(ROOT, ['web', 'api']), results, { announce: true });
      const chromium = await step('chromium', () => ensureChromium(), results);
      await step(
        'vitest e2e',
        () =>
          run(process.execPath, [vitest, 'run', '--project', 'e2e', ...filters], {
            cwd: ROOT,
            env: { ...env, E2E: '1', CHROMIUM_PATH: chromium },
          }),
        results,
        { announce: true },
      );
    }
  } finally {
    clearTimeout(watchdog);
    await cleanUp();
    summary(results, begun, testDb);
  }
}

/** Test databases of runs that died without cleaning up (the name carries the run's pid). */
async function dropAbandonedTestDatabases(pg) {
  for (const name of await pg.listDatabases('lightoff_test_')) {
    const pid = Number(/^lightoff_test_(\d+)_/.exec(name)?.[1]);
    if (pid && pid !== process.pid && !isAlive(pid)) {
      await pg.dropDatabase(name);
      say(`dropped ${name}, left by an earlier run`);
    }
  }
}

function summary(results, begun, testDb) {
  const failed = results.some((r) => !r.ok) || isInterrupted();
  const width = Math.max(...results.map((r) => r.name.length), 10);
  process.stdout.write(`\n${bold('Summary')}\n`);
  for (const r of results)
    process.stdout.write(
      `  ${r.ok ? green('ok  ') : red('FAIL')}  ${r.name.padEnd(width)}  ${seconds(r.ms).padStart(8)}\n`,
    );
  const verdict = failed ? red(bold(isInterrupted() ? 'interrupted' : 'FAILED')) : green(bold('passed'));
  process.stdout.write(
    `  ${verdict} in ${seconds(Date.now() - begun)}${testDb ? ` (database ${testDb} dropped)` : ''}\n`,
  );
}
