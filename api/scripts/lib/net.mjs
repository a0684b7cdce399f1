// Ports and readiness checks on the loopback interface.
import { createServer } from 'node:net';
import { BootstrapError } from './log.mjs';

const HOST = '127.0.0.1';

/** A port the OS says is free right now (listen on 0, read it, close). */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, HOST, () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

export function isPortFree(port) {
  return new Promise((resolve) => {
    const server = createServer();
    server.unref();
    server.once('error', () => resolve(false));
    server.listen(port, HOST, () => server.close(() => resolve(true)));
  });
}

export function parsePort(value, fallback, name) {
  if (value === undefined || value === '') return fallback;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 1 || port > 65_535) {
    throw new BootstrapError(`${name}=${value} is not a port number (1-65535)`);
  }
  return port;
}

/**
 * Poll `url` until it answers 200. When `child` is given and exits first, fail at once with `what`
 * in the message instead of waiting out the timeout.
 */
export async function waitForHttp(url, { timeoutMs = 60_000, child, what = url } = {}) {
  const deadline = Date.now() + timeoutMs;
  let last = 'no answer';
  let exited;
  child?.exited?.then((result) => (exited = result));
  while (Date.now() < deadline) {
    if (exited) {
      throw new BootstrapError(
        `${what} stopped before it was ready (${exited.signal ?? `exit code ${exited.code}`})`,
      );
    }
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
      if (response.status === 200) return response;
      last = `HTTP ${response.status}`;
      await response.body?.cancel();
    } catch (error) {
      last = error.cause?.code ?? error.message;
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new BootstrapError(
    `${what} did not answer 200 at ${url} within ${timeoutMs / 1000} s (last: ${last})`,
  );
}
