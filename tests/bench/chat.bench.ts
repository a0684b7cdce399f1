// Live chat under load: N contractor–tech pairs, each with its own ticket, exchange M messages per
// side over socket.io against the real API and the real database, all pairs at once, each pair
// closed-loop (next message only after the previous ack). Measured per message:
//   ack       = send → the sender's ack (the server answers after the row is committed)
//   delivered = send → the other side's `message:new` with the same clientId
// Baseline in the same run: a bare socket.io relay (no database, no auth, no checks) with the same
// N, M and measurements. Peak RSS is sampled every 50 ms during the exchange; the server runs in
// this process, so the figure includes the client sockets too.
// Targets at N=500: ack p95 ≤ 30 ms, delivered p99 ≤ 100 ms, peak RSS ≤ 300 MB.
//   DATABASE_URL=postgres://… npm run bench:chat [-- --sizes 50,200 --messages 10]
// Each size is bounded to 120 s (setup and exchange each); a size that runs over is reported as
// aborted and the run exits 1. Otherwise it exits 0, whether targets are met or missed.
import { randomUUID } from 'node:crypto';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { parseArgs } from 'node:util';
import { Server } from 'socket.io';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';
import type { RunningServer } from '../../api/src/server';
import { closeTestDb } from '../support/fixtures';
import { startTestServer } from '../support/server';
import { ticketWorld } from '../support/tickets';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const SIZE_LIMIT_MS = 120_000;
const SETUP_CONCURRENCY = 8;
const TARGET = { n: 500, ackP95Ms: 30, deliveredP99Ms: 100, rssMb: 300 };

const { values: args } = parseArgs({
  options: {
    sizes: { type: 'string', default: '50,200,500' },
    messages: { type: 'string', default: '10' },
  },
});
const SIZES = args.sizes
  .split(',')
  .map((s) => Number(s.trim()))
  .filter((n) => Number.isInteger(n) && n > 0);
const M = Number(args.messages);
if (SIZES.length === 0 || !Number.isInteger(M) || M < 1) {
  console.error('Use --sizes as a comma list of positive integers and --messages as a positive integer.');
  process.exit(1);
}
if (M > 10) {
  console.warn(
    `Note: --messages ${M} per side goes over the server's 20 messages per 10 s per socket limit.`,
  );
}

if (!process.env.DATABASE_URL) {
  console.error(
    'DATABASE_URL is not set. The chat bench needs a migrated PostgreSQL database, e.g.\n' +
      '  DATABASE_URL=postgres://user@127.0.0.1:5432/lightoff_bench node --import tsx api/scripts/migrate.ts\n' +
      '  DATABASE_URL=postgres://user@127.0.0.1:5432/lightoff_bench npm run bench:chat',
  );
  process.exit(1);
}

class SizeAborted extends Error {}

/** Rejects with SizeAborted when `deadline` (performance.now() ms) passes first. */
async function beforeDeadline<T>(work: Promise<T>, deadline: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const expired = new Promise<never>((_, reject) => {
    timer = setTimeout(
      () => reject(new SizeAborted(`${what} did not finish within ${SIZE_LIMIT_MS / 1000} s`)),
      Math.max(0, deadline - performance.now()),
    );
  });
  try {
    return await Promise.race([work, expired]);
  } finally {
    clearTimeout(timer);
  }
}

/** Runs `fn` over 0..n-1 with at most `limit` at a time. */
async function forEachLimited(n: number, limit: number, fn: (i: number) => Promise<void>): Promise<void> {
  let next = 0;
  const worker = async () => {
    while (next < n) await fn(next++);
  };
  await Promise.all(Array.from({ length: Math.min(limit, n) }, worker));
}

// Nearest-rank percentile; a few lines, not worth a dependency.
function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.ceil((p / 100) * sorted.length);
  return sorted[Math.min(sorted.length - 1, Math.max(0, rank - 1))]!;
}

interface Latencies {
  p50: number;
  p95: number;
  p99: number;
  count: number;
}
const summarise = (samples: number[]): Latencies => {
  const sorted = [...samples].sort((a, b) => a - b);
  return {
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    count: sorted.length,
  };
};

interface PhaseResult {
  ack: Latencies;
  delivered: Latencies;
  peakRssMb: number;
  seconds: number;
}

/** One side of a pair, as the exchange loop sees it, for either server. */
interface Peer {
  send(clientId: string, body: string): Promise<void>;
  /** Registers the callback called with the clientId of each message this peer receives. */
  onReceive(cb: (clientId: string) => void): void;
}

