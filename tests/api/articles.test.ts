import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeEquipmentModel, makeUser, unique, type MadeUser } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
let specialist: MadeUser;
let specialistClient: TestClient;
let reviewerClient: TestClient;
beforeAll(async () => {
  server = await startTestServer();
  specialist = await makeUser({ role: 'specialist' });
  specialistClient = await signedInClient(server, specialist);
  reviewerClient = await signedInClient(server, await makeUser({ role: 'specialist' }));
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const draft = (over: Record<string, unknown> = {}) => ({
  title: `Checking the vent ${unique()}`,
  summary: 'How to confirm the vent draws before you leave the job.',
  body: '::: steps\n1. Start the appliance.\n2. Hold a smoke source at the draft hood.\n:::\n\nA spillage test takes two minutes.',
  kind: 'procedure',
  audience: 'contractor',
  ...over,
});

async function publish(body = draft()) {
  const created = await specialistClient.post('/api/articles', body);
  expect(created.status).toBe(201);
  const id = created.body.article.id;
  await specialistClient.post(`/api/articles/${id}/submit`);
  const published = await reviewerClient.post(`/api/articles/${id}/publish`);
  expect(published.status).toBe(200);
  return published.body.article;
}

describe('writing and reviewing', () => {
  it('When a tech writes a draft, saves twice and submits it, then a specialist publishes it and the revisions are kept', async () => {
    const tech = await signedInClient(server, await makeUser({ role: 'tech' }));
    const model = await makeEquipmentModel();
    const created = await tech.post('/api/articles', draft({ equipmentModelIds: [model.id] }));
    expect(created.body.article).toMatchObject({ status: 'draft', models: [{ id: model.id }] });
    const id = created.body.article.id;
    await tech.patch(`/api/articles/${id}`, { body: 'Second version.', note: 'shorter' });
    expect((await tech.post(`/api/articles/${id}/publish`)).status).toBe(403);
    expect((await tech.post(`/api/articles/${id}/submit`)).body.article.status).toBe('in-review');
    const published = await reviewerClient.post(`/api/articles/${id}/publish`);
    expect(published.body.article.status).toBe('published');
    const revisions = await reviewerClient.get(`/api/articles/${id}/revisions`).expect(200);
    expect(revisions.body.items.map((r: { body: string }) => r.body)).toEqual([
      'Second version.',
      draft().body,
    ]);
  });

  it('When the author is the only specialist, then they cannot publish their own; an admin may publish theirs', async () => {
    const created = await specialistClient.post('/api/articles', draft());
    expect((await specialistClient.post(`/api/articles/${created.body.article.id}/publish`)).status).toBe(
      403,
    );
    const admin = await signedInClient(server, await makeUser({ role: 'admin' }));
    const own = await admin.post('/api/articles', draft());
    expect((await admin.post(`/api/articles/${own.body.article.id}/publish`)).body.article.status).toBe(
      'published',
    );
  });

  it('When a reviewer sends an article back, then it is a draft again with the note; a bad move is 409', async () => {
    const created = await specialistClient.post('/api/articles', draft());
    const id = created.body.article.id;
    expect(
      (await reviewerClient.post(`/api/articles/${id}/send-back`, { note: 'Add the manometer reading' }))
        .status,
    ).toBe(409);
    await specialistClient.post(`/api/articles/${id}/submit`);
    const back = await reviewerClient.post(`/api/articles/${id}/send-back`, {
      note: 'Add the manometer reading',
    });
    expect(back.body.article).toMatchObject({ status: 'draft', reviewNote: 'Add the manometer reading' });
  });

  it('When a title would make the address of a knowledge-base page, then the slug gets a number and the article opens', async () => {
    for (const title of ['Synonyms', 'Missed']) {
      const res = await specialistClient.post('/api/articles', draft({ title }));
      expect(res.status).toBe(201);
      const { slug } = res.body.article;
      expect(slug).toMatch(new RegExp(`^${title.toLowerCase()}-\\d+$`));
      await specialistClient.get(`/api/articles/${slug}`).expect(200);
    }
  });

  it('When the body is missing its title or summary, then 400 names them', async () => {
    const res = await specialistClient.post('/api/articles', {
      body: 'x',
      kind: 'procedure',
      audience: 'staff',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['summary', 'title']);
  });
});

describe('who reads what', () => {
  it('When a contractor asks for a staff article or a draft, then 404 in the list, by slug and in search', async () => {
    const staffOnly = await publish(draft({ audience: 'staff', title: `Warranty rules ${unique()}` }));
    const unpublished = (await specialistClient.post('/api/articles', draft())).body.article;
    const contractor = await signedInClient(server, await makeUser());
    expect((await contractor.get(`/api/articles/${staffOnly.slug}`)).status).toBe(404);
    expect((await contractor.get(`/api/articles/${unpublished.slug}`)).status).toBe(404);
    const list = await contractor.get('/api/articles?pageSize=100').expect(200);
    const ids = list.body.items.map((a: { id: number }) => a.id);
    expect(ids).not.toContain(staffOnly.id);
    expect(ids).not.toContain(unpublished.id);
    const search = await contractor.get(`/api/search?q=${encodeURIComponent(staffOnly.title)}`).expect(200);
    expect(search.body.hits.map((h: { id: number }) => h.id)).not.toContain(staffOnly.id);
    const tech = await signedInClient(server, await makeUser({ role: 'tech' }));
    await tech.get(`/api/articles/${staffOnly.slug}`).expect(200);
  });

  it('When readers vote, then one vote each is counted and a second vote replaces the first', async () => {
    const article = await publish();
    const reader = await signedInClient(server, await makeUser());
    await reader.post(`/api/articles/${article.id}/feedback`, { helped: true });
    const changed = await reader.post(`/api/articles/${article.id}/feedback`, {
      helped: false,
      comment: 'Missing the LP values',
    });
    expect(changed.body.article).toMatchObject({ helpedCount: 0, notHelpedCount: 1 });
  });
});

describe('safe rendering', () => {
  const HOSTILE = [
    '<script>window.__owned = 1</script>',
    '[click](javascript:alert(1))',
    '<img src=x onerror="window.__owned=1">',
    '![x](javascript:alert(1))',
    '<svg onload="window.__owned=1"><script>1</script></svg>',
    '<a href="data:text/html;base64,PHNjcmlwdD4=">data</a>',
    '<div style="background:url(javascript:alert(1))">x',
    '[x](JaVaScRiPt:alert(1))',
    '<iframe src="https://example.com"></iframe>',
  ].join('\n\n');

  it('When an article holds hostile Markdown, then its HTML has no script, handler, javascript: or data: URL', async () => {
    const article = await publish(draft({ body: HOSTILE }));
    const html: string = article.bodyHtml;
    expect(html).not.toMatch(/<script|<iframe|<svg/i);
    // Inside tags: no event handler, no javascript: or data: link, no image (the hostile text stays as text).
    expect(html).not.toMatch(/<[^>]*\son\w+\s*=/i);
    expect(html).not.toMatch(/<[^>]*(href|src)\s*=\s*"?\s*(javascript|data):/i);
    expect(html).not.toMatch(/<img/i);
    expect(html).toContain('&lt;script&gt;');
  });

  it('When an article has caution, steps, tools and spec blocks, then each renders as its own part and gas work carries the caution', async () => {
    const body = [
      '::: caution\nShut the gas off first.\n:::',
      '::: tools\n- Manometer\n:::',
      '::: spec gas-pressure\n| fuel | stage | target in. w.c. |\n| --- | --- | --- |\n| natural-gas | high | 3.5 |\n:::',
    ].join('\n\n');
    const article = await publish(draft({ body, title: `Manifold pressure ${unique()}` }));
    expect(article.bodyHtml).toContain('class="kb-caution"');
    expect(article.bodyHtml).toContain('class="kb-tools"');
    expect(article.bodyHtml).toContain('data-spec="gas-pressure"');
    expect(article.bodyHtml).toContain('class="kb-gas-caution"');
    expect(article.touchesGas).toBe(true);
  });
});

describe('search', () => {
  it('When someone searches, then the query is logged; one with no hits shows on the specialists’ missed list', async () => {
    const word = `zyxwords${Date.now()}`;
    const contractor = await signedInClient(server, await makeUser());
    const res = await contractor.get(`/api/search?q=${word}`).expect(200);
    expect(res.body).toMatchObject({ hits: [], total: 0, engine: 'postgres' });
    expect(typeof res.body.queryId).toBe('number');
    const missed = await specialistClient.get('/api/search/missed').expect(200);
    expect(missed.body.items.map((m: { text: string }) => m.text)).toContain(word);
    expect((await contractor.get('/api/search/missed')).status).toBe(403);
  });

  it('When a contractor opens a suggested article and says it solved it, then the search is recorded as deflected', async () => {
    const article = await publish(draft({ title: `Blower door chatter ${unique()}` }));
    const contractor = await signedInClient(server, await makeUser());
    const res = await contractor
      .get(`/api/search?q=${encodeURIComponent(article.title)}&context=new-ticket`)
      .expect(200);
    expect(res.body.hits[0].id).toBe(article.id);
    const outcome = await contractor.post(`/api/search/${res.body.queryId}/outcome`, {
      articleId: article.id,
      deflected: true,
    });
    expect(outcome.status).toBe(204);
    const other = await signedInClient(server, await makeUser());
    expect(
      (
        await other.post(`/api/search/${res.body.queryId}/outcome`, {
          articleId: article.id,
          deflected: true,
        })
      ).status,
    ).toBe(404);
  });

  it('When a title is typed in part, or with a typo, then suggest offers it; a staff article is never offered to a contractor', async () => {
    const tag = unique('qv');
    const article = await publish(draft({ title: `Inducer bearing noise ${tag}` }));
    const staff = await publish(draft({ title: `Inducer bearing claims ${tag}`, audience: 'staff' }));
    const contractor = await signedInClient(server, await makeUser());
    const partial = await contractor
      .get(`/api/search/suggest?q=${encodeURIComponent(`bearing noise ${tag}`)}`)
      .expect(200);
    expect(partial.body.items.map((i: { id: number }) => i.id)).toContain(article.id);
    const typo = await contractor
      .get(`/api/search/suggest?q=${encodeURIComponent(`inducr bearing ${tag}`)}`)
      .expect(200);
    expect(typo.body.items.map((i: { id: number }) => i.id)).toContain(article.id);
    expect(typo.body.items.map((i: { id: number }) => i.id)).not.toContain(staff.id);
  });
});
