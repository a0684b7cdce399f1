import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeAccount, makeEquipmentModel, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import { newClientId, ticketWorld } from '../support/tickets';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

describe('opening a ticket', () => {
  it('When a contractor opens a ticket, then it gets a number, their home branch and status new', async () => {
    const model = await makeEquipmentModel();
    const { ticket, contractor } = await ticketWorld(server, {
      modelText: undefined,
      equipmentModelId: model.id,
      serial: 'SN-1',
    });
    expect(ticket.number).toMatch(/^HV-\d{5,}$/);
    expect(ticket).toMatchObject({
      status: 'new',
      urgency: 'emergency',
      fuel: 'natural-gas',
      serial: 'SN-1',
      assignee: null,
    });
    expect(ticket.equipmentModel).toMatchObject({ id: model.id, modelNumber: model.modelNumber });
    expect(ticket.openedBy.id).toBe(contractor.id);
    expect(new Date(ticket.firstResponseDueAt).getTime() - new Date(ticket.createdAt).getTime()).toBe(
      15 * 60 * 1000,
    );
  });

  it('When the body is wrong, then answers 400 naming the fields and stores nothing', async () => {
    const contractor = await makeUser();
    const client = await signedInClient(server, contractor);
    const res = await client.post('/api/tickets', { subject: 'x', fuel: 'coal', urgency: 'now' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['fuel', 'subject', 'urgency']);
    const list = await client.get('/api/tickets').expect(200);
    expect(list.body.total).toBe(0);
  });

  it('When staff try to open a ticket, then answers 403', async () => {
    const tech = await makeUser({ role: 'tech' });
    const client = await signedInClient(server, tech);
    const res = await client.post('/api/tickets', {
      subject: 'Help me',
      fuel: 'propane',
      urgency: 'question',
    });
    expect(res.status).toBe(403);
  });
});

describe('who sees which ticket', () => {
  it('When a contractor of another account asks for a ticket, its messages or its files, then every answer is 404', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const upload = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF'), 'readings.pdf');
    expect(upload.status).toBe(201);
    const attachmentId = upload.body.attachments[0].id;
    const stranger = await signedInClient(server, await makeUser());
    const answers = await Promise.all([
      stranger.get(`/api/tickets/${ticket.id}`),
      stranger.get(`/api/tickets/${ticket.id}/messages`),
      stranger.post(`/api/tickets/${ticket.id}/messages`, { body: 'hi', clientId: newClientId() }),
      stranger.patch(`/api/tickets/${ticket.id}`, { status: 'resolved' }),
      stranger.get(`/api/attachments/${attachmentId}`),
      stranger.get(`/api/tickets/99999999`),
    ]);
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404]);
    const list = await stranger.get('/api/tickets').expect(200);
    expect(list.body.items.map((t: { id: number }) => t.id)).not.toContain(ticket.id);
  });

  it('When a tech of another branch asks for the ticket, then 404; the branch tech and admin see it', async () => {
    const { ticket, techClient } = await ticketWorld(server);
    const otherTech = await signedInClient(server, await makeUser({ role: 'tech' }));
    await otherTech.get(`/api/tickets/${ticket.id}`).expect(404);
    await techClient.get(`/api/tickets/${ticket.id}`).expect(200);
    const admin = await signedInClient(server, await makeUser({ role: 'admin' }));
    await admin.get(`/api/tickets/${ticket.id}`).expect(200);
    const board = await techClient.get('/api/tickets?status=active&assignee=none').expect(200);
    expect(board.body.items.map((t: { id: number }) => t.id)).toContain(ticket.id);
  });
});

describe('working a ticket', () => {
  it('When a tech claims a new ticket, then it is theirs and open, with the history kept', async () => {
    const { ticket, tech, techClient } = await ticketWorld(server);
    const res = await techClient.post(`/api/tickets/${ticket.id}/claim`);
    expect(res.status).toBe(200);
    expect(res.body.ticket).toMatchObject({ status: 'open', assignee: { id: tech.id } });
    const { rows } = await testDb().pool.query(
      'select field, to_value from ticket_events where ticket_id = $1 order by id',
      [ticket.id],
    );
    expect(rows).toEqual([
      { field: 'status', to_value: 'new' },
      { field: 'status', to_value: 'open' },
      { field: 'assigneeId', to_value: String(tech.id) },
    ]);
  });

  it('When staff resolve without a summary, then 400; with one, then resolved', async () => {
    const { ticket, techClient } = await ticketWorld(server);
    const bare = await techClient.patch(`/api/tickets/${ticket.id}`, { status: 'resolved' });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields).toHaveProperty('resolutionSummary');
    const ok = await techClient.patch(`/api/tickets/${ticket.id}`, {
      status: 'resolved',
      resolutionSummary: 'Cleaned the flame sensor.',
    });
    expect(ok.body.ticket).toMatchObject({
      status: 'resolved',
      resolutionSummary: 'Cleaned the flame sensor.',
    });
    expect(ok.body.ticket.resolvedAt).not.toBeNull();
  });

  it('When a contractor marks their ticket solved and reopens it, then both work; changing anything else is 403', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const solved = await contractorClient.patch(`/api/tickets/${ticket.id}`, { status: 'resolved' });
    expect(solved.body.ticket.status).toBe('resolved');
    const reopened = await contractorClient.patch(`/api/tickets/${ticket.id}`, { status: 'open' });
    expect(reopened.body.ticket.status).toBe('open');
    const urgency = await contractorClient.patch(`/api/tickets/${ticket.id}`, { urgency: 'question' });
    expect(urgency.status).toBe(403);
  });

  it('When a contractor reopens a ticket resolved more than 14 days ago, then 409', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    await contractorClient.patch(`/api/tickets/${ticket.id}`, { status: 'resolved' });
    await testDb().pool.query(`update tickets set resolved_at = now() - interval '15 days' where id = $1`, [
      ticket.id,
    ]);
    const res = await contractorClient.patch(`/api/tickets/${ticket.id}`, { status: 'open' });
    expect(res.status).toBe(409);
  });

  it('When a tech transfers a ticket to another branch, then that branch sees it', async () => {
    const { ticket, techClient } = await ticketWorld(server);
    const other = await makeAccount();
    const res = await techClient.patch(`/api/tickets/${ticket.id}`, { branchId: other.homeBranchId });
    expect(res.body.ticket.branchId).toBe(other.homeBranchId);
    const otherTech = await signedInClient(
      server,
      await makeUser({ role: 'tech', branchIds: [other.homeBranchId] }),
    );
    await otherTech.get(`/api/tickets/${ticket.id}`).expect(200);
  });
});

