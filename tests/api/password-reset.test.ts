// Password reset against the real server, database and mail sink: the same answer for every e-mail,
// a single-use link valid for 30 minutes, and every session of the person ended once it is used.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { eq } from 'drizzle-orm';
import type { RunningServer } from '../../api/src/server';
import { passwordResets } from '../../api/src/db/schema/index';
import { closeTestDb, makeUser, testDb, unique, type MadeUser } from '../support/fixtures';
import { linkToken, mailsTo, mailSinkEnv, waitForMails } from '../support/mailbox';
import { TestClient, signedInClient, startTestServer } from '../support/server';

const APP_URL = 'http://lightoff.test.example';
const NEW_PASSWORD = 'Quiet-orchard-lantern-73';
const MINUTE = 60_000;

let server: RunningServer;
beforeAll(async () => {
  // Every request here comes from 127.0.0.1; the per-address limit gets its own test server.
  server = await startTestServer({ APP_URL, RESET_LIMIT_PER_IP: '100000', ...mailSinkEnv('jobs_reset') });
});
afterEach(() => {
  vi.useRealTimers();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

/** Asks for a reset and reads the link's token from the e-mail that arrives. */
async function requestAndReadToken(user: Pick<MadeUser, 'email'>) {
  const before = (await mailsTo(user.email)).length;
  const res = await new TestClient(server).post('/api/auth/password-reset', { email: user.email });
  expect(res.status).toBe(202);
  const [mail] = (await waitForMails(user.email, before + 1)).slice(-1);
  return { token: linkToken(mail!, 'reset'), mail: mail! };
}

const confirm = (token: string, password = NEW_PASSWORD) =>
  new TestClient(server).post('/api/auth/password-reset/confirm', { token, password });

function moveClock(ms: number) {
  const target = Date.now() + ms;
  vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
  vi.setSystemTime(target);
}

describe('asking for a reset', () => {
  it('When the e-mail is unknown, then the answer is the same status and body as for a known one, and no mail is sent', async () => {
    const known = await makeUser({ name: 'Kit Known' });
    const unknown = `${unique('nobody')}@test.example`;
    const client = new TestClient(server);
    const a = await client.post('/api/auth/password-reset', { email: known.email });
    const b = await client.post('/api/auth/password-reset', { email: unknown });
    expect(a.status).toBe(202);
    expect(b.status).toBe(a.status);
    expect(b.body).toEqual(a.body);
    expect(a.body.message).toMatch(/If that e-mail belongs to a Lightoff sign-in/);

    const [mail] = await waitForMails(known.email);
    expect(mail!.subject).toBe('Reset your Lightoff password');
    expect(mail!.text).toContain('Hello Kit Known');
    expect(mail!.text).toMatch(new RegExp(`${APP_URL}/reset/[A-Za-z0-9_-]{43}`));
    expect(mail!.html).toContain(`${APP_URL}/reset/`);
    await server.ctx.jobs.drain('auth.password-reset');
    await server.ctx.jobs.drain('mail.send');
    expect(await mailsTo(unknown)).toHaveLength(0);
  });

  it('When the e-mail is unknown, then the answer takes about as long as for a known one', async () => {
    const known = await makeUser();
    const unknown = `${unique('nobody')}@test.example`;
    const client = new TestClient(server);
    await client.csrf();
    const time = async (email: string) => {
      const started = performance.now();
      await client.post('/api/auth/password-reset', { email });
      return performance.now() - started;
    };
    const knownMs: number[] = [];
    const unknownMs: number[] = [];
    // Fresh e-mails each round, so the per-e-mail limit never answers early.
    for (let i = 0; i < 3; i++) {
      knownMs.push(await time(i === 0 ? known.email : (await makeUser()).email));
      unknownMs.push(await time(`${unique('nobody')}${i}@test.example`));
    }
    const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[1]!;
    // The request only queues a job either way; a looked-up-and-hashed path would show up as far more.
    expect(Math.abs(median(knownMs) - median(unknownMs))).toBeLessThan(150);
    expect(unknown).not.toBe(known.email);
  });

  it('When the address is not an e-mail or missing, then 400 names the field', async () => {
    const client = new TestClient(server);
    const bad = await client.post('/api/auth/password-reset', { email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ email: 'Enter a valid e-mail address' });
    const missing = await client.post('/api/auth/password-reset', {});
    expect(missing.body.error.fields).toEqual({ email: 'Required' });
  });

  it('When one e-mail asks more than 3 times in 15 minutes, then the 4th answers 429, known or not', async () => {
    const known = await makeUser();
    const unknown = `${unique('nobody')}@test.example`;
    const client = new TestClient(server);
    for (const email of [known.email, unknown]) {
      for (let i = 0; i < 3; i++)
        expect((await client.post('/api/auth/password-reset', { email })).status).toBe(202);
      const fourth = await client.post('/api/auth/password-reset', { email: email.toUpperCase() });
      expect(fourth.status).toBe(429);
      expect(fourth.body.error.code).toBe('rate_limited');
    }
  });

  it('When one address asks too often, then it answers 429 for any e-mail', async () => {
    // Behind a proxy, so the test can speak from an address of its own (TEST-NET-3, RFC 5737).
    const limited = await startTestServer({
      RESET_LIMIT_PER_IP: '2',
      TRUST_PROXY: 'true',
      ...mailSinkEnv('jobs_reset_ip'),
    });
    const address = `203.0.113.${Math.floor(Math.random() * 250) + 1}`;
    try {
      const client = new TestClient(limited);
      const token = await client.csrf();
      const send = (n: number) =>
        client.agent
          .post('/api/auth/password-reset')
          .set('X-CSRF-Token', token)
          .set('X-Forwarded-For', address)
          .send({ email: `${unique(`ip${n}`)}@test.example` });
      expect((await send(1)).status).toBe(202);
      expect((await send(2)).status).toBe(202);
      const third = await send(3);
      expect(third.status).toBe(429);
      expect(third.body.error.message).toMatch(/from this network/);
    } finally {
      await limited.stop();
    }
  });
});

describe('using the link', () => {
  it('When the link is used, then the new password works, the old does not, every session ends, and the link cannot be used again', async () => {
    const user = await makeUser();
    const signedIn = await signedInClient(server, user);
    expect((await signedIn.get('/api/auth/me')).status).toBe(200);
    const { token } = await requestAndReadToken(user);

    const check = await new TestClient(server).post('/api/auth/password-reset/check', { token });
    expect(check.status).toBe(200);
    expect(check.body.email).toBe(user.email);

    const res = await confirm(token);
    expect(res.status).toBe(204);
    expect((await signedIn.get('/api/auth/me')).status).toBe(401);
    await new TestClient(server).signIn({ email: user.email, password: NEW_PASSWORD });
    const old = await new TestClient(server).post('/api/auth/login', {
      email: user.email,
      password: user.password,
    });
    expect(old.status).toBe(401);

    const twice = await confirm(token, 'Another-orchard-lantern-74');
    expect(twice.status).toBe(410);
    expect(twice.body.error.code).toBe('link_used');
    expect(twice.body.error.message).toMatch(/already been used/);
    await new TestClient(server).signIn({ email: user.email, password: NEW_PASSWORD });

    const [row] = await testDb().db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.tokenHash).not.toContain(token);
  });

  it('When one of two links is used, then the other outstanding one stops working too', async () => {
    const user = await makeUser();
    const first = await requestAndReadToken(user);
    const second = await requestAndReadToken(user);
    expect(second.token).not.toBe(first.token);
    expect((await confirm(second.token)).status).toBe(204);
    const other = await confirm(first.token, 'Another-orchard-lantern-74');
    expect(other.status).toBe(410);
    expect(other.body.error.code).toBe('link_used');
  });

  it('When 30 minutes have passed (clock moved), then the link answers 410 "expired"; at 29 minutes it still works', async () => {
    const user = await makeUser();
    const late = await makeUser();
    const { token } = await requestAndReadToken(user);
    const { token: lateToken } = await requestAndReadToken(late);

    moveClock(29 * MINUTE);
    expect((await confirm(token)).status).toBe(204);

    vi.setSystemTime(Date.now() + 2 * MINUTE);
    const expired = await confirm(lateToken);
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('link_expired');
    expect(expired.body.error.message).toMatch(/30 minutes/);
    const check = await new TestClient(server).post('/api/auth/password-reset/check', { token: lateToken });
    expect(check.body.error.code).toBe('link_expired');
    vi.useRealTimers();
    await new TestClient(server).signIn({ email: late.email, password: late.password });
  });

  it('When the token is wrong or missing, then 404 "not valid" or 400 on `token`', async () => {
    const wrong = await confirm('B'.repeat(43));
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.code).toBe('link_unknown');
    expect(wrong.body.error.message).toMatch(/not valid/);
    const missing = await new TestClient(server).post('/api/auth/password-reset/confirm', {
      password: NEW_PASSWORD,
    });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(['token']);
  });

  it('When the new password is common or too short, then 400 says why on `password` and the link still works', async () => {
    const user = await makeUser();
    const { token } = await requestAndReadToken(user);
    const common = await confirm(token, 'Password123!');
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toMatch(/too easy to guess/);
    const short = await confirm(token, 'short');
    expect(short.body.error.fields).toEqual({ password: 'Use at least 10 characters' });
    expect((await confirm(token)).status).toBe(204);
  });

  it('When the person was turned off after asking, then the link is not valid', async () => {
    const user = await makeUser();
    const { token } = await requestAndReadToken(user);
    const { users } = await import('../../api/src/db/schema/index');
    await testDb().db.update(users).set({ active: false }).where(eq(users.id, user.id));
    const res = await confirm(token);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('link_unknown');
  });
});

describe('the password rule elsewhere', () => {
  it('When someone changes their password to a common one, then 400 says why on `next`', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const res = await client.post('/api/auth/password', { current: user.password, next: 'iloveyou12345' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.next).toMatch(/too easy to guess/);
    await new TestClient(server).signIn(user);
  });

  it('When an admin creates a sign-in with a common password, then 400 says why on `password`', async () => {
    const admin = await signedInClient(server, await makeUser({ role: 'admin' }));
    const res = await admin.post('/api/admin/users', {
      email: `${unique('weak')}@test.example`,
      name: 'Weak Person',
      role: 'tech',
      branchIds: [(await makeUser({ role: 'tech' })).branchIds[0]],
      password: 'qwertyuiop12',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/too easy to guess/);
  });
});
