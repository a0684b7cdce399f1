// The client side of the chat bench, in its own process so that the server's figures (CPU and
// RSS) are the server's alone. Started by chat.bench.ts with fork(); gets one job over IPC,
// connects every socket, runs the exchange and sends the raw latencies back.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';

export interface ClientJob {
  mode: 'ours' | 'bare';
  url: string;
  /** ours: each pair's ticket and the two session cookies (contractor, tech). bare: rooms only. */
  pairs: { ticketId: number; cookies: [string, string] }[];
  messagesPerSide: number;
  paceMs: number;
  limitMs: number;
}
export type ClientReport =
  { ok: true; ackMs: number[]; deliveredMs: number[]; seconds: number } | { ok: false; error: string };

interface Peer {
  send(clientId: string, body: string): Promise<void>;
  onReceive(cb: (clientId: string) => void): void;
}

const sockets: Socket[] = [];
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function connected<S extends Socket>(socket: S): Promise<S> {
  sockets.push(socket);
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
  return socket;
}

async function oursPeer(url: string, cookie: string, ticketId: number): Promise<Peer> {
  const socket = await connected<Socket<ServerToClientEvents, ClientToServerEvents>>(
    connect(url, {
      transports: ['websocket'],
      extraHeaders: { Cookie: cookie },
      reconnection: false,
      forceNew: true,
    }),
  );
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
    onReceive: (cb) => void (receive = cb),
  };
}

interface BareClientEvents {
  join: (room: string, ack: () => void) => void;
  send: (payload: { room: string; clientId: string; body: string }, ack: (res: { ok: true }) => void) => void;
}
interface BareServerEvents {
  new: (payload: { clientId: string; body: string }, ack?: (res: { ok: true }) => void) => void;
}

async function barePeer(url: string, room: string): Promise<Peer> {
  const socket = await connected<Socket<BareServerEvents, BareClientEvents>>(
    connect(url, { transports: ['websocket'], reconnection: false, forceNew: true }),
  );
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
    onReceive: (cb) => void (receive = cb),
  };
}

/** Runs `fn` over 0..n-1 with at most `limit` at a time. */
async function forEachLimited(n: number, limit: number, fn: (i: number) => Promise<void>) {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(limit, n) }, async () => {
      while (next < n) await fn(next++);
    }),
  );
}

async function run(job: ClientJob): Promise<ClientReport> {
  const pairs: [Peer, Peer][] = new Array(job.pairs.length);
  await forEachLimited(job.pairs.length, 16, async (i) => {
    const p = job.pairs[i]!;
    pairs[i] =
      job.mode === 'ours'
        ? [
            await oursPeer(job.url, p.cookies[0], p.ticketId),
            await oursPeer(job.url, p.cookies[1], p.ticketId),
          ]
        : [await barePeer(job.url, `pair:${i}`), await barePeer(job.url, `pair:${i}`)];
  });

  const ackMs: number[] = [];
  const deliveredMs: number[] = [];
  const expected = pairs.length * 2 * job.messagesPerSide;
  const inFlight = new Map<string, { sentAt: number; to: Peer }>();
  let allDelivered!: () => void;
  const deliveredAll = new Promise<void>((resolve) => (allDelivered = resolve));
  for (const pair of pairs) {
    for (const peer of pair) {
      peer.onReceive((clientId) => {
        const sent = inFlight.get(clientId);
        if (!sent || sent.to !== peer) return; // the author's own copy
        inFlight.delete(clientId);
        deliveredMs.push(performance.now() - sent.sentAt);
        if (deliveredMs.length === expected) allDelivered();
      });
    }
  }

  const started = performance.now();
  const loops = pairs.map(async ([contractor, tech]) => {
    // Pairs start spread over one pace interval: real conversations do not line up.
    const pairStart = performance.now() + Math.random() * job.paceMs;
    for (let i = 0; i < 2 * job.messagesPerSide; i++) {
      const due = pairStart + i * job.paceMs;
      if (job.paceMs > 0 && due > performance.now()) await sleep(due - performance.now());
      const [from, to] = i % 2 === 0 ? [contractor, tech] : [tech, contractor];
      const clientId = randomUUID().replace(/-/g, '');
      const sentAt = performance.now();
      inFlight.set(clientId, { sentAt, to });
      await from.send(clientId, `Bench message ${i + 1}: inlet 7.0 in. w.c., manifold 3.5 in. w.c.`);
      ackMs.push(performance.now() - sentAt);
    }
  });
  const limit = sleep(job.limitMs).then(() => {
    throw new Error(`the exchange did not finish within ${job.limitMs / 1000} s`);
  });
  await Promise.race([Promise.all(loops).then(() => deliveredAll), limit]);
  return { ok: true, ackMs, deliveredMs, seconds: (performance.now() - started) / 1000 };
}

process.once('message', (job: ClientJob) => {
  run(job)
    .catch((err: unknown): ClientReport => ({
      ok: false,
      error: err instanceof Error ? err.message : String(err),
    }))
    .then((report) => {
      for (const s of sockets) s.disconnect();
      process.send!(report, () => process.exit(0));
    });
});
