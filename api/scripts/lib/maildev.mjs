// The SMTP sink (maildev) on 127.0.0.1: catches every e-mail the API sends and shows it on a web page.
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { connect } from 'node:net';
import { dirname, join } from 'node:path';
import { BootstrapError, say } from './log.mjs';
import { isPortFree, waitForHttp } from './net.mjs';
import { commandLineOf, isAlive, killLeftover, startService, stopService } from './proc.mjs';

const MARK = 'maildev/dist/bin/maildev.js';

function readState(file) {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
}

async function answersAsSink(webPort) {
  try {
    const response = await fetch(`http://127.0.0.1:${webPort}/api/healthz`, {
      signal: AbortSignal.timeout(1_500),
    });
    return response.ok && (await response.text()).trim() === 'true';
  } catch {
    return false;
  }
}

function smtpListening(port) {
  return new Promise((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

function handle({ smtpPort, webPort, startedByUs, stop, child = null }) {
  return { smtpPort, webPort, webUrl: `http://127.0.0.1:${webPort}`, startedByUs, stop, child };
}

/**
 * Start maildev on the given ports. With `stateFile`, a sink an earlier run left behind is adopted,
 * and one another live run uses is shared, rather than fighting over the ports.
 */
export async function startMailSink({ root, smtpPort, webPort, stateFile, logFile }) {
  if (stateFile) {
    const state = readState(stateFile);
    if (state && isAlive(state.pid) && commandLineOf(state.pid).includes(MARK)) {
      const samePorts = state.smtpPort === smtpPort && state.webPort === webPort;
      const ownerAlive = state.owner !== process.pid && isAlive(state.owner);
      if (samePorts && (await answersAsSink(webPort))) {
        if (ownerAlive) {
          say(`mail sink already running for another run (pid ${state.pid}): sharing it`);
          return handle({ smtpPort, webPort, startedByUs: false, stop: async () => {} });
        }
        say(`mail sink left running by an earlier run (pid ${state.pid}): adopting it`);
        writeFileSync(stateFile, JSON.stringify({ ...state, owner: process.pid }));
        return handle({
          smtpPort,
          webPort,
          startedByUs: true,
          stop: async () => {
            await killLeftover(state.pid, MARK);
            rmSync(stateFile, { force: true });
          },
        });
      }
      if (!ownerAlive) await killLeftover(state.pid, MARK);
    }
  }

  const [smtpFree, webFree] = await Promise.all([isPortFree(smtpPort), isPortFree(webPort)]);
  if (!smtpFree || !webFree) {
    if (!smtpFree && !webFree && (await answersAsSink(webPort))) {
      say(`a mail sink already answers on ports ${smtpPort}/${webPort}: using it`);
      return handle({ smtpPort, webPort, startedByUs: false, stop: async () => {} });
    }
    const busy = [!smtpFree && `SMTP_PORT=${smtpPort}`, !webFree && `MAILDEV_WEB_PORT=${webPort}`].filter(
      Boolean,
    );
    throw new BootstrapError(
      `${busy.join(' and ')} ${busy.length > 1 ? 'are' : 'is'} in use by another program: set ${busy.length > 1 ? 'them' : 'it'} to a free port`,
    );
  }

  const bin = join(root, 'node_modules', MARK);
  if (!existsSync(bin)) throw new BootstrapError(`${bin} is missing: run npm ci`);
  mkdirSync(dirname(logFile), { recursive: true });
  const fd = openSync(logFile, 'a');
  const env = Object.fromEntries(Object.entries(process.env).filter(([key]) => !key.startsWith('MAILDEV_')));
  const child = startService(
    process.execPath,
    [bin, '--smtp', String(smtpPort), '--web', String(webPort), '--ip', '127.0.0.1', '--web-ip', '127.0.0.1'],
    { cwd: root, env, stdio: [fd, fd] },
  );
  closeSync(fd);
  try {
    await waitForHttp(`http://127.0.0.1:${webPort}/api/healthz`, {
      timeoutMs: 20_000,
      child,
      what: `the mail sink (log: ${logFile})`,
    });
    for (let i = 0; i < 50 && !(await smtpListening(smtpPort)); i++)
      await new Promise((r) => setTimeout(r, 100));
  } catch (error) {
    await stopService(child, 2_000);
    throw error;
  }
  if (stateFile)
    writeFileSync(stateFile, JSON.stringify({ pid: child.pid, owner: process.pid, smtpPort, webPort }));
  return handle({
    smtpPort,
    webPort,
    startedByUs: true,
    child,
    stop: async () => {
      await stopService(child, 5_000);
      if (stateFile) rmSync(stateFile, { force: true });
    },
  });
}
