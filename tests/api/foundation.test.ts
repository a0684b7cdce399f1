import { Writable } from 'node:stream';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pino } from 'pino';
import { closeTestDb, makeAccount, makeUser } from '../support/fixtures';
import { TestClient, signedInClient, startTestServer } from '../support/server';
import { loadConfig } from '../../api/src/config';
import { startServer, type RunningServer } from '../../api/src/server';
import { REDACT_PATHS } from '../../api/src/lib/logger';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

describe('health and readiness', () => {
  it('When the process runs, then /api/health answers ok', async () => {
    const res = await new TestClient(server).get('/api/health').expect(200);
    expect(res.body.status).toBe('ok');
  });

  it('When the database answers, then /api/ready answers ok', async () => {
    const res = await new TestClient(server).get('/api/ready').expect(200);
    expect(res.body.checks).toEqual({ database: 'up', search: 'postgres' });
  });

  it('When the database does not answer, then /api/ready answers 503 naming the database', async () => {
    const down = await startTestServer({ DATABASE_URL: 'postgres://nobody:x@127.0.0.1:1/none' });
    try {
      const res = await new TestClient(down).get('/api/ready');
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('not_ready');
      expect(res.body.error.fields).toEqual({ database: 'down' });
    } finally {
      await down.stop();
    }
  });
});

describe('errors', () => {
  it('When an /api route does not exist, then answers 404 JSON', async () => {
    const res = await new TestClient(server).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error.code).toBe('not_found');
  });

  it('When a JSON body is over 1 MB, then answers 413 JSON', async () => {
    const res = await new TestClient(server).post('/api/auth/login', {
      email: 'a@b.example',
      password: 'x'.repeat(1_100_000),
    });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('When the body is not JSON, then answers 400 without a stack trace', async () => {
    const client = new TestClient(server);
    const token = await client.csrf();
    const res = await client.agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', token)
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: { code: 'invalid_json', message: 'The request body is not valid JSON' },
    });
  });
});

describe('security headers', () => {
  it('When a page is served, then it carries a strict Content-Security-Policy', async () => {
    const res = await new TestClient(server).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('When running in production behind HTTPS, then the session cookie is Secure', async () => {
    const prod = await startTestServer({ NODE_ENV: 'production', TRUST_PROXY: 'true' });
    try {
      const user = await makeUser();
      const client = new TestClient(prod);
      const csrf = await client.agent.get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const res = await client.agent
        .post('/api/auth/login')
        .set('X-Forwarded-Proto', 'https')
        .set('X-CSRF-Token', csrf.body.token)
        .set(
          'Cookie',
          (csrf.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; '),
        )
        .send({ email: user.email, password: user.password });
      expect(res.status).toBe(200);
      const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) =>
        c.startsWith('lightoff.sid='),
      )!;
      expect(cookie).toMatch(/; Secure/i);
    } finally {
      await prod.stop();
    }
  });
});

describe('configuration', () => {
  it('When a required setting is missing or bad, then start-up stops with a message naming it', () => {
    expect(() => loadConfig({ SESSION_SECRET: 'short', PORT: 'eighty' })).toThrowError(
      /DATABASE_URL[\s\S]*SESSION_SECRET|PORT/,
    );
    try {
      loadConfig({ SESSION_SECRET: 'short', PORT: 'eighty' });
    } catch (err) {
      const message = (err as Error).message;
      expect(message).toContain('DATABASE_URL');
      expect(message).toContain('SESSION_SECRET: must be at least 32 characters');
      expect(message).toContain('PORT');
    }
  });
});

describe('request log', () => {
  it('When someone signs in, then the log has a request id and never the password, cookie or token', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _enc, done) {
        lines.push(String(chunk));
        done();
      },
    });
    const logger = pino({ level: 'info', redact: { paths: REDACT_PATHS, censor: '[redacted]' } }, sink);
    const config = loadConfig({
      NODE_ENV: 'test',
      PORT: '0',
      DATABASE_URL: process.env.DATABASE_URL,
      SESSION_SECRET: randomBytes(32).toString('hex'),
    });
    const logged = await startServer(config, { logger });
    try {
      const user = await makeUser();
      const client = await signedInClient(logged, user);
      await client.get('/api/auth/me').expect(200);
      const text = lines.join('');
      expect(text).toMatch(/"req":\{"id":"[0-9a-f-]{36}"/);
      expect(text).not.toContain(user.password);
      expect(text).not.toContain(client.csrfToken);
      expect(text).not.toMatch(/lightoff\.sid=s%3A/);
    } finally {
      await logged.stop();
    }
  });
});

describe('home', () => {
  it('When a contractor opens home, then they see their company, home branch and teammates, and no other account', async () => {
    const account = await makeAccount({ company: 'Home Test Heating' });
    const owner = await makeUser({ accountId: account.id, isAccountOwner: true, name: 'Owner Person' });
    await makeUser({ accountId: account.id, name: 'Teammate Person' });
    const client = await signedInClient(server, owner);
    const res = await client.get('/api/home').expect(200);
    expect(res.body.account).toMatchObject({
      id: account.id,
      company: 'Home Test Heating',
      accountNumber: account.accountNumber,
    });
    expect(res.body.account.homeBranch.id).toBe(account.homeBranchId);
    expect(res.body.account.teammates.map((t: { name: string }) => t.name)).toEqual([
      'Owner Person',
      'Teammate Person',
    ]);
  });

  it('When a tech opens home, then they see only their branches', async () => {
    const tech = await makeUser({ role: 'tech' });
    const client = await signedInClient(server, tech);
    const res = await client.get('/api/home').expect(200);
    expect(res.body.account).toBeNull();
    expect(res.body.branches.map((b: { id: number }) => b.id)).toEqual(tech.branchIds);
  });
});
