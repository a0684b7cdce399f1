import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';
import { closeTestDb, makeUser } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import type { RunningServer } from '../../api/src/server';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
let server: RunningServer;
const sockets: ClientSocket[] = [];

beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  sockets.forEach((s) => s.disconnect());
  await server.stop();
  await closeTestDb();
});

function open(headers: Record<string, string> = {}): ClientSocket {
  const socket: ClientSocket = connect(server.url, {
    transports: ['websocket'],
    extraHeaders: headers,
    reconnection: false,
  });
  sockets.push(socket);
  return socket;
}

const outcome = (socket: ClientSocket) =>
  new Promise<'connected' | string>((resolve) => {
    socket.once('connect', () => resolve('connected'));
    socket.once('connect_error', (err) => resolve(err.message));
  });

describe('socket authentication', () => {
  it('When a socket connects without a session, then it is refused', async () => {
    expect(await outcome(open())).toBe('unauthenticated');
  });

  it('When a socket connects with a forged cookie, then it is refused', async () => {
    expect(await outcome(open({ Cookie: 'lightoff.sid=s%3Aforged.signature' }))).toBe('unauthenticated');
  });

  it('When a socket connects with a valid session, then it is accepted and knows who it is', async () => {
    const user = await makeUser({ role: 'tech' });
    const client = await signedInClient(server, user);
    const socket = open({ Cookie: client.cookieHeader() });
    expect(await outcome(socket)).toBe('connected');
    const res = await socket.emitWithAck('session:whoami');
    expect(res.ok && res.user.id).toBe(user.id);
  });

  it('When a page from another site opens a socket with our cookie, then it is refused', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const socket = open({ Cookie: client.cookieHeader(), Origin: 'http://elsewhere.example' });
    expect(await outcome(socket)).not.toBe('connected');
  });

  it('When the user is deactivated, then their open socket is told and closed at once', async () => {
    const admin = await makeUser({ role: 'admin' });
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const socket = open({ Cookie: client.cookieHeader() });
    expect(await outcome(socket)).toBe('connected');
    const ended = new Promise((resolve) => socket.once('session:ended', resolve));
    const closed = new Promise((resolve) => socket.once('disconnect', resolve));
    const adminClient = await signedInClient(server, admin);
    await adminClient.patch(`/api/admin/users/${user.id}`, { active: false });
    expect(await ended).toEqual({ reason: 'deactivated' });
    expect(await closed).toBe('io server disconnect');
  });

  it('When the user signs out, then that session’s socket is closed and a new one is refused', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const cookie = client.cookieHeader();
    const socket = open({ Cookie: cookie });
    expect(await outcome(socket)).toBe('connected');
    const closed = new Promise((resolve) => socket.once('disconnect', resolve));
    await client.post('/api/auth/logout');
    expect(await closed).toBe('io server disconnect');
    expect(await outcome(open({ Cookie: cookie }))).toBe('unauthenticated');
  });
});
