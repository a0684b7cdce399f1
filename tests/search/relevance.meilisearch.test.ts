// The same relevance cases on a real Meilisearch, when one is reachable: MEILI_URL (and
// MEILI_API_KEY if it needs one) in the environment of `npm test`. Without it the file is skipped:
// no Meilisearch server can be installed on the machines that run the suite by default.
import { fileURLToPath } from 'node:url';
import { Meilisearch } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importKb } from '../../api/src/db/seed/kb';
import { seedEquipment } from '../../api/src/db/seed/tickets';
import { findActiveSessionUser } from '../../api/src/features/auth/auth.repository';
import { enginesOf } from '../../api/src/features/search/search.engines';
import {
  rebuildIndex,
  SEARCH_SETTINGS_QUEUE,
  SEARCH_SYNC_QUEUE,
} from '../../api/src/features/search/search.sync';
import type { RunningServer } from '../../api/src/server';
import { closeTestDb, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { RELEVANCE_CASES } from './relevance.cases';

const MEILI_URL = process.env.MEILI_URL;

describe.skipIf(!MEILI_URL)('search on a real Meilisearch', () => {
  const index = `lightoff_test_${unique('')}`;
  let server: RunningServer;
  let contractor: TestClient;
  let tech: TestClient;
  let writer: TestClient;
  let reviewer: TestClient;
  let dropDatabase: () => Promise<void> = async () => {};

  beforeAll(async () => {
    // Only the seed articles: other test files publish articles of their own in the shared database.
    dropDatabase = await useOwnDatabase('meili');
    server = await startTestServer({
      MEILI_URL: MEILI_URL!,
      ...(process.env.MEILI_API_KEY ? { MEILI_API_KEY: process.env.MEILI_API_KEY } : {}),
      MEILI_INDEX: index,
      JOBS_SCHEMA: `jobs_${unique('r')}`,
    });
    const { db } = testDb();
    await seedEquipment(db);
    const specialist = await makeUser({ role: 'specialist' });
    const author = (await findActiveSessionUser(db, specialist.id))!;
    const kb = fileURLToPath(new URL('../../kb', import.meta.url));
    await importKb({ db }, author, kb);
    await server.ctx.jobs.drain(SEARCH_SETTINGS_QUEUE, 60_000);
    await rebuildIndex(server.ctx, enginesOf(server.ctx).meili!);
    contractor = await signedInClient(server, await makeUser());
    tech = await signedInClient(server, await makeUser({ role: 'tech' }));
    writer = await signedInClient(server, specialist);
    reviewer = await signedInClient(server, await makeUser({ role: 'specialist' }));
  }, 180_000);
  afterAll(async () => {
    await server?.stop();
    await new Meilisearch({ host: MEILI_URL!, apiKey: process.env.MEILI_API_KEY })
      .deleteIndex(index)
      .waitTask()
      .catch(() => {});
    await closeTestDb();
    await dropDatabase();
  });

  for (const c of RELEVANCE_CASES) {
    const staff = c.note.startsWith('staff:');
    it(`When ${staff ? 'a tech' : 'a contractor'} searches "${c.query}" (${c.note}), then ${c.expect} is in the top 3`, async () => {
      const res = await (staff ? tech : contractor)
        .get(`/api/search?q=${encodeURIComponent(c.query)}&limit=3`)
        .expect(200);
      expect(res.body.engine).toBe('meilisearch');
      expect(res.body.hits.map((h: { slug: string }) => h.slug)).toContain(c.expect);
    });
  }

  it('When a contractor searches words of a staff article, then it never comes back', async () => {
    const res = await contractor.get(`/api/search?q=${encodeURIComponent('warranty claim rules')}&limit=50`);
    expect(res.body.engine).toBe('meilisearch');
    expect(res.body.hits.map((h: { audience: string }) => h.audience)).not.toContain('staff');
  });

  it('When a contractor searches, then the facets count the models’ brands, types and fuels, and a brand filter filters', async () => {
    const all = (await contractor.get('/api/search?q=manifold%20pressure&limit=50').expect(200)).body;
    expect(all.engine).toBe('meilisearch');
    expect(Object.keys(all.facets)).toEqual(['kind', 'equipmentType', 'brand', 'fuel']);
    expect(all.facets.brand.Corvane).toBeGreaterThan(0);
    const corvane = (
      await contractor.get('/api/search?q=manifold%20pressure&brand=Corvane&limit=50').expect(200)
    ).body;
    expect(corvane.total).toBe(all.facets.brand.Corvane);
  });

  it('When an article is published and then retired, then search finds it and then no longer does', async () => {
    const word = `realsync${unique('')}`;
    const created = await writer.post('/api/articles', {
      title: `Condensate trap ${word}`,
      summary: 'Keep the trap primed so the pressure switch closes.',
      body: `Prime the ${word} trap with water before the first start.`,
      kind: 'procedure',
      audience: 'contractor',
    });
    const id = created.body.article.id;
    expect((await reviewer.post(`/api/articles/${id}/publish`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE, 60_000);
    const found = (await contractor.get(`/api/search?q=${word}`).expect(200)).body;
    expect(found).toMatchObject({ engine: 'meilisearch', total: 1 });
    expect(found.hits[0].snippet).toContain('⟦');
    expect((await reviewer.post(`/api/articles/${id}/retire`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE, 60_000);
    expect((await contractor.get(`/api/search?q=${word}`).expect(200)).body.total).toBe(0);
  });

  it('When a synonym group is added, then a search that found nothing finds the article', async () => {
    const known = `realknown${unique('')}`;
    const invented = `realother${unique('')}`;
    const created = await writer.post('/api/articles', {
      title: `Pilot assembly ${known}`,
      summary: 'Clean the pilot hood and check the flame shape.',
      body: `The ${known} part sits beside the thermocouple.`,
      kind: 'procedure',
      audience: 'contractor',
    });
    expect((await reviewer.post(`/api/articles/${created.body.article.id}/publish`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE, 60_000);
    expect((await contractor.get(`/api/search?q=${invented}`).expect(200)).body.total).toBe(0);
    const group = await writer.post('/api/search/synonyms', { terms: [invented, known] });
    expect(group.status).toBe(201);
    await server.ctx.jobs.drain(SEARCH_SETTINGS_QUEUE, 60_000);
    const after = (await contractor.get(`/api/search?q=${invented}`).expect(200)).body;
    expect(after.engine).toBe('meilisearch');
    expect(after.hits.map((h: { id: number }) => h.id)).toContain(created.body.article.id);
    await writer.agent
      .delete(`/api/search/synonyms/${group.body.synonym.id}`)
      .set('X-CSRF-Token', writer.csrfToken)
      .expect(204);
  });
});
