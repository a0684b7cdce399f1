import { readdir } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import exifr from 'exifr';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';
import type { Message, Ticket } from '../../shared/src/index';
import { closeTestDb, makeAccount, makeEquipmentModel, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { phonePhoto } from '../support/photos';
import { newClientId, ticketWorld } from '../support/tickets';
import type { RunningServer } from '../../api/src/server';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
let server: RunningServer;
const sockets: ClientSocket[] = [];
const UPLOAD_DIR = `/tmp/lightoff-test-uploads-writeup-${process.pid}`;

beforeAll(async () => {
  server = await startTestServer({ UPLOAD_DIR });
});
afterAll(async () => {
  sockets.forEach((s) => s.disconnect());
  await server.stop();
  await closeTestDb();
});

// Invented people of the demo scenario; phone numbers in the 555-01xx range kept for fiction.
const PHONE = '(207) 555-0143';
const EMAIL = 'dana.whitfield@keane.test';
const ADDRESS = '1187 North Ridge Road';
const SERIAL = 'CV2319A04512';

/** A contractor company with two people, a tech and a specialist at its branch, and a ticket with contact details in it. */
async function writeUpWorld(ticket: Record<string, unknown> = {}) {
  const company = `Keane Heating & Air ${unique('')}`;
  const account = await makeAccount({ company });
  const contractor = await makeUser({
    accountId: account.id,
    name: 'Dana Whitfield',
    email: `${unique('dana')}@keane.test`,
  });
  await makeUser({ accountId: account.id, name: 'Rowan Fielding' });
  const tech = await makeUser({ role: 'tech', branchIds: [account.homeBranchId], name: 'Sam Okafor' });
  const specialist = await makeUser({ role: 'specialist', branchIds: [account.homeBranchId] });
  const model = await makeEquipmentModel();
  const contractorClient = await signedInClient(server, contractor);
  const techClient = await signedInClient(server, tech);
  const specialistClient = await signedInClient(server, specialist);
  const res = await contractorClient.post('/api/tickets', {
    subject: 'Low fire drops out after a minute',
    description: `At ${ADDRESS} for ${company}. Call Dana at ${PHONE} or ${EMAIL}.`,
    fuel: 'natural-gas',
    urgency: 'emergency',
    equipmentModelId: model.id,
    serial: SERIAL,
    ...ticket,
  });
  expect(res.status).toBe(201);
  return {
    company,
    model,
    contractor,
    contractorClient,
    techClient,
    specialistClient,
    ticket: res.body.ticket as Ticket,
  };
}

async function say(client: TestClient, ticketId: number, body: string, extra: object = {}) {
  const res = await client.post(`/api/tickets/${ticketId}/messages`, {
    body,
    clientId: newClientId(),
    ...extra,
  });
  expect(res.status).toBe(201);
  return res.body.message as Message;
}

async function resolve(client: TestClient, ticketId: number, summary: string) {
  const res = await client.patch(`/api/tickets/${ticketId}`, {
    status: 'resolved',
    resolutionSummary: summary,
  });
  expect(res.status).toBe(200);
}

const articlesFrom = async (ticketId: number) =>
  (await testDb().pool.query('select count(*)::int n from articles where source_ticket_id = $1', [ticketId]))
    .rows[0].n as number;

async function socketFor(client: TestClient): Promise<ClientSocket> {
  const socket: ClientSocket = connect(server.url, {
    transports: ['websocket'],
    extraHeaders: { Cookie: client.cookieHeader() },
    reconnection: false,
  });
  sockets.push(socket);
  await new Promise<void>((ok, fail) => {
    socket.once('connect', () => ok());
    socket.once('connect_error', fail);
  });
  socket.on('message:new', (_p, ack) => ack?.({ ok: true }));
  return socket;
}
const settle = (ms = 300) => new Promise((r) => setTimeout(r, ms));

describe('writing up a resolved ticket', () => {
  it('When a resolved ticket is written up, then the draft holds the marked messages and none of the phone, e-mail, address, names or company', async () => {
    const w = await writeUpWorld();
    const question = await say(
      w.contractorClient,
      w.ticket.id,
      `Dana here again, cell ${PHONE}. Low fire dies.`,
    );
    await say(w.contractorClient, w.ticket.id, 'thanks, will try');
    const answer = await say(
      w.techClient,
      w.ticket.id,
      'Low-fire manifold should be 1.7 in. w.c.; raise it at the valve low-fire screw.',
    );
    const note = await say(w.techClient, w.ticket.id, `Rowan Fielding called from ${EMAIL} too.`, {
      kind: 'internal-note',
    });
    const reading = await w.contractorClient.post(`/api/tickets/${w.ticket.id}/readings`, {
      kind: 'gas-pressure',
      values: { inletStaticInWc: 7, manifold: [{ stage: 'single', valueInWc: 3.1 }] },
    });
    expect(reading.status).toBe(201);
    await resolve(w.techClient, w.ticket.id, `Raised the manifold pressure. Dana confirmed at ${PHONE}.`);
    for (const m of [question, answer]) {
      const mark = await w.techClient.patch(`/api/tickets/${w.ticket.id}/messages/${m.id}`, {
        partOfAnswer: true,
      });
      expect(mark.status).toBe(200);
    }

    const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
      messageIds: [answer.id, question.id, note.id],
      attachmentIds: [],
    });
    expect(res.status).toBe(201);
    const { article, removed } = res.body;
    expect(article).toMatchObject({ kind: 'troubleshooting', audience: 'contractor', status: 'in-review' });
    expect(article.title).toBe(`Low fire drops out after a minute — ${w.model.modelNumber}`);
    expect(article.models.map((m: { id: number }) => m.id)).toEqual([w.model.id]);
    const body: string = article.body;
    // The answer, oldest first, with who said it by side, never by name.
    expect(body.indexOf('Low fire dies')).toBeGreaterThan(-1);
    expect(body.indexOf('Low fire dies')).toBeLessThan(body.indexOf('raise it at the valve low-fire screw'));
    expect(body).toContain('**Desk:** Low-fire manifold should be 1.7 in. w.c.');
    expect(body).toContain('**Desk (internal note):**');
    expect(body).not.toContain('thanks, will try');
    // The problem, equipment, fuel, the readings with their verdicts, the resolution, the gas caution.
    expect(body).toContain('- **Fuel:** Natural gas');
    expect(body).toMatch(
      /\| Manifold pressure \| 3\.1 in\. w\.c\. \| 3\.5 in\. w\.c\. \(3\.2–3\.8 in\. w\.c\.\) \| low \|/,
    );
    expect(body).toContain('NFPA 54/ANSI Z223.1');
    expect(body).toContain('Raised the manifold pressure.');
    // Nothing of the contractor's contact details.
    for (const gone of [
      PHONE,
      '555-0143',
      EMAIL,
      ADDRESS,
      'Dana',
      'Whitfield',
      'Rowan',
      'Fielding',
      w.company,
      'Keane',
      SERIAL,
    ]) {
      expect(body, gone).not.toContain(gone);
      expect(article.title + article.summary, gone).not.toContain(gone);
    }
    expect(body).toContain('[phone removed]');
    expect(removed).toEqual(
      expect.arrayContaining([
        { kind: 'phone', text: PHONE },
        { kind: 'email', text: EMAIL },
        { kind: 'address', text: ADDRESS },
        { kind: 'company', text: w.company },
        { kind: 'name', text: 'Rowan Fielding' },
        { kind: 'name', text: 'Dana' },
      ]),
    );
    // The editor shows what went; the first revision says so without repeating it.
    expect(article.origin).toEqual({
      ticketCount: 1,
      tickets: [{ id: w.ticket.id, number: w.ticket.number }],
      removed,
    });
    const revisions = await w.techClient.get(`/api/articles/${article.id}/revisions`);
    expect(revisions.body.items).toHaveLength(1);
    expect(revisions.body.items[0].note).toMatch(
      /^Written up from ticket HV-\d+\. Removed before saving: .*1 phone number/,
    );
    expect(revisions.body.items[0].note).not.toContain('555');
    // The row links back to the ticket.
    const row = await testDb().pool.query('select source_ticket_id, author_id from articles where id = $1', [
      article.id,
    ]);
    expect(row.rows[0].source_ticket_id).toBe(w.ticket.id);
  });

  it('When the serial is kept on purpose, then it is in the draft', async () => {
    const w = await writeUpWorld();
    await resolve(w.techClient, w.ticket.id, 'Replaced the pressure switch.');
    const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
      messageIds: [],
      keepSerial: true,
    });
    expect(res.status).toBe(201);
    expect(res.body.article.body).toContain(`- **Serial number:** ${SERIAL}`);
    expect(res.body.removed.some((r: { kind: string }) => r.kind === 'serial')).toBe(false);
  });

  it('When the ticket is not resolved, then 409 and no article', async () => {
    const w = await writeUpWorld();
    const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, { messageIds: [] });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(await articlesFrom(w.ticket.id)).toBe(0);
  });

  it('When the contractor asks to write up their own ticket, then 403; another account or branch gets 404', async () => {
    const w = await writeUpWorld();
    await resolve(w.techClient, w.ticket.id, 'Cleaned the flame sensor.');
    const own = await w.contractorClient.post(`/api/tickets/${w.ticket.id}/write-up`, { messageIds: [] });
    expect(own.status).toBe(403);
    const stranger = await signedInClient(server, await makeUser());
    expect((await stranger.post(`/api/tickets/${w.ticket.id}/write-up`, { messageIds: [] })).status).toBe(
      404,
    );
    const elsewhere = await signedInClient(server, await makeUser({ role: 'tech' }));
    expect((await elsewhere.post(`/api/tickets/${w.ticket.id}/write-up`, { messageIds: [] })).status).toBe(
      404,
    );
    expect(await articlesFrom(w.ticket.id)).toBe(0);
  });

  it('When a message or photo of another ticket is chosen, then 400 names the field and nothing is stored', async () => {
    const w = await writeUpWorld();
    const other = await ticketWorld(server);
    const foreign = await say(other.contractorClient, other.ticket.id, 'not this one');
    const upload = await other.contractorClient.agent
      .post(`/api/tickets/${other.ticket.id}/attachments`)
      .set('X-CSRF-Token', other.contractorClient.csrfToken)
      .attach('files', await phonePhoto(400, 300), 'plate.jpg');
    expect(upload.status).toBe(201);
    await resolve(w.techClient, w.ticket.id, 'Reset the rollout switch.');
    const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
      messageIds: [foreign.id],
      attachmentIds: [upload.body.attachments[0].id],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      messageIds: expect.any(String),
      attachmentIds: expect.any(String),
    });
    expect(await articlesFrom(w.ticket.id)).toBe(0);
    const bad = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, { messageIds: ['x'] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['messageIds.0']);
  });

  it('When the write-up fails after its photos were stored, then their files are removed too', async () => {
    const w = await writeUpWorld();
    const upload = await w.contractorClient.agent
      .post(`/api/tickets/${w.ticket.id}/attachments`)
      .set('X-CSRF-Token', w.contractorClient.csrfToken)
      .attach('files', await phonePhoto(400, 300), 'plate.jpg');
    const [jpeg] = upload.body.attachments as { id: number }[];
    await say(w.contractorClient, w.ticket.id, 'rating plate', { attachmentIds: [jpeg!.id] });
    await resolve(w.techClient, w.ticket.id, 'Set the low-fire pressure.');
    // The stored files (photo and thumbnail) under the articles' folder; directories do not count.
    const articleFiles = async () =>
      (await readdir(`${UPLOAD_DIR}/articles`, { recursive: true }).catch(() => [] as string[])).filter((f) =>
        /\.(jpg|jpeg|png|webp)$/.test(f),
      );
    const before = await articleFiles();
    // The write-up's last statement fails (as a lost connection or a constraint would), after the
    // photo's files were stored.
    const fn = unique('fail_write_up_').toLowerCase();
    const { pool } = testDb();
    await pool.query(`create function ${fn}() returns trigger language plpgsql as $$
      begin
        if new.action = 'article.write-up' and (new.details->>'ticketId')::int = ${w.ticket.id} then
          raise exception 'forced failure';
        end if;
        return new;
      end $$`);
    await pool.query(`create trigger ${fn} before insert on audit_log for each row execute function ${fn}()`);
    try {
      const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
        attachmentIds: [jpeg!.id],
      });
      expect(res.status).toBe(500);
    } finally {
      await pool.query(`drop trigger ${fn} on audit_log`);
      await pool.query(`drop function ${fn}()`);
    }
    expect((await articleFiles()).sort()).toEqual([...before].sort());
    const left = await pool.query('select count(*)::int as n from articles where source_ticket_id = $1', [
      w.ticket.id,
    ]);
    expect(left.rows[0].n).toBe(0);
  });

  it('When photos are ticked, then they are copied into the article, re-encoded without their metadata', async () => {
    const w = await writeUpWorld();
    const original = await phonePhoto(400, 300);
    const upload = await w.contractorClient.agent
      .post(`/api/tickets/${w.ticket.id}/attachments`)
      .set('X-CSRF-Token', w.contractorClient.csrfToken)
      .attach('files', original, 'dana-whitfield-plate.jpg')
      .attach('files', Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n'), 'manual.pdf');
    expect(upload.status).toBe(201);
    const [jpeg, pdf] = upload.body.attachments as { id: number; contentType: string }[];
    await say(w.contractorClient, w.ticket.id, 'rating plate', { attachmentIds: [jpeg!.id, pdf!.id] });
    await resolve(w.techClient, w.ticket.id, 'Set the low-fire pressure.');

    const withPdf = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
      attachmentIds: [pdf!.id],
    });
    expect(withPdf.status).toBe(400);
    expect(withPdf.body.error.fields.attachmentIds).toMatch(/photos/i);

    const res = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {
      attachmentIds: [jpeg!.id],
    });
    expect(res.status).toBe(201);
    const article = res.body.article;
    const images = await testDb().pool.query(
      'select id, file_name, sha256 from article_images where article_id = $1',
      [article.id],
    );
    expect(images.rows).toHaveLength(1);
    expect(images.rows[0].file_name).not.toMatch(/dana|whitfield/i);
    const url = `/api/articles/${article.id}/images/${images.rows[0].id}`;
    expect(article.body).toContain(`![Photo 1 from the job](${url})`);
    expect(article.bodyHtml).toContain(`src="${url}"`);
    const file = await w.techClient
      .get(url)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(file.status).toBe(200);
    const bytes = file.body as Buffer;
    expect(bytes.equals(original)).toBe(false);
    expect(await exifr.gps(bytes).catch(() => undefined)).toBeUndefined();
    expect((await sharp(bytes).metadata()).exif).toBeUndefined();
  });
});