/** Every pair at once; within a pair, the next message goes only after the previous ack. */
async function exchange(pairs: [Peer, Peer][], deadline: number, label: string): Promise<PhaseResult> {
  const ackMs: number[] = [];
  const deliveredMs: number[] = [];
  const expected = pairs.length * 2 * M;
  // clientId → send time and the peer that must receive it.
  const inFlight = new Map<string, { sentAt: number; to: Peer }>();
  let allDelivered!: () => void;
  const deliveredAll = new Promise<void>((resolve) => (allDelivered = resolve));
  for (const pair of pairs) {
    for (const peer of pair) {
      peer.onReceive((clientId) => {
        const now = performance.now();
        const sent = inFlight.get(clientId);
        if (!sent || sent.to !== peer) return;
        inFlight.delete(clientId);
        deliveredMs.push(now - sent.sentAt);
        if (deliveredMs.length === expected) allDelivered();
      });
    }
  }

  let peakRss = process.memoryUsage().rss;
  const sampler = setInterval(() => {
    peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }, 50);
  const started = performance.now();
  try {
    const loops = pairs.map(async ([contractor, tech]) => {
      for (let i = 0; i < 2 * M; i++) {
        const [from, to] = i % 2 === 0 ? [contractor, tech] : [tech, contractor];
        const clientId = randomUUID().replace(/-/g, '');
        const sentAt = performance.now();
        inFlight.set(clientId, { sentAt, to });
        await from.send(clientId, `Bench message ${i + 1}: inlet 7.0 in. w.c., manifold 3.5 in. w.c.`);
        ackMs.push(performance.now() - sentAt);
      }
    });
    await beforeDeadline(Promise.all(loops), deadline, `${label}: the exchange`);
    await beforeDeadline(deliveredAll, deadline, `${label}: delivery of every message`);
  } finally {
    clearInterval(sampler);
    peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }
  return {
    ack: summarise(ackMs),
    delivered: summarise(deliveredMs),
    peakRssMb: peakRss / 1024 / 1024,
    seconds: (performance.now() - started) / 1000,
  };
}

async function connected<S extends Socket>(socket: S): Promise<S> {
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
  return socket;
}

// ---- Lightoff: the real API, database and auth --------------------------------------------------

async function runOurs(server: RunningServer, n: number, sockets: Socket[]): Promise<PhaseResult> {
  const deadline = performance.now() + SIZE_LIMIT_MS;
  const setupStarted = performance.now();
  const pairs: [Peer, Peer][] = new Array(n);

  const socketFor = async (cookie: string, ticketId: number): Promise<Peer> => {
    const socket: ClientSocket = connect(server.url, {
      transports: ['websocket'],
      extraHeaders: { Cookie: cookie },
      reconnection: false,
      forceNew: true,
    });
    sockets.push(socket);
    await connected(socket);
    const joined = await socket.emitWithAck('ticket:join', { ticketId });
    if (!joined.ok) throw new Error(`ticket:join failed: ${JSON.stringify(joined.error)}`);
    let receive: (clientId: string) => void = () => {};
    socket.on('message:new', ({ message }, ack) => {
      ack?.({ ok: true });
      if (message.clientId) receive(message.clientId);
    });
    return {
      async send(clientId, body) {
        const res = await socket.emitWithAck('message:send', { ticketId, clientId, body });
        if (!res.ok) throw new Error(`message:send failed: ${JSON.stringify(res.error)}`);
      },
      onReceive(cb) {
        receive = cb;
      },
    };
  };

  const setup = forEachLimited(n, SETUP_CONCURRENCY, async (i) => {
    const { contractorClient, techClient, ticket } = await ticketWorld(server, {
      subject: 'Bench ticket',
      urgency: 'question',
    });
    const ticketId = ticket.id;
    pairs[i] = [
      await socketFor(contractorClient.cookieHeader(), ticketId),
      await socketFor(techClient.cookieHeader(), ticketId),
    ];
  });
  await beforeDeadline(setup, deadline, `N=${n} ours: setup (accounts, sign-ins, tickets, sockets)`);
  console.log(`  ours  N=${n}: setup ${((performance.now() - setupStarted) / 1000).toFixed(1)} s`);
  return exchange(pairs, performance.now() + SIZE_LIMIT_MS, `N=${n} ours`);
}

// ---- Baseline: a bare socket.io relay -----------------------------------------------------------

interface BareClientEvents {
  join: (room: string, ack: () => void) => void;
  send: (payload: { room: string; clientId: string; body: string }, ack: (res: { ok: true }) => void) => void;
}
interface BareServerEvents {
  new: (payload: { clientId: string; body: string }, ack?: (res: { ok: true }) => void) => void;
}

async function startBare() {
  const http = createServer();
  const io = new Server<BareClientEvents, BareServerEvents>(http);
  io.on('connection', (socket) => {
    socket.on('join', (room, ack) => {
      void socket.join(room);
      ack();
    });
    socket.on('send', ({ room, clientId, body }, ack) => {
      ack({ ok: true });
      // Relayed with a delivery ack asked for, as the product does, but nothing waits on it.
      socket
        .to(room)
        .timeout(5_000)
        .emit('new', { clientId, body }, () => {});
    });
  });
  await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
  return {
    url,
    stop: () => new Promise<void>((resolve) => void io.close(() => resolve())),
  };
}

