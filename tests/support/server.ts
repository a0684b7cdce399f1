// The real server on port 0 against the real test database, and a cookie-keeping client for it.
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { loadConfig } from '../../api/src/config';
import { startServer, type RunningServer } from '../../api/src/server';
import type { MadeUser } from './fixtures';

export async function startTestServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const config = loadConfig({
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: '0',
    DATABASE_URL: process.env.DATABASE_URL,
    SESSION_SECRET: randomBytes(32).toString('hex'),
    LOG_LEVEL: 'silent',
    WEB_DIST: 'dist/web',
    // Every test signs in from 127.0.0.1; the per-e-mail limit is what the tests exercise.
    LOGIN_LIMIT_PER_IP: '100000',
    ...env,
  });
  return startServer(config);
}

/** A browser-like client: keeps cookies, fetches and sends the CSRF token. */
export class TestClient {
  readonly agent: ReturnType<typeof request.agent>;
  csrfToken = '';

  constructor(readonly server: RunningServer) {
    this.agent = request.agent(server.http);
  }

  async csrf(): Promise<string> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.csrfToken = res.body.token;
    return this.csrfToken;
  }

  get(path: string) {
    return this.agent.get(path);
  }

  async post(path: string, body?: object) {
    if (!this.csrfToken) await this.csrf();
    return this.agent.post(path).set('X-CSRF-Token', this.csrfToken).send(body);
  }

  async patch(path: string, body?: object) {
    if (!this.csrfToken) await this.csrf();
    return this.agent.patch(path).set('X-CSRF-Token', this.csrfToken).send(body);
  }

  async signIn(user: Pick<MadeUser, 'email' | 'password'>) {
    const res = await this.post('/api/auth/login', { email: user.email, password: user.password });
    if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res;
  }

  /** The session cookie as a browser would send it, e.g. for a socket.io handshake. */
  cookieHeader(): string {
    const cookies = (
      this.agent as unknown as { jar: { getCookies(o: object): { toValueString(): string }[] } }
    ).jar.getCookies({
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    });
    return cookies.map((c) => c.toValueString()).join('; ');
  }
}

export async function signedInClient(
  server: RunningServer,
  user: Pick<MadeUser, 'email' | 'password'>,
): Promise<TestClient> {
  const client = new TestClient(server);
  await client.signIn(user);
  return client;
}
