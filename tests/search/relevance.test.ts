// Search relevance on the seed knowledge base: each query must bring its article into the top 3.
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { importKb } from '../../api/src/db/seed/kb';
import { seedEquipment } from '../../api/src/db/seed/tickets';
import { findActiveSessionUser } from '../../api/src/features/auth/auth.repository';
import type { RunningServer } from '../../api/src/server';
import { RELEVANCE_CASES } from './relevance.cases';
import { useOwnDatabase } from '../support/own-database';

let server: RunningServer;
let contractor: TestClient;
let tech: TestClient;
let dropDatabase: () => Promise<void> = async () => {};
beforeAll(async () => {
  // Only the seed articles: other test files publish articles of their own in the shared database.
  dropDatabase = await useOwnDatabase('relevance');
  server = await startTestServer();
  const { db } = testDb();
  await seedEquipment(db);
  const specialist = await makeUser({ role: 'specialist' });
  const author = (await findActiveSessionUser(db, specialist.id))!;
  await importKb({ db }, author, fileURLToPath(new URL('../../kb', import.meta.url)));
  contractor = await signedInClient(server, await makeUser());
  tech = await signedInClient(server, await makeUser({ role: 'tech' }));
}, 120_000);
afterAll(async () => {
  await server.stop();
  await closeTestDb();
  await dropDatabase();
});

describe('search relevance on the seed articles (PostgreSQL)', () => {
  it('has at least 40 cases', () => {
    expect(RELEVANCE_CASES.length).toBeGreaterThanOrEqual(40);
  });

  for (const c of RELEVANCE_CASES) {
    const staff = c.note.startsWith('staff:');
    it(`When ${staff ? 'a tech' : 'a contractor'} searches "${c.query}" (${c.note}), then ${c.expect} is in the top 3`, async () => {
      const client = staff ? tech : contractor;
      const res = await client.get(`/api/search?q=${encodeURIComponent(c.query)}&limit=3`).expect(200);
      expect(res.body.hits.map((h: { slug: string }) => h.slug)).toContain(c.expect);
    });
  }

  it('When a contractor searches words of a staff article, then it never comes back', async () => {
    const res = await contractor
      .get(`/api/search?q=${encodeURIComponent('warranty claim rules')}&limit=50`)
      .expect(200);
    expect(res.body.hits.map((h: { audience: string }) => h.audience)).not.toContain('staff');
  });
});
