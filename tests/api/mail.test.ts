// E-mail end to end: the real server queues in PostgreSQL (pg-boss), nodemailer speaks SMTP to a
// real maildev that this file starts, stops and starts again. Nothing of the mail path is mocked.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { io as connect, type Socket } from 'socket.io-client';
import { startMailSink, type MailSink } from '../../api/scripts/lib/maildev.mjs';
import { freePort } from '../../api/scripts/lib/net.mjs';
import { articles, branches } from '../../api/src/db/schema/index';
import { REPLIES_QUEUE } from '../../api/src/features/mail/notifications';
import { MAIL_QUEUE } from '../../api/src/features/mail/mail.queue';
import type { RunningServer } from '../../api/src/server';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/src/events';
import { closeTestDb, makeAccount, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, TestClient } from '../support/server';
import { newClientId, ticketWorld } from '../support/tickets';

interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: { address: string }[];
}

const APP_URL = 'http://desk.lightoff.test';
const REPLY_DELAY = 2;
const JOBS_SCHEMA = `pgboss_mail_${process.pid}_${Date.now() % 100_000}`;
let server: RunningServer;
let sink: MailSink;
let ports: { smtp: number; web: number };
const sockets: Socket[] = [];

const startSink = async (): Promise<MailSink> =>
  startMailSink({
    root: process.cwd(),
    smtpPort: ports.smtp,
    webPort: ports.web,
    logFile: join(tmpdir(), `lightoff-mail-test-${process.pid}.log`),
  });