async function runBare(url: string, n: number, sockets: Socket[]): Promise<PhaseResult> {
  const deadline = performance.now() + SIZE_LIMIT_MS;
  const pairs: [Peer, Peer][] = new Array(n);
  const peer = async (room: string): Promise<Peer> => {
    const socket: Socket<BareServerEvents, BareClientEvents> = connect(url, {
      transports: ['websocket'],
      reconnection: false,
      forceNew: true,
    });
    sockets.push(socket);
    await connected(socket);
    await socket.emitWithAck('join', room);
    let receive: (clientId: string) => void = () => {};
    socket.on('new', ({ clientId }, ack) => {
      ack?.({ ok: true });
      receive(clientId);
    });
    return {
      async send(clientId, body) {
        await socket.emitWithAck('send', { room, clientId, body });
      },
      onReceive(cb) {
        receive = cb;
      },
    };
  };
  const setup = forEachLimited(n, SETUP_CONCURRENCY, async (i) => {
    pairs[i] = [await peer(`pair:${i}`), await peer(`pair:${i}`)];
  });
  await beforeDeadline(setup, deadline, `N=${n} bare: setup`);
  return exchange(pairs, performance.now() + SIZE_LIMIT_MS, `N=${n} bare`);
}

// ---- Run and report -----------------------------------------------------------------------------

const ms = (v: number) => (Number.isNaN(v) ? '–' : v.toFixed(1));
const trio = (l: Latencies) => `${ms(l.p50)} / ${ms(l.p95)} / ${ms(l.p99)}`;
const ratio = (a: number, b: number) => (b > 0 ? `${(a / b).toFixed(1)}×` : '–');

function closeAll(sockets: Socket[]) {
  for (const s of sockets.splice(0)) {
    s.removeAllListeners();
    s.disconnect();
  }
}

const results: { n: number; ours: PhaseResult; bare: PhaseResult }[] = [];
const aborted: { n: number; reason: string }[] = [];

console.log(`Chat bench: sizes ${SIZES.join(', ')} pairs, ${M} messages per side, closed loop per pair.`);
const server = await startTestServer();
const bare = await startBare();
const sockets: Socket[] = [];
try {
  for (const n of SIZES) {
    try {
      const ours = await runOurs(server, n, sockets);
      console.log(`  ours  N=${n}: ${ours.ack.count} messages in ${ours.seconds.toFixed(1)} s`);
      closeAll(sockets);
      const bareResult = await runBare(bare.url, n, sockets);
      console.log(`  bare  N=${n}: ${bareResult.ack.count} messages in ${bareResult.seconds.toFixed(1)} s`);
      closeAll(sockets);
      results.push({ n, ours, bare: bareResult });
    } catch (error) {
      closeAll(sockets);
      if (!(error instanceof SizeAborted)) throw error;
      console.error(`  N=${n} ABORTED: ${error.message}`);
      aborted.push({ n, reason: error.message });
    }
  }
} finally {
  closeAll(sockets);
  await bare.stop();
  await server.stop();
  await closeTestDb();
}

console.log('');
console.log(
  'Latencies in ms (p50 / p95 / p99). Peak RSS is of this one process: server and client sockets share it.',
);
console.log('');
console.log(
  '| N | ours ack p50/p95/p99 | ours delivered p50/p95/p99 | bare ack p95 | bare delivered p99 | ratio ack p95 ours/bare | ratio delivered p99 ours/bare | peak RSS MB |',
);
console.log('|---:|---|---|---:|---:|---:|---:|---:|');
for (const { n, ours, bare: b } of results) {
  console.log(
    `| ${n} | ${trio(ours.ack)} | ${trio(ours.delivered)} | ${ms(b.ack.p95)} | ${ms(b.delivered.p99)} | ` +
      `${ratio(ours.ack.p95, b.ack.p95)} | ${ratio(ours.delivered.p99, b.delivered.p99)} | ${ours.peakRssMb.toFixed(0)} |`,
  );
}
for (const { n, reason } of aborted) console.log(`| ${n} | aborted: ${reason} | | | | | | |`);

console.log('');
const atTarget = results.find((r) => r.n === TARGET.n);
if (!atTarget) {
  console.log(`Targets at N=${TARGET.n}: not measured in this run (sizes: ${SIZES.join(', ')}).`);
} else {
  const verdict = (ok: boolean) => (ok ? 'PASS' : 'MISS');
  const { ours } = atTarget;
  console.log(`Targets at N=${TARGET.n}:`);
  console.log(
    `  ack p95 ≤ ${TARGET.ackP95Ms} ms: ${ms(ours.ack.p95)} ms ${verdict(ours.ack.p95 <= TARGET.ackP95Ms)}`,
  );
  console.log(
    `  delivered p99 ≤ ${TARGET.deliveredP99Ms} ms: ${ms(ours.delivered.p99)} ms ` +
      verdict(ours.delivered.p99 <= TARGET.deliveredP99Ms),
  );
  console.log(
    `  peak RSS ≤ ${TARGET.rssMb} MB: ${ours.peakRssMb.toFixed(0)} MB ${verdict(ours.peakRssMb <= TARGET.rssMb)}`,
  );
}
process.exit(aborted.length > 0 ? 1 : 0);
