// Child processes: one-shot commands (captured, or streamed with a prefix) and long-running services
// started in their own process group, so a service and everything it forks stop together by pid.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { BootstrapError } from './log.mjs';

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Prefix every line of a stream, for output of commands that run side by side. */
function pipeLines(stream, target, prefix) {
  let rest = '';
  stream.setEncoding('utf8');
  stream.on('data', (chunk) => {
    const lines = (rest + chunk).split('\n');
    rest = lines.pop() ?? '';
    for (const line of lines) target.write(`${prefix}${line}\n`);
  });
  stream.on('end', () => {
    if (rest) target.write(`${prefix}${rest}\n`);
  });
}

const commands = new Set();
const services = new Set();

/** Stop the one-shot commands in flight (an interrupt: the step fails, clean-up follows). */
export function killCommands(signal = 'SIGTERM') {
  for (const child of commands) killGroup(child, signal);
}

/** Last resort on a forced exit: every command and service, at once. */
export function killEverything(signal = 'SIGKILL') {
  for (const child of [...commands, ...services]) killGroup(child, signal);
}

/**
 * Run a command to completion.
 * output: 'inherit' (straight to the terminal), 'capture' (returned; shown only on failure),
 * or a string prefix for each streamed line.
 */
export function run(command, args, { cwd, env, output = 'inherit', check = true, input } = {}) {
  return new Promise((resolve, reject) => {
    const capture = output === 'capture';
    const child = spawn(command, args, {
      cwd,
      env: env ?? process.env,
      // Own process group: an interrupt is delivered by us, in order, not by the terminal.
      detached: true,
      stdio: [
        input === undefined ? 'ignore' : 'pipe',
        output === 'inherit' ? 'inherit' : 'pipe',
        output === 'inherit' ? 'inherit' : 'pipe',
      ],
    });
    commands.add(child);
    let stdout = '';
    let stderr = '';
    if (capture) {
      child.stdout.setEncoding('utf8').on('data', (d) => (stdout += d));
      child.stderr.setEncoding('utf8').on('data', (d) => (stderr += d));
    } else if (output !== 'inherit') {
      pipeLines(child.stdout, process.stdout, output);
      pipeLines(child.stderr, process.stderr, output);
    }
    if (input !== undefined) child.stdin.end(input);
    child.on('error', (error) => {
      commands.delete(child);
      reject(new BootstrapError(`could not run ${command}: ${error.message}`, { cause: error }));
    });
    child.on('close', (code, signal) => {
      commands.delete(child);
      const result = { code: code ?? 128, signal, stdout, stderr };
      if (check && code !== 0) {
        const shown = [stdout.trim(), stderr.trim()].filter(Boolean).join('\n');
        const how = signal ? `was stopped by ${signal}` : `exited with ${code}`;
        reject(new BootstrapError(`\`${[command, ...args].join(' ')}\` ${how}${shown ? `:\n${shown}` : ''}`));
      } else resolve(result);
    });
  });
}

/** Start a long-running service in its own process group; `exited` settles when it ends. */
export function startService(command, args, { cwd, env, stdio = 'inherit' } = {}) {
  const child = spawn(command, args, {
    cwd,
    env: env ?? process.env,
    detached: true,
    stdio: ['ignore', ...(Array.isArray(stdio) ? stdio : [stdio, stdio])],
  });
  services.add(child);
  child.exited = new Promise((resolve) => {
    child.on('error', (error) => resolve({ code: 127, signal: null, error }));
    child.on('exit', (code, signal) => resolve({ code, signal }));
  });
  child.exited.then(() => services.delete(child));
  return child;
}

export function killGroup(child, signal = 'SIGTERM') {
  if (!child?.pid || child.exitCode !== null || child.signalCode !== null) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    try {
      child.kill(signal);
    } catch {
      // already gone
    }
  }
}

/** SIGTERM the service's group, then SIGKILL after `graceMs` if it is still there. */
export async function stopService(child, graceMs = 10_000) {
  if (!child?.pid || child.exitCode !== null || child.signalCode !== null) return;
  killGroup(child, 'SIGTERM');
  const timer = setTimeout(() => killGroup(child, 'SIGKILL'), graceMs);
  await child.exited;
  clearTimeout(timer);
  // Anything the service forked and left behind in its group goes too.
  try {
    process.kill(-child.pid, 'SIGKILL');
  } catch {
    // group already empty
  }
}

export function isAlive(pid) {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
  } catch (error) {
    if (error.code !== 'EPERM') return false;
  }
  // A zombie answers signals but is dead for our purposes.
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3) !== 'Z';
  } catch {
    return true;
  }
}

/** The command line of a live process ('' when unknown), to tell our own leftovers from strangers. */
export function commandLineOf(pid) {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').replaceAll('\0', ' ').trim();
  } catch {
    return '';
  }
}

/** Kill a process (and its group) that an earlier run of ours left behind, if it still looks like ours. */
export async function killLeftover(pid, looksLike) {
  if (!isAlive(pid) || !commandLineOf(pid).includes(looksLike)) return false;
  for (const target of [-pid, pid]) {
    try {
      process.kill(target, 'SIGTERM');
    } catch {
      // not a group leader, or gone
    }
  }
  for (let i = 0; i < 50 && isAlive(pid); i++) await new Promise((r) => setTimeout(r, 100));
  if (isAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}
