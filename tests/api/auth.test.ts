import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeTestDb, makeUser, testDb, unique } from '../support/fixtures';
import { TestClient, signedInClient, startTestServer } from '../support/server';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const sessionCookie = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('lightoff.sid='));

describe('sign-in', () => {
  it('When the e-mail and password are right, then answers 200 with the user, their account and branches', async () => {
    const tech = await makeUser({ role: 'tech' });
    const client = new TestClient(server);
    const res = await client.signIn({ email: tech.email.toUpperCase(), password: tech.password });
    expect(res.body.user).toEqual({
      id: tech.id,
      email: tech.email,
      name: 'Test tech',
      role: 'tech',
      accountId: null,
      isAccountOwner: false,
      branchIds: tech.branchIds,
    });
    const me = await client.get('/api/auth/me').expect(200);
    expect(me.body.user.id).toBe(tech.id);
  });

  it('When signed in, then the session cookie is HttpOnly, SameSite=Lax, not Secure over plain HTTP, and lasts 30 idle minutes', async () => {
    const user = await makeUser();
    const res = await new TestClient(server).signIn(user);
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    const expires = new Date(/Expires=([^;]+)/i.exec(cookie)![1]!).getTime();
    expect(expires - Date.now()).toBeGreaterThan(29 * 60 * 1000);
    expect(expires - Date.now()).toBeLessThanOrEqual(30 * 60 * 1000 + 1000);
  });

  it('When the session id existed before sign-in, then sign-in gives a new one', async () => {
    const user = await makeUser();
    const client = new TestClient(server);
    const before = sessionCookie(await client.agent.get('/api/auth/csrf'))!.split(';')[0];
    const after = sessionCookie(await client.signIn(user))!.split(';')[0];
    expect(after).not.toBe(before);
  });

  it('When the password is wrong or the e-mail unknown, then both get the same 401 answer', async () => {
    const user = await makeUser();
    const wrong = await new TestClient(server).post('/api/auth/login', {
      email: user.email,
      password: 'not-the-password',
    });
    const unknown = await new TestClient(server).post('/api/auth/login', {
      email: `${unique('nobody')}@test.example`,
      password: 'not-the-password',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error.code).toBe('invalid_credentials');
  });

  it('When one e-mail fails five times within 15 minutes, then the sixth attempt answers 429, even with the right password', async () => {
    const user = await makeUser();
    const client = new TestClient(server);
    for (let i = 0; i < 5; i++) {
      const res = await client.post('/api/auth/login', { email: user.email, password: `wrong-${i}` });
      expect(res.status).toBe(401);
    }
    const sixth = await client.post('/api/auth/login', { email: user.email, password: user.password });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.code).toBe('rate_limited');
    expect(sixth.body.error.message).toMatch(/15 minutes/);
    // Another e-mail from the same address still gets in.
    const other = await makeUser();
    await new TestClient(server).signIn(other);
  });

  it('When one network fails more sign-ins than its limit, across several e-mails, then it gets 429 and another network does not', async () => {
    // Behind a proxy the address is the forwarded one: a test network of its own, so no other
    // test's attempts from 127.0.0.1 count against it.
    const limited = await startTestServer({ LOGIN_LIMIT_PER_IP: '3', TRUST_PROXY: 'true' });
    const signInFrom = async (network: string, body: { email: string; password: string }) => {
      const client = new TestClient(limited);
      const token = await client.csrf();
      return client.agent
        .post('/api/auth/login')
        .set('X-Forwarded-For', network)
        .set('X-CSRF-Token', token)
        .send(body);
    };
    try {
      const network = `198.51.100.${1 + Math.floor(Math.random() * 250)}`;
      for (let i = 0; i < 3; i++) {
        const someone = await makeUser();
        const res = await signInFrom(network, { email: someone.email, password: 'wrong-password-1' });
        expect(res.status).toBe(401);
      }
      const user = await makeUser();
      const fourth = await signInFrom(network, { email: user.email, password: user.password });
      expect(fourth.status).toBe(429);
      expect(fourth.body.error.message).toMatch(/network/);
      const elsewhere = await signInFrom('203.0.113.9', { email: user.email, password: user.password });
      expect(elsewhere.status).toBe(200);
    } finally {
      await limited.stop();
    }
  });

  it('When the body is missing fields, then answers 400 naming them', async () => {
    const res = await new TestClient(server).post('/api/auth/login', { email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });
});

describe('CSRF', () => {
  it('When a POST carries no X-CSRF-Token, then answers 403 and does nothing', async () => {
    const user = await makeUser();
    const client = new TestClient(server);
    await client.csrf();
    const res = await client.agent
      .post('/api/auth/login')
      .send({ email: user.email, password: user.password });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    await client.get('/api/auth/me').expect(401);
  });

  it('When the token belongs to another session, then answers 403', async () => {
    const user = await makeUser();
    const other = new TestClient(server);
    const client = new TestClient(server);
    await client.csrf();
    const res = await client.agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', await other.csrf())
      .send({ email: user.email, password: user.password });
    expect(res.status).toBe(403);
  });

  it('When signed in, then the token fetched before sign-in still works', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const res = await client.post('/api/auth/logout');
    expect(res.status).toBe(204);
  });
});

describe('sign-out and session end', () => {
  it('When signed out, then the old cookie is refused', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const cookie = client.cookieHeader();
    await client.post('/api/auth/logout').then((r) => expect(r.status).toBe(204));
    const res = await new TestClient(server).agent.get('/api/auth/me').set('Cookie', cookie);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('When a session is older than 12 hours, then it is refused however active it was', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    await testDb().db.execute(sql`
      update "session" set sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(${Date.now() - 12 * 3600 * 1000 - 1000}::bigint))::json
      where (sess #>> '{passport,user}') = ${String(user.id)}`);
    await client.get('/api/auth/me').expect(401);
  });

  it('When an admin deactivates a user, then that user is refused at once, sessions and sign-in alike', async () => {
    const admin = await makeUser({ role: 'admin' });
    const user = await makeUser();
    const userClient = await signedInClient(server, user);
    await userClient.get('/api/auth/me').expect(200);
    const adminClient = await signedInClient(server, admin);
    const res = await adminClient.patch(`/api/admin/users/${user.id}`, { active: false });
    expect(res.status).toBe(200);
    expect(res.body.user.active).toBe(false);
    await userClient.get('/api/auth/me').expect(401);
    const again = await new TestClient(server).post('/api/auth/login', {
      email: user.email,
      password: user.password,
    });
    expect(again.status).toBe(401);
    const { rows } = await testDb().pool.query(
      `select count(*)::int n from "session" where (sess #>> '{passport,user}') = $1`,
      [String(user.id)],
    );
    expect(rows[0].n).toBe(0);
  });
});

describe('password change', () => {
  it('When the current password is wrong, then answers 400 on `current` and keeps the old password', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const res = await client.post('/api/auth/password', {
      current: 'wrong-password',
      next: 'A-new-passphrase-42',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ current: 'This is not your current password' });
    await new TestClient(server).signIn(user);
  });

  it('When the password changes, then the new one signs in, the old one does not, and other sessions end', async () => {
    const user = await makeUser();
    const elsewhere = await signedInClient(server, user);
    const client = await signedInClient(server, user);
    const res = await client.post('/api/auth/password', {
      current: user.password,
      next: 'A-new-passphrase-42',
    });
    expect(res.status).toBe(204);
    await client.get('/api/auth/me').expect(200);
    await elsewhere.get('/api/auth/me').expect(401);
    const old = await new TestClient(server).post('/api/auth/login', {
      email: user.email,
      password: user.password,
    });
    expect(old.status).toBe(401);
    await new TestClient(server).signIn({ email: user.email, password: 'A-new-passphrase-42' });
  });

  it('When the new password is too short, then answers 400 on `next`', async () => {
    const user = await makeUser();
    const client = await signedInClient(server, user);
    const res = await client.post('/api/auth/password', { current: user.password, next: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.next).toMatch(/10 characters/);
  });
});
