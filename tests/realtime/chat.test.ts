import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';
import type { Message } from '../../shared/src/index';
import { closeTestDb, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { newClientId, ticketWorld } from '../support/tickets';
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

async function socketFor(client: TestClient): Promise<ClientSocket> {
  const socket: ClientSocket = connect(server.url, {
    transports: ['websocket'],
    extraHeaders: { Cookie: client.cookieHeader() },
    reconnection: false,
  });
  sockets.push(socket);
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
  // Acknowledge new messages as the web client does, so the sender sees "delivered".
  socket.on('message:new', (_payload, ack) => ack?.({ ok: true }));
  return socket;
}

const collect = (socket: ClientSocket) => {
  const got: Message[] = [];
  socket.on('message:new', ({ message }) => void got.push(message));
  return got;
};
const settle = (ms = 300) => new Promise((r) => setTimeout(r, ms));

describe('joining a ticket', () => {
  it('When a contractor of another account joins a ticket, then the ack is a 404 error and no message reaches them', async () => {
    const { ticket, techClient } = await ticketWorld(server);
    const stranger = await socketFor(await signedInClient(server, await makeUser()));
    const res = await stranger.emitWithAck('ticket:join', { ticketId: ticket.id });
    expect(res).toMatchObject({ ok: false, error: { code: 'not_found' } });
    const got = collect(stranger);
    const send = await stranger.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'let me in',
    });
    expect(send.ok).toBe(false);
    await techClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'for the owner only',
      clientId: newClientId(),
    });
    await settle();
    expect(got).toEqual([]);
  });

  it('When the payload is malformed, then the ack names the field', async () => {
    const socket = await socketFor(await signedInClient(server, await makeUser()));
    const res = await socket.emitWithAck('ticket:join', { ticketId: 'abc' as unknown as number });
    expect(res.ok).toBe(false);
    expect(!res.ok && res.error.fields).toHaveProperty('ticketId');
  });
});

describe('sending messages', () => {
  it('When a message is sent, then the ack arrives only after the row exists, and the other side gets it live', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    const contractor = await socketFor(contractorClient);
    const tech = await socketFor(techClient);
    await contractor.emitWithAck('ticket:join', { ticketId: ticket.id });
    await tech.emitWithAck('ticket:join', { ticketId: ticket.id });
    const techGot = collect(tech);
    const clientId = newClientId();
    const ack = await contractor.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId,
      body: 'Inlet reads 4.1 under fire',
    });
    expect(ack.ok).toBe(true);
    // At the moment of the ack, the row is in the database.
    const { rows } = await testDb().pool.query(
      'select body from ticket_messages where ticket_id = $1 and client_id = $2',
      [ticket.id, clientId],
    );
    expect(rows).toEqual([{ body: 'Inlet reads 4.1 under fire' }]);
    await settle();
    expect(techGot.map((m) => m.body)).toEqual(['Inlet reads 4.1 under fire']);
  });

  it('When the same clientId is sent twice over the socket, then one row and the same message in both acks', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const socket = await socketFor(contractorClient);
    const clientId = newClientId();
    const a = await socket.emitWithAck('message:send', { ticketId: ticket.id, clientId, body: 'twice' });
    const b = await socket.emitWithAck('message:send', { ticketId: ticket.id, clientId, body: 'twice' });
    expect(a.ok && b.ok && a.message.id === b.message.id).toBe(true);
    const { rows } = await testDb().pool.query(
      'select count(*)::int n from ticket_messages where client_id = $1',
      [clientId],
    );
    expect(rows[0].n).toBe(1);
  });

  it('When a tech writes an internal note, then staff sockets get it and the contractor socket never does', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    const contractor = await socketFor(contractorClient);
    const tech = await socketFor(techClient);
    await contractor.emitWithAck('ticket:join', { ticketId: ticket.id });
    await tech.emitWithAck('ticket:join', { ticketId: ticket.id });
    const contractorGot = collect(contractor);
    const techGot = collect(tech);
    await tech.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'Out of warranty',
      kind: 'internal-note',
    });
    await tech.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'Clean the flame sensor',
    });
    await settle();
    expect(contractorGot.map((m) => m.body)).toEqual(['Clean the flame sensor']);
    expect(techGot.map((m) => m.body)).toEqual(['Out of warranty', 'Clean the flame sensor']);
    const refused = await contractor.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'x',
      kind: 'internal-note',
    });
    expect(!refused.ok && refused.error.code).toBe('forbidden');
  });

  it('When a message is over 10,000 characters, then the ack refuses it and nothing is stored', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const socket = await socketFor(contractorClient);
    const res = await socket.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'x'.repeat(10_001),
    });
    expect(!res.ok && res.error.fields).toHaveProperty('body');
    const { rows } = await testDb().pool.query(
      'select count(*)::int n from ticket_messages where ticket_id = $1',
      [ticket.id],
    );
    expect(rows[0].n).toBe(0);
  });

  it('When a socket sends more than 20 messages in 10 seconds, then the 21st is refused with a clear error', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const socket = await socketFor(contractorClient);
    for (let i = 0; i < 20; i++) {
      const ok = await socket.emitWithAck('message:send', {
        ticketId: ticket.id,
        clientId: newClientId(),
        body: `m${i}`,
      });
      expect(ok.ok).toBe(true);
    }
    const res = await socket.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'one too many',
    });
    expect(!res.ok && res.error.code).toBe('rate_limited');
  });

  it('When the other side takes and reads a message, then the sender sees delivered and read', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    const contractor = await socketFor(contractorClient);
    const tech = await socketFor(techClient);
    await contractor.emitWithAck('ticket:join', { ticketId: ticket.id });
    await tech.emitWithAck('ticket:join', { ticketId: ticket.id });
    const statuses: unknown[] = [];
    contractor.on('message:status', (s) => void statuses.push(s));
    const ack = await contractor.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'Photo sent',
    });
    const id = ack.ok ? ack.message.id : -1;
    await settle();
    await tech.emitWithAck('message:read', { ticketId: ticket.id, messageId: id });
    await settle();
    expect(statuses).toEqual([
      expect.objectContaining({ messageIds: [id], deliveredAt: expect.any(String) }),
      expect.objectContaining({ messageIds: [id], readAt: expect.any(String) }),
    ]);
  });
});

