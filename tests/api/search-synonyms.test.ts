// The synonym groups of search: specialists and admins keep them; a change works in the next search.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, count, eq } from 'drizzle-orm';
import { auditLog, searchSynonyms } from '../../api/src/db/schema/index';
import type { RunningServer } from '../../api/src/server';
import { closeTestDb, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, TestClient } from '../support/server';

let server: RunningServer;
let specialist: TestClient;
let admin: TestClient;
let tech: TestClient;
let contractor: TestClient;
beforeAll(async () => {
  server = await startTestServer();
  specialist = await signedInClient(server, await makeUser({ role: 'specialist' }));
  admin = await signedInClient(server, await makeUser({ role: 'admin' }));
  tech = await signedInClient(server, await makeUser({ role: 'tech' }));
  contractor = await signedInClient(server, await makeUser());
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

async function del(client: TestClient, path: string) {
  if (!client.csrfToken) await client.csrf();
  return client.agent.delete(path).set('X-CSRF-Token', client.csrfToken);
}
const groupCount = async () => (await testDb().db.select({ n: count() }).from(searchSynonyms))[0]!.n;
/** An invented term no article or other test uses. */
const term = (prefix: string) => `${prefix}${unique('')}`;

describe('keeping synonym groups', () => {
  it('When a specialist adds, changes and removes a group, then each step is stored, listed and audited', async () => {
    const a = term('flue');
    const b = term('vent');
    const created = await specialist.post('/api/search/synonyms', { terms: [`  ${a.toUpperCase()} `, b, a] });
    expect(created.status).toBe(201);
    const { synonym } = created.body;
    expect(synonym).toEqual({ id: expect.any(Number), terms: [a, b], updatedAt: expect.any(String) });

    const list = await specialist.get('/api/search/synonyms').expect(200);
    expect(list.body.synonyms).toContainEqual(synonym);
    // The trade groups of the first migration are there too.
    expect(list.body.synonyms.some((s: { terms: string[] }) => s.terms.includes('propane'))).toBe(true);

    const c = term('connector');
    const changed = await admin.patch(`/api/search/synonyms/${synonym.id}`, { terms: [a, c, 'vent pipe'] });
    expect(changed.status).toBe(200);
    expect(changed.body.synonym).toMatchObject({ id: synonym.id, terms: [a, c, 'vent pipe'] });
    expect(Date.parse(changed.body.synonym.updatedAt)).toBeGreaterThanOrEqual(Date.parse(synonym.updatedAt));

    expect((await del(specialist, `/api/search/synonyms/${synonym.id}`)).status).toBe(204);
    const after = await specialist.get('/api/search/synonyms').expect(200);
    expect(after.body.synonyms.map((s: { id: number }) => s.id)).not.toContain(synonym.id);

    const actions = await testDb()
      .db.select({ action: auditLog.action, details: auditLog.details })
      .from(auditLog)
      .where(and(eq(auditLog.targetType, 'search_synonym'), eq(auditLog.targetId, String(synonym.id))))
      .orderBy(auditLog.id);
    expect(actions.map((r) => r.action)).toEqual([
      'search.synonym.create',
      'search.synonym.update',
      'search.synonym.delete',
    ]);
    expect(actions[1]!.details).toEqual({ before: [a, b], after: [a, c, 'vent pipe'] });
  });

  it('When a group that does not exist is changed or removed, then it answers 404', async () => {
    const missing = 2_000_000_000;
    const patched = await specialist.patch(`/api/search/synonyms/${missing}`, { terms: ['one', 'two'] });
    expect(patched.status).toBe(404);
    expect(patched.body.error.code).toBe('not_found');
    expect((await del(specialist, `/api/search/synonyms/${missing}`)).status).toBe(404);
  });
});

describe('validation', () => {
  const cases: [string, unknown, string][] = [
    ['no terms', {}, 'terms'],
    ['one term', { terms: ['lonely'] }, 'terms'],
    ['the same term twice in other case', { terms: ['Spud', 'spud '] }, 'terms'],
    ['an empty term', { terms: ['orifice', '   '] }, 'terms.1'],
    ['a term over 60 characters', { terms: ['x'.repeat(61), 'spud'] }, 'terms.0'],
    ['21 terms', { terms: Array.from({ length: 21 }, (_, i) => `term${i}`) }, 'terms'],
    ['a term that is not text', { terms: ['spud', 7] }, 'terms.1'],
  ];
  for (const [what, body, field] of cases) {
    it(`When the group has ${what}, then it answers 400 naming ${field} and stores nothing`, async () => {
      const before = await groupCount();
      const res = await specialist.post('/api/search/synonyms', body as object);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.fields).toHaveProperty([field]);
      expect(await groupCount()).toBe(before);
    });
  }

  it('When a change would leave one term, then it answers 400 and the group stays as it was', async () => {
    const terms = [term('ignitor'), term('igniter')];
    const { synonym } = (await specialist.post('/api/search/synonyms', { terms })).body;
    const res = await specialist.patch(`/api/search/synonyms/${synonym.id}`, { terms: [terms[0]] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['terms']);
    const [row] = await testDb().db.select().from(searchSynonyms).where(eq(searchSynonyms.id, synonym.id));
    expect(row!.terms).toEqual(terms);
    await del(specialist, `/api/search/synonyms/${synonym.id}`);
  });

  it('When the 20-term limit is reached only through duplicates, then the group is accepted', async () => {
    const base = term('t');
    const terms = Array.from({ length: 20 }, (_, i) => `${base}${i}`).concat(`${base}0`);
    const res = await specialist.post('/api/search/synonyms', { terms });
    expect(res.status).toBe(201);
    expect(res.body.synonym.terms).toHaveLength(20);
    await del(specialist, `/api/search/synonyms/${res.body.synonym.id}`);
  });
});

describe('who may keep them', () => {
  for (const who of ['tech', 'contractor'] as const) {
    it(`When a ${who} lists, adds, changes or removes a group, then it answers 403 and nothing changes`, async () => {
      const client = who === 'tech' ? tech : contractor;
      const [existing] = await testDb().db.select().from(searchSynonyms).limit(1);
      const before = await groupCount();
      expect((await client.get('/api/search/synonyms')).status).toBe(403);
      expect((await client.post('/api/search/synonyms', { terms: ['aa', 'bb'] })).status).toBe(403);
      // Refused before the body is even read.
      expect((await client.post('/api/search/synonyms', { terms: 'nonsense' })).status).toBe(403);
      expect(
        (await client.patch(`/api/search/synonyms/${existing!.id}`, { terms: ['aa', 'bb'] })).status,
      ).toBe(403);
      expect((await del(client, `/api/search/synonyms/${existing!.id}`)).status).toBe(403);
      expect(await groupCount()).toBe(before);
      const [same] = await testDb()
        .db.select()
        .from(searchSynonyms)
        .where(eq(searchSynonyms.id, existing!.id));
      expect(same!.terms).toEqual(existing!.terms);
    });
  }

  it('When nobody is signed in, then it answers 401', async () => {
    const res = await new TestClient(server).get('/api/search/synonyms');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('a new group in the next search', () => {
  it('When a group links a word no article uses to one an article uses, then searching the first finds the article', async () => {
    const known = term('kn');
    const unknown = term('un');
    const writer = await signedInClient(server, await makeUser({ role: 'specialist' }));
    const created = await writer.post('/api/articles', {
      title: `Draft hood spillage ${known}`,
      summary: 'How to confirm the vent draws before you leave the job.',
      body: `Hold a smoke source at the draft hood; the ${known} test takes two minutes.`,
      kind: 'procedure',
      audience: 'contractor',
    });
    expect((await specialist.post(`/api/articles/${created.body.article.id}/publish`)).status).toBe(200);

    const before = await contractor.get(`/api/search?q=${unknown}`).expect(200);
    expect(before.body.total).toBe(0);

    const group = await specialist.post('/api/search/synonyms', { terms: [unknown, known] });
    expect(group.status).toBe(201);
    const after = await contractor.get(`/api/search?q=${unknown}`).expect(200);
    expect(after.body.hits.map((h: { slug: string }) => h.slug)).toEqual([created.body.article.slug]);

    expect((await del(specialist, `/api/search/synonyms/${group.body.synonym.id}`)).status).toBe(204);
    expect((await contractor.get(`/api/search?q=${unknown}`).expect(200)).body.total).toBe(0);
  });
});