describe('the write-up once published', () => {
  it('When a specialist publishes the draft, then the contractor sees "written up as" on the ticket and the article counts its ticket', async () => {
    const w = await writeUpWorld();
    await resolve(w.techClient, w.ticket.id, 'Low-fire pressure was set too low; raised to 1.7 in. w.c.');
    const made = await w.techClient.post(`/api/tickets/${w.ticket.id}/write-up`, {});
    expect(made.status).toBe(201);
    const { id, slug, title } = made.body.article;

    // Before publishing only the desk sees the link.
    expect((await w.techClient.get(`/api/tickets/${w.ticket.id}/write-ups`)).body.items).toEqual([
      { id, slug, title, status: 'in-review' },
    ]);
    expect((await w.contractorClient.get(`/api/tickets/${w.ticket.id}/write-ups`)).body.items).toEqual([]);
    // The author cannot publish their own; a specialist can.
    expect((await w.techClient.post(`/api/articles/${id}/publish`)).status).toBe(403);
    const published = await w.specialistClient.post(`/api/articles/${id}/publish`);
    expect(published.status).toBe(200);

    expect((await w.contractorClient.get(`/api/tickets/${w.ticket.id}/write-ups`)).body.items).toEqual([
      { id, slug, title, status: 'published' },
    ]);
    const asContractor = await w.contractorClient.get(`/api/articles/${slug}`);
    expect(asContractor.body.article.origin).toEqual({ ticketCount: 1, tickets: [] });
    const asSpecialist = await w.specialistClient.get(`/api/articles/${slug}`);
    expect(asSpecialist.body.article.origin).toMatchObject({
      ticketCount: 1,
      tickets: [{ id: w.ticket.id, number: w.ticket.number }],
    });
    const stranger = await signedInClient(server, await makeUser());
    expect((await stranger.get(`/api/tickets/${w.ticket.id}/write-ups`)).status).toBe(404);
  });
});