describe('reconnecting and live updates', () => {
  it('When a client was away, then asking for messages after the last one it saw returns exactly what it missed', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    const socket = await socketFor(contractorClient);
    await socket.emitWithAck('ticket:join', { ticketId: ticket.id });
    const seen = await socket.emitWithAck('message:send', {
      ticketId: ticket.id,
      clientId: newClientId(),
      body: 'before',
    });
    socket.disconnect();
    for (const body of ['missed 1', 'missed 2'])
      await techClient.post(`/api/tickets/${ticket.id}/messages`, { body, clientId: newClientId() });
    const lastSeen = seen.ok ? seen.message.id : 0;
    const res = await contractorClient
      .get(`/api/tickets/${ticket.id}/messages?after=${lastSeen}`)
      .expect(200);
    expect(res.body.items.map((m: Message) => m.body)).toEqual(['missed 1', 'missed 2']);
  });

  it('When a contractor opens a ticket, then the branch desk sees it appear and the other branches do not', async () => {
    const { contractorClient, techClient, ticket: first } = await ticketWorld(server);
    const desk = await socketFor(techClient);
    const otherDesk = await socketFor(await signedInClient(server, await makeUser({ role: 'tech' })));
    const updates: number[] = [];
    const otherUpdates: number[] = [];
    desk.on('ticket:updated', ({ ticket }) => void updates.push(ticket.id));
    otherDesk.on('ticket:updated', ({ ticket }) => void otherUpdates.push(ticket.id));
    const res = await contractorClient.post('/api/tickets', {
      subject: 'Second furnace down',
      fuel: 'propane',
      urgency: 'job-held',
    });
    await settle();
    expect(updates).toContain(res.body.ticket.id);
    expect(otherUpdates).toEqual([]);
    expect(updates).not.toContain(first.id);
  });

  it('When a tech types, then the contractor in the ticket sees who is typing', async () => {
    const { ticket, contractorClient, techClient, tech } = await ticketWorld(server);
    const contractor = await socketFor(contractorClient);
    const techSocket = await socketFor(techClient);
    await contractor.emitWithAck('ticket:join', { ticketId: ticket.id });
    await techSocket.emitWithAck('ticket:join', { ticketId: ticket.id });
    const typing = new Promise((resolve) => contractor.once('typing', resolve));
    techSocket.emit('typing', { ticketId: ticket.id });
    expect(await typing).toEqual({ ticketId: ticket.id, userId: tech.id, name: 'Test tech' });
  });

  it('When staff connect, then the desk is told who is online', async () => {
    const a = await makeUser({ role: 'tech', name: 'Presence Tester' });
    const socket = await socketFor(await signedInClient(server, a));
    const res = await socket.emitWithAck('presence:list');
    expect(res.ok && res.online.map((p) => p.userId)).toContain(a.id);
    const contractor = await socketFor(await signedInClient(server, await makeUser()));
    const refused = await contractor.emitWithAck('presence:list');
    expect(refused.ok).toBe(false);
  });

  it('When a tech comes online and leaves, then their branch desk hears it once each way and other branches do not', async () => {
    const branchTech = await makeUser({ role: 'tech' });
    const colleague = await makeUser({
      role: 'tech',
      branchIds: branchTech.branchIds,
      name: 'Desk Colleague',
    });
    const elsewhere = await socketFor(await signedInClient(server, await makeUser({ role: 'tech' })));
    const watcher = await socketFor(await signedInClient(server, branchTech));
    const heard: unknown[] = [];
    const heardElsewhere: unknown[] = [];
    watcher.on('presence:changed', (p) => void heard.push(p));
    elsewhere.on('presence:changed', (p) => void heardElsewhere.push(p));
    const colleagueClient = await signedInClient(server, colleague);
    const first = await socketFor(colleagueClient);
    const second = await socketFor(colleagueClient);
    await settle();
    second.disconnect();
    await settle();
    first.disconnect();
    await settle();
    const entry = { userId: colleague.id, name: 'Desk Colleague', role: 'tech' };
    expect(heard).toEqual([
      { entry, online: true },
      { entry, online: false },
    ]);
    expect(heardElsewhere).toEqual([]);
  });
});
