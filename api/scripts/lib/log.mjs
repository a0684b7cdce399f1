// Console output of the start/test orchestration: one voice, timed steps, and a failure type whose
// message is meant for the person at the terminal (no stack trace).

const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const paint = (code) => (text) => (useColour ? `\u001b[${code}m${text}\u001b[0m` : text);
export const bold = paint('1');
export const dim = paint('2');
export const green = paint('32');
export const red = paint('31');
export const yellow = paint('33');

/** A failure explained in words; bootstrap prints the message alone and exits non-zero. */
export class BootstrapError extends Error {
  constructor(message, { exitCode = 1, cause } = {}) {
    super(message, { cause });
    this.name = 'BootstrapError';
    this.exitCode = exitCode;
  }
}

export function say(message) {
  process.stdout.write(`${dim('lightoff ›')} ${message}\n`);
}

export function warn(message) {
  process.stderr.write(`${yellow('lightoff ›')} ${message}\n`);
}

export function seconds(ms) {
  return `${(ms / 1000).toFixed(1)} s`;
}

/**
 * Runs fn as a named step, prints its duration, and records it in `results` when given.
 * `announce` prints a heading first, for steps whose own output follows.
 */
export async function step(name, fn, results, { announce = false } = {}) {
  if (announce) process.stdout.write(`\n${bold(`── ${name}`)}\n`);
  const started = Date.now();
  try {
    const value = await fn();
    const ms = Date.now() - started;
    results?.push({ name, ok: true, ms });
    say(`${green('ok')}   ${name} ${dim(seconds(ms))}`);
    return value;
  } catch (error) {
    const ms = Date.now() - started;
    results?.push({ name, ok: false, ms });
    say(`${red('FAIL')} ${name} ${dim(seconds(ms))}`);
    throw error;
  }
}
