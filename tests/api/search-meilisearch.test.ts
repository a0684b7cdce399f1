// The Meilisearch engine against a local server speaking Meilisearch's HTTP API (none can run
// here): the requests it builds, how it maps the answers, the index kept in step through the job
// queue, and PostgreSQL answering when Meilisearch does not.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { auditLog } from '../../api/src/db/schema/index';
import { MEILI_BACKOFF_MS } from '../../api/src/features/search/search.engines';
import { SEARCH_SETTINGS_QUEUE, SEARCH_SYNC_QUEUE } from '../../api/src/features/search/search.sync';
import { runSearchReindex } from '../../api/scripts/search-reindex';
import type { RunningServer } from '../../api/src/server';
import { closeTestDb, makeEquipmentModel, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { FakeMeilisearch } from '../search/fake-meilisearch';

const INDEX = `articles_${unique('')}`;
let fake: FakeMeilisearch;
let server: RunningServer;
let writer: TestClient;
let reviewer: TestClient;
let contractor: TestClient;
let tech: TestClient;

/** A server using `meiliUrl`, with a job-queue schema of its own so no other server takes its jobs. */
const serverFor = (meiliUrl: string) =>
  startTestServer({ MEILI_URL: meiliUrl, MEILI_INDEX: INDEX, JOBS_SCHEMA: `jobs_${unique('m')}` });

const lastQueries = () => {
  const last = fake.requestsTo('POST', /^\/multi-search$/).at(-1);
  return (last!.body as { queries: Record<string, unknown>[] }).queries;
};

beforeAll(async () => {
  fake = await new FakeMeilisearch().start();
  server = await serverFor(fake.url);
  writer = await signedInClient(server, await makeUser({ role: 'specialist' }));
  reviewer = await signedInClient(server, await makeUser({ role: 'specialist' }));
  contractor = await signedInClient(server, await makeUser());
  tech = await signedInClient(server, await makeUser({ role: 'tech' }));
}, 60_000);
afterAll(async () => {
  await server?.stop();
  await fake?.stop();
  await closeTestDb();
});

describe('index settings', () => {
  it('When the server starts, then the index gets its searchable, filterable and sortable attributes, typo tolerance and the synonym groups', async () => {
    await server.ctx.jobs.drain(SEARCH_SETTINGS_QUEUE);
    const settings = fake.settings.get(INDEX)!;
    expect(settings.searchableAttributes).toEqual(['title', 'summary', 'models', 'body']);
    expect(settings.filterableAttributes).toEqual(
      expect.arrayContaining(['kind', 'audience', 'status', 'equipmentType', 'brand', 'fuel']),
    );
    expect(settings.sortableAttributes).toEqual(['updatedAt']);
    expect(settings.typoTolerance).toEqual({ enabled: true });
    // The migration's trade synonyms: lp, lpg, propane, liquid propane are one group.
    const synonyms = settings.synonyms as Record<string, string[]>;
    expect(synonyms.lp).toEqual(expect.arrayContaining(['lpg', 'propane', 'liquid propane']));
    expect(synonyms.propane).toContain('lp');
    expect(synonyms.lp).not.toContain('lp');
  });
});

describe('search requests and answers', () => {
  // The index also holds every published article of the test database (filled at start-up), so
  // these documents carry a word of their own.
  const word = `sensorword${unique('')}`;
  const doc = (id: number, over: Record<string, unknown>) => ({
    id,
    slug: `doc-${id}`,
    title: `Flame ${word} check ${id}`,
    summary: 'Clean the rod, then measure the microamps.',
    body: `With the burner lit, the flame ${word} should read a steady signal; a dirty rod drops out.`,
    kind: 'troubleshooting',
    audience: 'contractor',
    status: 'published',
    models: ['CV-S80-60', 'CVS8060', 'CVS80'],
    equipmentType: ['furnace'],
    brand: ['Corvane'],
    fuel: ['natural-gas', 'propane'],
    updatedAt: 1_700_000_000_000 + id,
    ...over,
  });
  beforeAll(() => {
    const docs = fake.docs(INDEX);
    docs.set(900001, doc(900001, {}));
    docs.set(900002, doc(900002, { kind: 'procedure' }));
    docs.set(900003, doc(900003, { brand: ['Halden'], equipmentType: ['boiler'], fuel: ['natural-gas'] }));
    docs.set(900004, doc(900004, { audience: 'staff', title: `Flame ${word} warranty rules` }));
  });

  it('When a contractor searches, then q, limit, offset, the audience and status filter, the facets and the snippet settings go to Meilisearch', async () => {
    const res = await contractor.get(`/api/search?q=flame%20${word}&limit=2&offset=1`).expect(200);
    const [main, ...rest] = lastQueries();
    expect(rest).toEqual([]);
    expect(main).toMatchObject({
      indexUid: INDEX,
      q: `flame ${word}`,
      filter: 'status = "published" AND audience = "contractor"',
      facets: ['kind', 'equipmentType', 'brand', 'fuel'],
      limit: 2,
      offset: 1,
      attributesToHighlight: ['body'],
      attributesToCrop: ['body'],
      cropLength: 28,
      highlightPreTag: '⟦',
      highlightPostTag: '⟧',
      showRankingScore: true,
    });
    expect(res.body.engine).toBe('meilisearch');
    expect(res.body.fallback).toBe(false);
    // Three contractor documents match; the page holds two of them, from the second on.
    expect(res.body.total).toBe(3);
    expect(res.body.hits).toHaveLength(2);
    expect(res.body.hits[0]).toEqual({
      id: 900002,
      slug: 'doc-900002',
      title: `Flame ${word} check 900002`,
      summary: 'Clean the rod, then measure the microamps.',
      kind: 'procedure',
      audience: 'contractor',
      snippet: expect.stringContaining(`⟦flame⟧ ⟦${word}⟧`),
      score: expect.any(Number),
    });
    expect(res.body.hits[0].score).toBeGreaterThan(res.body.hits[1].score);
    expect(res.body.facets).toEqual({
      kind: { troubleshooting: 2, procedure: 1 },
      equipmentType: { furnace: 2, boiler: 1 },
      brand: { Corvane: 2, Halden: 1 },
      fuel: { 'natural-gas': 3, propane: 2 },
    });
  });

  it('When staff search, then the filter keeps only published articles and staff ones come back', async () => {
    const res = await tech.get(`/api/search?q=${word}&limit=10`).expect(200);
    expect(lastQueries()[0]!.filter).toBe('status = "published"');
    expect(res.body.hits.map((h: { id: number }) => h.id)).toContain(900004);
    expect(res.body.total).toBe(4);
  });

  it('When filters are chosen, then the hits carry them all and each chosen facet is counted again without its own filter', async () => {
    const res = await contractor.get(`/api/search?q=${word}&brand=Halden&kind=troubleshooting`).expect(200);
    const queries = lastQueries();
    expect(queries).toHaveLength(3);
    expect(queries[0]).toMatchObject({
      filter:
        'status = "published" AND audience = "contractor" AND kind = "troubleshooting" AND brand = "Halden"',
      facets: ['equipmentType', 'fuel'],
    });
    expect(queries[1]).toMatchObject({
      filter: 'status = "published" AND audience = "contractor" AND brand = "Halden"',
      facets: ['kind'],
      limit: 0,
    });
    expect(queries[2]).toMatchObject({
      filter: 'status = "published" AND audience = "contractor" AND kind = "troubleshooting"',
      facets: ['brand'],
      limit: 0,
    });
    expect(res.body.hits.map((h: { id: number }) => h.id)).toEqual([900003]);
    expect(res.body.facets).toEqual({
      kind: { troubleshooting: 1 },
      equipmentType: { boiler: 1 },
      brand: { Corvane: 1, Halden: 1 },
      fuel: { 'natural-gas': 1 },
    });
  });

  it('When a filter value holds a double quote, then it is escaped inside the filter string', async () => {
    await contractor.get(`/api/search?q=${word}&brand=${encodeURIComponent('Hal"den')}`).expect(200);
    expect(lastQueries()[0]!.filter).toBe(
      'status = "published" AND audience = "contractor" AND brand = "Hal\\"den"',
    );
  });

  it('When Meilisearch reports its total as totalHits, then that is the total', async () => {
    fake.totalAs = 'totalHits';
    try {
      const res = await contractor.get(`/api/search?q=${word}&limit=1`).expect(200);
      expect(res.body.total).toBe(3);
    } finally {
      fake.totalAs = 'estimatedTotalHits';
    }
  });

  it('When a contractor types a title, then suggestions search titles only, with the audience filter', async () => {
    const typed = `flame ${word.slice(0, -3)}`;
    const res = await contractor.get(`/api/search/suggest?q=${encodeURIComponent(typed)}`).expect(200);
    const request = fake.requestsTo('POST', new RegExp(`^/indexes/${INDEX}/search$`)).at(-1)!;
    expect(request.body).toMatchObject({
      q: typed,
      attributesToSearchOn: ['title'],
      filter: 'status = "published" AND audience = "contractor"',
      limit: 8,
    });
    expect(res.body.items).toEqual(
      expect.arrayContaining([{ id: 900001, slug: 'doc-900001', title: `Flame ${word} check 900001` }]),
    );
    expect(res.body.items.map((i: { id: number }) => i.id)).not.toContain(900004);
  });
});

describe('keeping the index in step through the job queue', () => {
  let model: Awaited<ReturnType<typeof makeEquipmentModel>>;
  let id: number;
  const word = `syncword${unique('')}`;
  beforeAll(async () => {
    model = await makeEquipmentModel({ modelNumber: `SY-${unique('').toUpperCase()}-80` });
  });

  it('When a draft is created, then it is not put in the index', async () => {
    const created = await writer.post('/api/articles', {
      title: `Venting check ${word}`,
      summary: 'Confirm the vent draws before leaving the job.',
      body: `Hold a smoke source at the draft hood; the ${word} test takes two minutes.`,
      kind: 'procedure',
      audience: 'contractor',
      equipmentModelIds: [model.id],
    });
    expect(created.status).toBe(201);
    id = created.body.article.id;
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
    expect(fake.docs(INDEX).has(id)).toBe(false);
    const deletes = fake.requestsTo('POST', /\/documents\/delete-batch$/);
    expect(deletes.at(-1)!.body).toEqual([id]);
  });

  it('When it is published, then its document is upserted with its models, type, brand and fuels', async () => {
    const before = fake.requestsTo('POST', new RegExp(`^/indexes/${INDEX}/documents$`)).length;
    expect((await reviewer.post(`/api/articles/${id}/publish`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
    const upserts = fake.requestsTo('POST', new RegExp(`^/indexes/${INDEX}/documents$`));
    expect(upserts.length).toBe(before + 1);
    expect(upserts.at(-1)!.query).toEqual({ primaryKey: 'id' });
    const squashed = model.modelNumber.replace(/-/g, '');
    expect(upserts.at(-1)!.body).toEqual([
      expect.objectContaining({
        id,
        title: `Venting check ${word}`,
        kind: 'procedure',
        audience: 'contractor',
        status: 'published',
        models: expect.arrayContaining([model.modelNumber, squashed]),
        equipmentType: ['furnace'],
        brand: ['Corvane'],
        fuel: ['natural-gas', 'propane'],
        updatedAt: expect.any(Number),
      }),
    ]);
    const found = await contractor.get(`/api/search?q=${word}`).expect(200);
    expect(found.body.engine).toBe('meilisearch');
    expect(found.body.hits.map((h: { id: number }) => h.id)).toEqual([id]);
  });

  it('When it is edited, then the index gets the new text', async () => {
    expect((await writer.patch(`/api/articles/${id}`, { title: `Vent draft check ${word}` })).status).toBe(
      200,
    );
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
    expect(fake.docs(INDEX).get(id)?.title).toBe(`Vent draft check ${word}`);
  });

  it('When its model links change, then the index gets the new models', async () => {
    expect((await writer.patch(`/api/articles/${id}`, { equipmentModelIds: [] })).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
    expect(fake.docs(INDEX).get(id)).toMatchObject({ models: [], brand: [], equipmentType: [], fuel: [] });
  });

  it('When it is retired, then its document is deleted', async () => {
    expect((await reviewer.post(`/api/articles/${id}/retire`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
    expect(fake.requestsTo('POST', /\/documents\/delete-batch$/).at(-1)!.body).toEqual([id]);
    expect(fake.docs(INDEX).has(id)).toBe(false);
  });

  it('When a synonym group is added, then the index settings get it through the queue', async () => {
    const a = `alpha${unique('')}`;
    const b = `beta${unique('')}`;
    const res = await writer.post('/api/search/synonyms', { terms: [a, b] });
    expect(res.status).toBe(201);
    await server.ctx.jobs.drain(SEARCH_SETTINGS_QUEUE);
    const synonyms = fake.settings.get(INDEX)!.synonyms as Record<string, string[]>;
    expect(synonyms[a]).toEqual([b]);
    expect(synonyms[b]).toEqual([a]);
    const [entry] = await testDb()
      .db.select()
      .from(auditLog)
      .where(
        and(eq(auditLog.action, 'search.synonym.create'), eq(auditLog.targetId, String(res.body.synonym.id))),
      );
    expect(entry).toBeDefined();
  });
});

describe('npm run search:reindex', () => {
  beforeAll(async () => {
    const created = await writer.post('/api/articles', {
      title: 'Combustion air openings for a closet install',
      summary: 'Size the two openings from the total input of the appliances in the room.',
      body: 'Measure the room, add up the input ratings, then size the upper and lower openings.',
      kind: 'procedure',
      audience: 'contractor',
    });
    expect((await reviewer.post(`/api/articles/${created.body.article.id}/publish`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
  });

  it('When MEILI_URL is set, then it applies the settings, indexes every published article, removes the rest and prints the counts', async () => {
    const index = `reindex_${unique('')}`;
    const docs = fake.docs(index);
    docs.set(999_999_999, { id: 999_999_999, title: 'Gone long ago' });
    const lines = await runSearchReindex({
      DATABASE_URL: process.env.DATABASE_URL,
      MEILI_URL: fake.url,
      MEILI_INDEX: index,
    });
    const { rows } = await testDb().db.execute<{ id: number }>(
      sql`select id from articles where status = 'published' order by id`,
    );
    expect(rows.length).toBeGreaterThan(0);
    // Articles other test files publish meanwhile may be in the index too; none that is not published.
    const indexed = [...docs.keys()];
    expect(indexed).toEqual(expect.arrayContaining(rows.map((r) => r.id)));
    expect(indexed).not.toContain(999_999_999);
    expect(fake.settings.get(index)?.searchableAttributes).toEqual(['title', 'summary', 'models', 'body']);
    expect(lines[0]).toMatch(new RegExp(`index "${index}".*settings applied with \\d+ synonym groups`));
    expect(lines[1]).toMatch(/^ {2}\d+ published articles indexed, 1 documents no longer published removed$/);
    expect(lines[2]).toMatch(/^PostgreSQL typo-correction words refreshed: \d+/);
  });

  it('When MEILI_URL is not set, then it says PostgreSQL needs no index rebuild and refreshes the typo-correction words', async () => {
    const { db } = testDb();
    await db.execute(sql`insert into search_words (word) values ('zzstaleword') on conflict do nothing`);
    const lines = await runSearchReindex({ DATABASE_URL: process.env.DATABASE_URL });
    expect(lines[0]).toMatch(/MEILI_URL is not set: search runs on PostgreSQL.*nothing to rebuild/);
    expect(lines[1]).toMatch(/^PostgreSQL typo-correction words refreshed: \d+ \(were \d+\)$/);
    const { rows } = await db.execute(sql`select 1 from search_words where word = 'zzstaleword'`);
    expect(rows).toHaveLength(0);
    const kept = await db.execute(sql`select count(*)::int as n from search_words`);
    expect((kept.rows[0] as { n: number }).n).toBeGreaterThan(0);
  });
});

describe('when Meilisearch does not answer', () => {
  const word = `fallbackword${unique('')}`;
  beforeAll(async () => {
    const created = await writer.post('/api/articles', {
      title: `Pilot outage ${word}`,
      summary: 'What to look at when the pilot will not stay lit.',
      body: `Check the thermocouple and the ${word} first.`,
      kind: 'troubleshooting',
      audience: 'contractor',
    });
    expect((await reviewer.post(`/api/articles/${created.body.article.id}/publish`)).status).toBe(200);
    await server.ctx.jobs.drain(SEARCH_SYNC_QUEUE);
  });

  it('When Meilisearch answers with an error, then PostgreSQL answers, says so, and Meilisearch is left alone for a while', async () => {
    fake.failWith = 503;
    try {
      const first = await contractor.get(`/api/search?q=${word}`).expect(200);
      expect(first.body).toMatchObject({ engine: 'postgres', fallback: true, total: 1 });
      const asked = fake.requests.length;
      const second = await contractor.get(`/api/search?q=${word}`).expect(200);
      expect(second.body).toMatchObject({ engine: 'postgres', fallback: true, total: 1 });
      expect(fake.requests.length).toBe(asked);
      expect(MEILI_BACKOFF_MS).toBeGreaterThan(1000);
      const ready = await contractor.get('/api/ready').expect(200);
      expect(ready.body.checks).toEqual({ database: 'up', search: 'postgres (meilisearch not answering)' });
    } finally {
      fake.failWith = null;
    }
    // Once its health check answers again, searches go back to Meilisearch.
    const ready = await contractor.get('/api/ready').expect(200);
    expect(ready.body.checks.search).toBe('meilisearch');
    expect((await contractor.get(`/api/search?q=${word}`).expect(200)).body.engine).toBe('meilisearch');
  });

  it('When MEILI_URL points at a closed port, then search still answers from PostgreSQL and /api/ready reports it', async () => {
    const probe = createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const port = (probe.address() as AddressInfo).port;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
    const closed = await serverFor(`http://127.0.0.1:${port}`);
    try {
      const client = await signedInClient(closed, await makeUser());
      const res = await client.get(`/api/search?q=${word}`).expect(200);
      expect(res.body).toMatchObject({ engine: 'postgres', fallback: true, total: 1 });
      expect((await client.get(`/api/search/suggest?q=${word}`).expect(200)).body.items).toHaveLength(1);
      const ready = await client.get('/api/ready').expect(200);
      expect(ready.body).toEqual({
        status: 'ok',
        checks: { database: 'up', search: 'postgres (meilisearch not answering)' },
      });
    } finally {
      await closed.stop();
    }
  });

  it('When Meilisearch takes the connection but never answers, then PostgreSQL answers within about a second', async () => {
    const silent: Server = createServer(() => {});
    await new Promise<void>((resolve) => silent.listen(0, '127.0.0.1', resolve));
    const hanging = await serverFor(`http://127.0.0.1:${(silent.address() as AddressInfo).port}`);
    try {
      const client = await signedInClient(hanging, await makeUser());
      const started = Date.now();
      const res = await client.get(`/api/search?q=${word}`).expect(200);
      expect(res.body).toMatchObject({ engine: 'postgres', fallback: true, total: 1 });
      expect(Date.now() - started).toBeLessThan(3000);
    } finally {
      await hanging.stop();
      silent.closeAllConnections();
      await new Promise<void>((resolve) => silent.close(() => resolve()));
    }
  });
});