beforeAll(async () => {
  ports = { smtp: await freePort(), web: await freePort() };
  sink = await startSink();
  // A page for the app's paths, so the links in e-mails can be opened whether or not the app is built.
  const web = mkdtempSync(join(tmpdir(), 'lightoff-mail-web-'));
  writeFileSync(join(web, 'index.html'), '<!doctype html><div id="app"></div>');
  server = await startTestServer({
    SMTP_PORT: String(ports.smtp),
    MAIL_RETRY_DELAY_SECONDS: '1',
    MAIL_REPLY_DELAY_SECONDS: String(REPLY_DELAY),
    // Our own queue tables: other test files' servers must not deliver this file's e-mail.
    JOBS_SCHEMA,
    APP_URL,
    WEB_DIST: web,
  });
}, 60_000);
afterAll(async () => {
  sockets.forEach((s) => s.disconnect());
  await server?.stop();
  await sink?.stop();
  await testDb().db.execute(sql.raw(`drop schema if exists ${JOBS_SCHEMA} cascade`));
  await closeTestDb();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function mailsTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${sink.webUrl}/api/email`);
  const all = (await res.json()) as CaughtMail[];
  return all.filter((m) => m.to.some((t) => t.address === address.toLowerCase()));
}

async function waitForMails(address: string, count: number, timeoutMs = 20_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const got = await mailsTo(address);
    if (got.length >= count || Date.now() > until) return got;
    await sleep(200);
  }
}

/** Every queued and gathering job has run (or gave up), so what was to arrive has arrived. */
async function settle() {
  await server.ctx.jobs.drain(REPLIES_QUEUE, 30_000);
  await server.ctx.jobs.drain(MAIL_QUEUE, 30_000);
  await sleep(300);
}

/** The message as it crossed SMTP, headers unfolded. */
async function rawSource(mail: CaughtMail) {
  const source = await (await fetch(`${sink.webUrl}/api/email/${mail.id}/source`)).text();
  return source.replace(/\r?\n[ \t]+/g, ' '); // long headers are folded onto several lines
}

/** The app links in a text part, as paths on the test server. */
const linksIn = (text: string) =>
  [...text.matchAll(new RegExp(`${APP_URL.replace(/\./g, '\\.')}(/[^\\s>"]*)`, 'g'))].map((m) => m[1]!);

async function socketFor(client: TestClient) {
  const socket: Socket<ServerToClientEvents, ClientToServerEvents> = connect(server.url, {
    transports: ['websocket'],
    extraHeaders: { Cookie: client.cookieHeader() },
    reconnection: false,
  });
  sockets.push(socket);
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', () => resolve());
    socket.once('connect_error', reject);
  });
  return socket;
}

const reply = (client: TestClient, ticketId: number, body: string, kind = 'message') =>
  client.post(`/api/tickets/${ticketId}/messages`, { body, clientId: newClientId(), kind });

describe('delivery while SMTP is down', () => {
  it('When the sink is stopped, then five notifications wait in PostgreSQL and each arrives exactly once after it starts again', async () => {
    const contractor = await makeUser();
    const client = await signedInClient(server, contractor);
    await sink.stop();
    const subjects: string[] = [];
    for (let i = 1; i <= 5; i++) {
      const res = await client.post('/api/tickets', {
        subject: `Flame rollout at start-up, unit ${i}`,
        description: 'Burners light with a lazy flame that rolls out of the vestibule.',
        fuel: 'natural-gas',
        urgency: 'job-held',
      });
      expect(res.status).toBe(201);
      subjects.push(`Ticket ${res.body.ticket.number} received: Flame rollout at start-up, unit ${i}`);
    }
    // Every one was tried against the stopped sink and is waiting to be tried again.
    const failedOnce = async () => {
      const { rows } = await testDb().pool.query<{ n: number }>(
        `select count(*)::int as n from ${JOBS_SCHEMA}.job where name = $1 and state = 'retry' and data->>'to' = $2`,
        [MAIL_QUEUE, contractor.email],
      );
      return rows[0]!.n;
    };
    for (let i = 0; i < 100 && (await failedOnce()) < 5; i++) await sleep(100);
    expect(await failedOnce()).toBe(5);

    sink = await startSink();
    await waitForMails(contractor.email, 5, 40_000);
    await settle();
    const got = await mailsTo(contractor.email);
    expect(got.map((m) => m.subject).sort()).toEqual([...subjects].sort());
  }, 90_000);
});

describe('desk replies to a contractor who is not in the app', () => {
  it('When the desk sends a burst of five replies and a note, then one e-mail carries all five replies and never the note', async () => {
    const { ticket, techClient, contractor } = await ticketWorld(server, { urgency: 'question' });
    const bodies = [1, 2, 3, 4, 5].map((i) => `Step ${i}: check the <pressure> & the vent ${unique()}`);
    for (const [i, body] of bodies.entries()) {
      expect((await reply(techClient, ticket.id, body)).status).toBe(201);
      if (i === 2)
        await reply(techClient, ticket.id, 'NOTE: contractor seems unsure, call them', 'internal-note');
    }
    await sleep(REPLY_DELAY * 1000 + 500);
    await settle();
    const replies = (await mailsTo(contractor.email)).filter((m) => m.subject.includes('replies on ticket'));
    expect(replies).toHaveLength(1);
    const [mail] = replies as [CaughtMail];
    expect(mail.subject).toBe(`5 replies on ticket ${ticket.number}: ${ticket.subject}`);
    for (const body of bodies) {
      expect(mail.text).toContain(body);
      expect(mail.html).toContain(body.replace('&', '&amp;').replace('<', '&lt;').replace('>', '&gt;'));
    }
    expect(mail.html).not.toContain('<pressure>');
    expect(mail.text + mail.html).not.toContain('NOTE: contractor seems unsure');
    expect(mail.text).toContain('Caution:');
    const source = await rawSource(mail);
    expect(source).toMatch(
      /^List-Unsubscribe: <http:\/\/desk\.lightoff\.test\/api\/mail\/unsubscribe\?token=/m,
    );
    expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click/m);

    // A later burst mails only what is new since that e-mail.
    await reply(techClient, ticket.id, 'One more: leak-test the union you opened.');
    await sleep(REPLY_DELAY * 1000 + 500);
    await settle();
    const later = (await mailsTo(contractor.email)).filter((m) => m.subject.startsWith('A reply on ticket'));
    expect(later).toHaveLength(1);
    expect(later[0]!.text).toContain('leak-test the union');
    expect(later[0]!.text).not.toContain(bodies[0]);
  }, 40_000);

  it('When the contractor has a connected socket, then desk replies send no e-mail', async () => {
    const { ticket, techClient, contractor, contractorClient } = await ticketWorld(server, {
      urgency: 'question',
    });
    await socketFor(contractorClient);
    await reply(techClient, ticket.id, 'Can you send a photo of the rating plate?');
    await reply(techClient, ticket.id, 'And the inlet pressure under fire.');
    await sleep(REPLY_DELAY * 1000 + 500);
    await settle();
    const got = await mailsTo(contractor.email);
    expect(got.map((m) => m.subject)).toEqual([`Ticket ${ticket.number} received: ${ticket.subject}`]);
  }, 30_000);

  it('When the contractor reads the replies before the e-mail is due, then none is sent', async () => {
    const { ticket, techClient, contractor, contractorClient } = await ticketWorld(server, {
      urgency: 'question',
    });
    const posted = await reply(techClient, ticket.id, 'Check the flame sensor with a microamp meter.');
    const socket = await socketFor(contractorClient);
    expect((await socket.emitWithAck('ticket:join', { ticketId: ticket.id })).ok).toBe(true);
    await socket.emitWithAck('message:read', { ticketId: ticket.id, messageId: posted.body.message.id });
    socket.disconnect();
    await sleep(REPLY_DELAY * 1000 + 500);
    await settle();
    expect((await mailsTo(contractor.email)).filter((m) => m.subject.includes('on ticket'))).toEqual([]);
  }, 30_000);
});

describe('ticket received and resolved', () => {
  it('When an emergency ticket is opened, then the contractor and the branch desk address both get an e-mail with text and HTML, and its link opens', async () => {
    const account = await makeAccount();
    const deskEmail = `${unique('desk')}@test.example`;
    await testDb().db.update(branches).set({ deskEmail }).where(eq(branches.id, account.homeBranchId));
    const contractorHere = await makeUser({ accountId: account.id });
    const client = await signedInClient(server, contractorHere);
    const res = await client.post('/api/tickets', {
      subject: 'No heat: boiler short-cycles on high limit',
      description: 'Pump runs, boiler fires for 40 s then trips.',
      fuel: 'natural-gas',
      urgency: 'emergency',
    });
    expect(res.status).toBe(201);
    const [desk] = await waitForMails(deskEmail, 1);
    const [received] = await waitForMails(contractorHere.email, 1);
    expect(desk?.subject).toContain(`ticket ${res.body.ticket.number}`);
    expect(desk?.text).toContain('Pump runs, boiler fires');
    expect(desk?.html).toContain('Pump runs, boiler fires');
    expect(await rawSource(desk!)).not.toMatch(/^List-Unsubscribe:/m);
    expect(received?.text).toContain('No heat: boiler short-cycles');
    expect(received?.html).toMatch(/<html[\s\S]*No heat: boiler short-cycles/);
    const [ticketLink] = linksIn(received!.text);
    expect(ticketLink).toBe(`/tickets/${res.body.ticket.id}`);
    expect((await client.get(ticketLink!)).status).toBe(200);
    expect((await client.get(`/api${ticketLink}`)).status).toBe(200);
    // A question at a branch with a desk address reaches only the contractor.
    await client.post('/api/tickets', { subject: 'Which filter size?', fuel: 'other', urgency: 'question' });
    await waitForMails(contractorHere.email, 2);
    await settle();
    expect(await mailsTo(deskEmail)).toHaveLength(1);
  }, 30_000);

  it('When the desk resolves a ticket, then the contractor gets the summary and the linked contractor articles, whose links open', async () => {
    const { ticket, tech, techClient, contractor, contractorClient } = await ticketWorld(server, {
      urgency: 'question',
    });
    const article = async (audience: 'contractor' | 'staff', title: string) => {
      const [row] = await testDb()
        .db.insert(articles)
        .values({
          slug: unique('flame-sensor-'),
          title,
          summary: `Summary of ${title}`,
          body: 'Body.',
          kind: 'procedure',
          audience,
          status: 'published',
          publishedAt: new Date(),
          authorId: tech.id,
        })
        .returning();
      return row!;
    };
    const open = await article('contractor', 'Cleaning a flame sensor');
    const internal = await article('staff', 'Warranty rules for flame sensors');
    await socketFor(contractorClient); // online: no reply e-mail muddles the count
    await reply(techClient, ticket.id, `See ${APP_URL}/kb/${open.slug} and /kb/${internal.slug}`);
    const resolved = await techClient.patch(`/api/tickets/${ticket.id}`, {
      status: 'resolved',
      resolutionSummary: 'Cleaned the flame sensor; 4.2 µA under fire.',
    });
    expect(resolved.status).toBe(200);
    const mail = (await waitForMails(contractor.email, 2)).find((m) => m.subject.includes('resolved'));
    expect(mail?.subject).toBe(`Ticket ${ticket.number} resolved: ${ticket.subject}`);
    expect(mail?.text).toContain('Cleaned the flame sensor; 4.2 µA under fire.');
    expect(mail?.text).toContain('Cleaning a flame sensor');
    expect(mail?.html).toContain('Cleaning a flame sensor');
    expect(mail?.text + mail!.html).not.toContain('Warranty rules');
    const links = linksIn(mail!.text);
    expect(links).toContain(`/kb/${open.slug}`);
    expect(links).toContain(`/tickets/${ticket.id}`);
    for (const path of links.filter((l) => !l.startsWith('/unsubscribe'))) {
      expect((await contractorClient.get(path)).status).toBe(200);
    }
    expect((await contractorClient.get(`/api/articles/${open.slug}`)).status).toBe(200);
  }, 30_000);
});

describe('preferences and unsubscribing', () => {
  it('When a contractor turns "ticket received" off on their profile, then opening a ticket sends no e-mail', async () => {
    const contractor = await makeUser();
    const client = await signedInClient(server, contractor);
    expect((await client.get('/api/me/mail-preferences')).body).toEqual({
      preferences: { ticketReceived: true, replies: true, resolved: true },
    });
    expect((await client.patch('/api/me/mail-preferences', {})).status).toBe(400);
    expect((await client.patch('/api/me/mail-preferences', { marketing: false })).status).toBe(400);
    const off = await client.patch('/api/me/mail-preferences', { ticketReceived: false });
    expect(off.body.preferences).toEqual({ ticketReceived: false, replies: true, resolved: true });
    await client.post('/api/tickets', {
      subject: 'Pilot will not stay lit',
      fuel: 'propane',
      urgency: 'question',
    });
    await settle();
    expect(await mailsTo(contractor.email)).toEqual([]);
    expect((await new TestClient(server).get('/api/me/mail-preferences')).status).toBe(401);
  }, 20_000);

  it('When someone opens the link in an e-mail without signing in, then it turns that e-mail off; a changed token is refused', async () => {
    const contractor = await makeUser();
    const client = await signedInClient(server, contractor);
    await client.post('/api/tickets', {
      subject: 'Odd noise at the inducer',
      fuel: 'natural-gas',
      urgency: 'question',
    });
    const [mail] = await waitForMails(contractor.email, 1);
    const page = linksIn(mail!.text).find((l) => l.startsWith('/unsubscribe?token='))!;
    const token = new URLSearchParams(page.split('?')[1]).get('token')!;
    const stranger = new TestClient(server); // no session, no CSRF token
    expect((await stranger.get(page)).status).toBe(200);

    const tampered = token.replace(/\.ticketReceived\./, '.replies.');
    const bad = await stranger.agent.post('/api/mail/unsubscribe').send({ token: tampered });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not valid/);
    const otherUser = token.replace(/^\d+/, String(contractor.id + 1));
    expect((await stranger.agent.post('/api/mail/unsubscribe').send({ token: otherUser })).status).toBe(400);
    expect((await client.get('/api/me/mail-preferences')).body.preferences.ticketReceived).toBe(true);

    const ok = await stranger.agent.post('/api/mail/unsubscribe').send({ token });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ kind: 'ticketReceived' });
    expect((await client.get('/api/me/mail-preferences')).body.preferences).toEqual({
      ticketReceived: false,
      replies: true,
      resolved: true,
    });
  }, 20_000);

  it('When a mail program sends the one-click unsubscribe POST, then that e-mail is turned off', async () => {
    const { ticket, techClient, contractor, contractorClient } = await ticketWorld(server, {
      urgency: 'question',
    });
    await reply(techClient, ticket.id, 'Try the reset on the control board.');
    const mail = (await waitForMails(contractor.email, 2, 15_000)).find((m) =>
      m.subject.startsWith('A reply'),
    );
    const header = /^List-Unsubscribe: <([^>]+)>/m.exec(await rawSource(mail!))?.[1];
    const path = header!.slice(APP_URL.length);
    const res = await new TestClient(server).agent.post(path).type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    expect((await contractorClient.get('/api/me/mail-preferences')).body.preferences.replies).toBe(false);
  }, 20_000);
});

describe('e-mail address changes', () => {
  it('When an admin changes a user’s address, then both the old and the new address are told', async () => {
    const admin = await signedInClient(server, await makeUser({ role: 'admin' }));
    const user = await makeUser({ role: 'tech' });
    const next = `${unique('moved')}@test.example`;
    expect((await admin.patch(`/api/admin/users/${user.id}`, { email: next })).status).toBe(200);
    const [toOld] = await waitForMails(user.email, 1);
    const [toNew] = await waitForMails(next, 1);
    for (const mail of [toOld, toNew]) {
      expect(mail?.subject).toBe('Your Lightoff e-mail address was changed');
      expect(mail?.text).toContain(`from ${user.email} to ${next}`);
      expect(mail?.html).toContain(next);
      expect(await rawSource(mail!)).not.toMatch(/^List-Unsubscribe:/m);
    }
    expect((await admin.patch(`/api/admin/users/${user.id}`, { name: 'Renamed tech' })).status).toBe(200);
    await settle();
    expect(await mailsTo(next)).toHaveLength(1);
  }, 20_000);
});
