// The session row's expiry rolls forward with activity, but is written at most once a minute.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeTestDb, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});
afterEach(() => {
  vi.useRealTimers();
});

async function storedExpiries(): Promise<number[]> {
  const { rows } = await testDb().db.execute<{ expire: Date }>(
    sql`select expire from session where sess::jsonb -> 'passport' ->> 'user' = ${String(userId)}`,
  );
  return rows.map((r) => new Date(r.expire).getTime());
}
let userId = 0;

describe('session expiry', () => {
  it('When a signed-in user keeps working, then the stored expiry moves at most once a minute and stays about 30 minutes ahead', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const tech = await makeUser({ role: 'tech' });
    userId = tech.id;
    const client = await signedInClient(server, tech);
    await client.get('/api/auth/me').expect(200);
    const [first] = await storedExpiries();
    expect(first).toBeDefined();

    vi.setSystemTime(Date.now() + 20_000);
    await client.get('/api/auth/me').expect(200);
    await client.get('/api/auth/me').expect(200);
    expect(await storedExpiries()).toEqual([first]);

    vi.setSystemTime(Date.now() + 45_000);
    await client.get('/api/auth/me').expect(200);
    const [later] = await storedExpiries();
    expect(later! - first!).toBeGreaterThanOrEqual(60_000);
    expect(later! - Date.now()).toBeGreaterThan(29 * 60 * 1000);
  });
});