describe('marking messages as part of the answer', () => {
  it('When a tech marks a message, then other staff on the ticket see it live, the contractor never sees the flag', async () => {
    const w = await writeUpWorld();
    const message = await say(w.contractorClient, w.ticket.id, 'Flame lights then drops out.');
    expect(message).not.toHaveProperty('partOfAnswer');
    const specialistSocket = await socketFor(w.specialistClient);
    const contractorSocket = await socketFor(w.contractorClient);
    expect((await specialistSocket.emitWithAck('ticket:join', { ticketId: w.ticket.id })).ok).toBe(true);
    expect((await contractorSocket.emitWithAck('ticket:join', { ticketId: w.ticket.id })).ok).toBe(true);
    const staffHeard: unknown[] = [];
    const contractorHeard: unknown[] = [];
    specialistSocket.on('message:marked', (p) => void staffHeard.push(p));
    contractorSocket.on('message:marked', (p) => void contractorHeard.push(p));

    const res = await w.techClient.patch(`/api/tickets/${w.ticket.id}/messages/${message.id}`, {
      partOfAnswer: true,
    });
    expect(res.status).toBe(200);
    expect(res.body.message).toMatchObject({ id: message.id, partOfAnswer: true });
    await settle();
    expect(staffHeard).toEqual([{ ticketId: w.ticket.id, messageId: message.id, partOfAnswer: true }]);
    expect(contractorHeard).toEqual([]);

    const staffList = (await w.techClient.get(`/api/tickets/${w.ticket.id}/messages`)).body
      .items as Message[];
    expect(staffList.find((m) => m.id === message.id)?.partOfAnswer).toBe(true);
    const contractorList = (await w.contractorClient.get(`/api/tickets/${w.ticket.id}/messages`)).body
      .items as Message[];
    expect(contractorList.length).toBeGreaterThan(0);
    for (const m of contractorList) expect(m).not.toHaveProperty('partOfAnswer');

    // The same over the socket, and unmarking.
    const ack = await specialistSocket.emitWithAck('message:mark', {
      ticketId: w.ticket.id,
      messageId: message.id,
      partOfAnswer: false,
    });
    expect(ack).toMatchObject({ ok: true, message: { id: message.id, partOfAnswer: false } });
    const after = (await w.techClient.get(`/api/tickets/${w.ticket.id}/messages`)).body.items as Message[];
    expect(after.find((m) => m.id === message.id)?.partOfAnswer).toBe(false);
  });

  it('When a tech sends a message, then the contractor receives it without the flag', async () => {
    const w = await writeUpWorld();
    const contractorSocket = await socketFor(w.contractorClient);
    await contractorSocket.emitWithAck('ticket:join', { ticketId: w.ticket.id });
    const got: Message[] = [];
    contractorSocket.on('message:new', ({ message }) => void got.push(message));
    const sent = await say(w.techClient, w.ticket.id, 'Check the low-fire pressure.');
    expect(sent.partOfAnswer).toBe(false);
    await settle();
    expect(got.map((m) => m.id)).toEqual([sent.id]);
    expect(got[0]).not.toHaveProperty('partOfAnswer');
  });

  it('When a contractor tries to mark, or a message is of another ticket, then 403 and 404, and nothing changes', async () => {
    const w = await writeUpWorld();
    const message = await say(w.contractorClient, w.ticket.id, 'Is it the valve?');
    const refused = await w.contractorClient.patch(`/api/tickets/${w.ticket.id}/messages/${message.id}`, {
      partOfAnswer: true,
    });
    expect(refused.status).toBe(403);
    const socket = await socketFor(w.contractorClient);
    const ack = await socket.emitWithAck('message:mark', {
      ticketId: w.ticket.id,
      messageId: message.id,
      partOfAnswer: true,
    });
    expect(ack).toMatchObject({ ok: false, error: { code: 'forbidden' } });
    const other = await ticketWorld(server);
    const foreign = await say(other.contractorClient, other.ticket.id, 'elsewhere');
    const wrong = await w.techClient.patch(`/api/tickets/${w.ticket.id}/messages/${foreign.id}`, {
      partOfAnswer: true,
    });
    expect(wrong.status).toBe(404);
    const bad = await w.techClient.patch(`/api/tickets/${w.ticket.id}/messages/${message.id}`, {
      partOfAnswer: 'yes',
    });
    expect(bad.status).toBe(400);
    const rows = await testDb().pool.query(
      'select count(*)::int n from ticket_messages where part_of_answer and id = any($1)',
      [[message.id, foreign.id]],
    );
    expect(rows.rows[0].n).toBe(0);
  });
});
