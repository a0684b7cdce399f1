// The life of one bootstrap run: what to undo on the way out (in reverse order), how an interrupt
// is turned into an orderly stop, and the repository's paths.
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { say, warn } from './log.mjs';
import { killCommands, killEverything } from './proc.mjs';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
export const DATA = join(ROOT, '.data');

const cleanups = [];
const exitHooks = [];
let interrupted = null;
// True once the app is up: a stop on request is then a normal end.
let serving = false;
let resolveInterrupt;

/** Settles when the run is asked to stop (SIGINT, SIGTERM, SIGHUP). */
export const interruption = new Promise((resolve) => (resolveInterrupt = resolve));
export const isInterrupted = () => interrupted !== null;
export const isServing = () => serving;
export const markServing = () => (serving = true);

/** Undo `fn` on the way out; the last registered runs first. */
export function onCleanup(name, fn) {
  cleanups.push([name, fn]);
}

/** Synchronous last resort if the process exits without cleaning up (a crash). */
export function onExitSync(fn) {
  exitHooks.push(fn);
}

export async function cleanUp() {
  const what = cleanups.map(([name]) => name);
  while (cleanups.length > 0) {
    const [name, fn] = cleanups.pop();
    try {
      await fn();
    } catch (error) {
      warn(`could not ${name}: ${error.message}`);
    }
  }
  if (serving && what.length > 0) say('stopped; the data stays in .data/');
}

function onSignal(signal) {
  if (interrupted) {
    // Second interrupt: stop everything now.
    killEverything('SIGKILL');
    for (const hook of exitHooks) hook();
    process.exit(130);
  }
  interrupted = signal;
  say(`${signal}: stopping (press Ctrl+C again to force)`);
  killCommands('SIGTERM');
  resolveInterrupt(signal);
}

export function installSignalHandlers() {
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  process.on('SIGHUP', onSignal);
  process.on('exit', () => {
    killEverything('SIGKILL');
    for (const hook of exitHooks) hook();
  });
}

/** Wait for all, then fail with the first failure (so nothing is left half-started unnoticed). */
export async function allOrThrow(promises) {
  const settled = await Promise.allSettled(promises);
  const failed = settled.find((s) => s.status === 'rejected');
  if (failed) throw failed.reason;
  return settled.map((s) => s.value);
}