describe('messages', () => {
  it('When the same clientId is sent twice, then one message is stored and both answers are that message', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const clientId = newClientId();
    const first = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'Manifold reads 3.2',
      clientId,
    });
    const second = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'Manifold reads 3.2',
      clientId,
    });
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.body.message.id).toBe(first.body.message.id);
    const list = await contractorClient.get(`/api/tickets/${ticket.id}/messages`).expect(200);
    expect(list.body.items.filter((m: { clientId: string }) => m.clientId === clientId)).toHaveLength(1);
  });

  it('When a tech writes an internal note, then the contractor never sees it in the list, and a contractor cannot write one', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    await techClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'Warranty expired last spring',
      clientId: newClientId(),
      kind: 'internal-note',
    });
    await techClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'Check the flame sensor',
      clientId: newClientId(),
    });
    const seen = await contractorClient.get(`/api/tickets/${ticket.id}/messages`).expect(200);
    expect(seen.body.items.map((m: { body: string }) => m.body)).toEqual(['Check the flame sensor']);
    const staffView = await techClient.get(`/api/tickets/${ticket.id}/messages`).expect(200);
    expect(staffView.body.items).toHaveLength(2);
    const sneaky = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'x',
      clientId: newClientId(),
      kind: 'internal-note',
    });
    expect(sneaky.status).toBe(403);
  });

  it('When the desk answers first, then the first response is stamped and a new ticket becomes open', async () => {
    const { ticket, techClient } = await ticketWorld(server);
    const res = await techClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'On it',
      clientId: newClientId(),
    });
    expect(res.status).toBe(201);
    const after = await techClient.get(`/api/tickets/${ticket.id}`).expect(200);
    expect(after.body.ticket.status).toBe('open');
    expect(after.body.ticket.firstResponseAt).not.toBeNull();
  });

  it('When asked for messages after an id, then only the later ones come back, oldest first', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const ids: number[] = [];
    for (const body of ['one', 'two', 'three']) {
      ids.push(
        (await contractorClient.post(`/api/tickets/${ticket.id}/messages`, { body, clientId: newClientId() }))
          .body.message.id,
      );
    }
    const res = await contractorClient.get(`/api/tickets/${ticket.id}/messages?after=${ids[0]}`).expect(200);
    expect(res.body.items.map((m: { body: string }) => m.body)).toEqual(['two', 'three']);
  });

  it('When a message is over 10,000 characters or empty, then 400', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const long = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'x'.repeat(10_001),
      clientId: newClientId(),
    });
    expect(long.status).toBe(400);
    const empty = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: '',
      clientId: newClientId(),
    });
    expect(empty.status).toBe(400);
  });
});

describe('snippets', () => {
  it('When a tech saves a personal snippet, then only they see it; a shared one the whole desk sees', async () => {
    const a = await signedInClient(server, await makeUser({ role: 'tech' }));
    const b = await signedInClient(server, await makeUser({ role: 'tech' }));
    const mine = await a.post('/api/snippets', {
      title: 'Ask for manifold',
      body: 'What does the manifold read at high fire?',
    });
    const shared = await a.post('/api/snippets', {
      title: 'Shared greeting',
      body: 'Thanks for the photos.',
      shared: true,
    });
    expect(mine.status).toBe(201);
    const seenByB = await b.get('/api/snippets').expect(200);
    const ids = seenByB.body.items.map((s: { id: number }) => s.id);
    expect(ids).toContain(shared.body.snippet.id);
    expect(ids).not.toContain(mine.body.snippet.id);
    const edit = await b.patch(`/api/snippets/${mine.body.snippet.id}`, { title: 'mine now' });
    expect(edit.status).toBe(404);
    const contractor = await signedInClient(server, await makeUser());
    await contractor.get('/api/snippets').expect(403);
  });
});
