// A search ranks a bounded set of matches; when more match, the answer says its total is a floor.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeTestDb, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { CANDIDATES } from '../../api/src/features/search/search.postgres';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
let reader: TestClient;
beforeAll(async () => {
  server = await startTestServer();
  reader = await signedInClient(server, await makeUser({ role: 'tech' }));
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

async function publishMany(word: string, count: number) {
  const author = await makeUser({ role: 'specialist' });
  await testDb().db.execute(sql`
    insert into articles (slug, title, summary, body, kind, audience, status, author_id, published_at)
    select ${word} || '-' || g, 'Venting note ' || g, 'About the ' || ${word} || ' vent.', 'Check the ' || ${word} || ' termination.',
           'bulletin', 'contractor', 'published', ${author.id}, now()
      from generate_series(1, ${count}::int) as g`);
}

describe('search totals', () => {
  it('When more articles match than one search ranks, then the total is that many and marked as a floor', async () => {
    const word = unique('zq').toLowerCase();
    await publishMany(word, CANDIDATES + 20);
    const res = await reader.get(`/api/search?q=${word}`).expect(200);
    expect(res.body.total).toBe(CANDIDATES);
    expect(res.body.totalIsLowerBound).toBe(true);
    expect(res.body.facets.kind.bulletin).toBe(CANDIDATES);
  });

  it('When fewer match, then the total is exact', async () => {
    const word = unique('zq').toLowerCase();
    await publishMany(word, 7);
    const res = await reader.get(`/api/search?q=${word}`).expect(200);
    expect(res.body.total).toBe(7);
    expect(res.body.totalIsLowerBound).toBe(false);
  });
});
