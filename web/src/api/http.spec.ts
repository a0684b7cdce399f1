import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError, http, resetCsrfToken, setUnauthenticatedHandler } from './http';

type Reply = { status: number; body?: unknown; raw?: string };

const json = ({ status, body, raw }: Reply) =>
  new Response(raw ?? (body === undefined ? null : JSON.stringify(body)), {
    status,
    headers: { 'Content-Type': raw ? 'text/html' : 'application/json' },
  });

/** A fake server: each call takes the next reply for its path, and every request is recorded. */
function serve(routes: Record<string, Reply[]>) {
  const calls: { url: string; method: string; headers: Record<string, string>; body?: string }[] = [];
  const fetchMock = vi.fn(async (input: string, init: RequestInit = {}) => {
    const headers = (init.headers ?? {}) as Record<string, string>;
    calls.push({ url: input, method: init.method ?? 'GET', headers, body: init.body as string | undefined });
    const path = input.split('?')[0]!;
    const replies = routes[`${init.method ?? 'GET'} ${path}`];
    const reply = replies?.length && replies.length > 1 ? replies.shift()! : replies?.[0];
    if (!reply) throw new Error(`unexpected ${init.method} ${input}`);
    return json(reply);
  });
  vi.stubGlobal('fetch', fetchMock);
  return calls;
}

describe('http client', () => {
  const onUnauthenticated = vi.fn();

  beforeEach(() => {
    resetCsrfToken();
    onUnauthenticated.mockReset();
    setUnauthenticatedHandler(onUnauthenticated);
  });
  afterEach(() => {
    vi.unstubAllGlobals();
    setUnauthenticatedHandler(null);
  });

  it('When the API answers with its error body, then the call throws one ApiError with status, code, message and fields', async () => {
    serve({
      'GET /api/auth/csrf': [{ status: 200, body: { token: 't1' } }],
      'POST /api/admin/users': [
        {
          status: 409,
          body: {
            error: { code: 'conflict', message: 'Already used', fields: { email: 'That e-mail is taken' } },
          },
        },
      ],
    });
    const error = await http.post('/admin/users', { email: 'a@b.example' }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 409,
      code: 'conflict',
      message: 'Already used',
      fields: { email: 'That e-mail is taken' },
    });
  });

  it('When the answer is not our error shape (a proxy page), then the ApiError says http_error with the status', async () => {
    serve({ 'GET /api/home': [{ status: 502, raw: '<html>Bad gateway</html>' }] });
    const error = await http.get('/home').catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 502, code: 'http_error' });
    expect((error as ApiError).message).toContain('502');
  });

  it('When the network is down, then the ApiError has status 0 and code network_error', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    await expect(http.get('/home')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('When two changes are sent, then both carry the CSRF token, fetched once, and GETs carry none', async () => {
    const calls = serve({
      'GET /api/auth/csrf': [{ status: 200, body: { token: 'tok-1' } }],
      'PATCH /api/admin/branches/4': [{ status: 200, body: { branch: { id: 4 } } }],
      'GET /api/home': [{ status: 200, body: { account: null, branches: [] } }],
    });
    await http.patch('/admin/branches/4', { name: 'A' });
    await http.patch('/admin/branches/4', { name: 'B' });
    await http.get('/home');
    const patches = calls.filter((c) => c.method === 'PATCH');
    expect(patches.map((c) => c.headers['X-CSRF-Token'])).toEqual(['tok-1', 'tok-1']);
    expect(patches[0]!.headers['Content-Type']).toBe('application/json');
    expect(patches[1]!.body).toBe(JSON.stringify({ name: 'B' }));
    expect(calls.filter((c) => c.url === '/api/auth/csrf')).toHaveLength(1);
    expect(calls.find((c) => c.url === '/api/home')!.headers['X-CSRF-Token']).toBeUndefined();
  });

  it('When the server says csrf_invalid, then a fresh token is fetched and the request is retried once with it', async () => {
    const calls = serve({
      'GET /api/auth/csrf': [
        { status: 200, body: { token: 'old' } },
        { status: 200, body: { token: 'new' } },
      ],
      'POST /api/auth/password': [
        { status: 403, body: { error: { code: 'csrf_invalid', message: 'Stale token' } } },
        { status: 204 },
      ],
    });
    await expect(http.post('/auth/password', { current: 'a', next: 'b' })).resolves.toBeUndefined();
    const posts = calls.filter((c) => c.method === 'POST');
    expect(posts.map((c) => c.headers['X-CSRF-Token'])).toEqual(['old', 'new']);
  });

  it('When csrf_invalid comes back again after the retry, then it stops and throws', async () => {
    const calls = serve({
      'GET /api/auth/csrf': [{ status: 200, body: { token: 'x' } }],
      'POST /api/auth/logout': [
        { status: 403, body: { error: { code: 'csrf_invalid', message: 'Stale token' } } },
      ],
    });
    await expect(http.post('/auth/logout')).rejects.toMatchObject({ status: 403, code: 'csrf_invalid' });
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2);
  });

  it('When another request gets a 401, then the session-lost path runs; a 401 from /auth/me or /auth/login does not', async () => {
    const unauthenticated = { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in' } } };
    serve({
      'GET /api/home': [unauthenticated],
      'GET /api/auth/me': [unauthenticated],
      'GET /api/auth/csrf': [{ status: 200, body: { token: 't' } }],
      'POST /api/auth/login': [
        { status: 401, body: { error: { code: 'invalid_credentials', message: 'Wrong' } } },
      ],
    });
    await expect(http.get('/auth/me')).rejects.toMatchObject({ status: 401 });
    await expect(http.post('/auth/login', { email: 'a', password: 'b' })).rejects.toMatchObject({
      code: 'invalid_credentials',
    });
    expect(onUnauthenticated).not.toHaveBeenCalled();

    await expect(http.get('/home')).rejects.toMatchObject({ status: 401, code: 'unauthenticated' });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
  });

  it('When a query has empty values, then they are left out of the URL', async () => {
    const calls = serve({ 'GET /api/admin/users': [{ status: 200, body: { items: [], total: 0 } }] });
    await http.get('/admin/users', { page: 2, pageSize: 20, q: '', role: undefined });
    expect(calls[0]!.url).toBe('/api/admin/users?page=2&pageSize=20');
  });
});
