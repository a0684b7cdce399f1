import { readdir } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import exifr from 'exifr';
import { closeTestDb, makeUser, testDb, unique, type MadeUser } from '../support/fixtures';
import { TestClient, signedInClient, startTestServer } from '../support/server';
import { phonePhoto } from '../support/photos';
import { addArticleImage } from '../../api/src/features/articles/images.service';
import type { RunningServer } from '../../api/src/server';

const UPLOAD_DIR = `/tmp/lightoff-test-article-images-${process.pid}`;
let server: RunningServer;
let writer: MadeUser;
let writerClient: TestClient;
let reviewerClient: TestClient;
let contractorClient: TestClient;
beforeAll(async () => {
  server = await startTestServer({ UPLOAD_DIR });
  writer = await makeUser({ role: 'specialist' });
  writerClient = await signedInClient(server, writer);
  reviewerClient = await signedInClient(server, await makeUser({ role: 'specialist' }));
  contractorClient = await signedInClient(server, await makeUser({ role: 'contractor' }));
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

async function newDraft(client = writerClient, over: Record<string, unknown> = {}) {
  const res = await client.post('/api/articles', {
    title: `Reading the rating plate ${unique()}`,
    summary: 'Where the input rating and the gas type are printed on the unit.',
    body: 'The plate is inside the burner compartment door.',
    kind: 'procedure',
    audience: 'contractor',
    ...over,
  });
  expect(res.status).toBe(201);
  return res.body.article as { id: number; slug: string };
}

function uploadTo(client: TestClient, articleId: number, bytes: Buffer, name = 'plate.jpg', field = 'file') {
  return client.agent
    .post(`/api/articles/${articleId}/images`)
    .set('X-CSRF-Token', client.csrfToken)
    .attach(field, bytes, name);
}

const binary = (client: TestClient, url: string) =>
  client
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });

const rowsOf = async (articleId: number) =>
  (await testDb().pool.query('select count(*)::int n from article_images where article_id = $1', [articleId]))
    .rows[0].n as number;
const filesOf = async (articleId: number) =>
  readdir(join(UPLOAD_DIR, 'articles', String(articleId))).catch(() => [] as string[]);

async function publish(articleId: number) {
  await writerClient.post(`/api/articles/${articleId}/submit`);
  expect((await reviewerClient.post(`/api/articles/${articleId}/publish`)).status).toBe(200);
}

describe('adding a picture to an article', () => {
  it('When the writer uploads a phone photo, then 201 with its address and size, and the stored file has no metadata and is upright', async () => {
    const article = await newDraft();
    const original = await phonePhoto(1200, 800);
    expect((await exifr.gps(original))?.latitude).toBeCloseTo(42.35, 1);
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, original, 'IMG_2041.jpg');
    expect(res.status).toBe(201);
    const { image } = res.body;
    expect(image).toEqual({
      id: expect.any(Number),
      url: `/api/articles/${article.id}/images/${image.id}`,
      // Orientation 6 is a quarter turn: 1200×800 becomes portrait.
      width: 800,
      height: 1200,
    });

    const file = await binary(writerClient, image.url);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('image/jpeg');
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(file.headers['cache-control']).toMatch(/^private\b/);
    expect(Number(/max-age=(\d+)/.exec(file.headers['cache-control'] ?? '')?.[1])).toBeGreaterThanOrEqual(
      86400,
    );
    const body = file.body as Buffer;
    expect(await exifr.parse(body).catch(() => undefined)).toBeUndefined();
    expect(await exifr.gps(body).catch(() => undefined)).toBeUndefined();
    const meta = await sharp(body).metadata();
    expect(meta.exif).toBeUndefined();
    expect([meta.width, meta.height]).toEqual([800, 1200]);
    expect((await binary(writerClient, `${image.url}/thumb`)).status).toBe(200);
  });

  it('When the article text points at the uploaded picture, then the rendering shows it; a picture from elsewhere is left out', async () => {
    const article = await newDraft();
    await writerClient.csrf();
    const { image } = (await uploadTo(writerClient, article.id, await phonePhoto(300, 200))).body;
    const saved = await writerClient.patch(`/api/articles/${article.id}`, {
      body: `Plate:\n\n![Rating plate](${image.url})\n\n![Tracker](https://images.example.invalid/p.png)`,
    });
    expect(saved.status).toBe(200);
    const html = saved.body.article.bodyHtml as string;
    expect(html).toContain(`<img src="${image.url}" alt="Rating plate" loading="lazy" />`);
    expect(html).not.toContain('example.invalid');
  });

  it('When a PNG with transparency is uploaded, then it is kept as WebP', async () => {
    const article = await newDraft();
    const png = await sharp({
      create: { width: 64, height: 64, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0.5 } },
    })
      .png()
      .toBuffer();
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, png, 'wiring.png');
    expect(res.status).toBe(201);
    const file = await binary(writerClient, res.body.image.url);
    expect(file.headers['content-type']).toBe('image/webp');
  });

  it('When a file is over 15 MB, then 413 and nothing is stored', async () => {
    const article = await newDraft();
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, Buffer.alloc(16 * 1024 * 1024, 0xff), 'huge.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(await rowsOf(article.id)).toBe(0);
    expect(await filesOf(article.id)).toEqual([]);
  });

  it('When an image has more pixels than any camera makes, then 413 and nothing is stored', async () => {
    const article = await newDraft();
    const flood = await sharp({ create: { width: 10_000, height: 10_000, channels: 3, background: '#000' } })
      .png({ compressionLevel: 9 })
      .toBuffer();
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, flood, 'flood.png');
    expect(res.status).toBe(413);
    expect(await rowsOf(article.id)).toBe(0);
    expect(await filesOf(article.id)).toEqual([]);
  });

  it.each([
    ['a script named .jpg', Buffer.from('<script>alert(1)</script>'), 'evil.jpg'],
    ['a PDF', Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n'), 'manual.pdf'],
    ['an empty file', Buffer.alloc(0), 'empty.jpg'],
  ])('When the file is %s, then 415 and nothing is stored', async (_what, bytes, name) => {
    const article = await newDraft();
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, bytes, name);
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    expect(await rowsOf(article.id)).toBe(0);
    expect(await filesOf(article.id)).toEqual([]);
  });

  it('When a photo is cut short, then 400 says it could not be read and nothing is stored', async () => {
    const article = await newDraft();
    const broken = (await phonePhoto(800, 600)).subarray(0, 400);
    await writerClient.csrf();
    const res = await uploadTo(writerClient, article.id, broken, 'broken.jpg');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fields: { file: expect.any(String) } });
    expect(await rowsOf(article.id)).toBe(0);
    expect(await filesOf(article.id)).toEqual([]);
  });

  it('When no file is sent, or it is sent under another field, then 400 names the field', async () => {
    const article = await newDraft();
    await writerClient.csrf();
    const none = await writerClient.agent
      .post(`/api/articles/${article.id}/images`)
      .set('X-CSRF-Token', writerClient.csrfToken)
      .field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('file');
    const wrongField = await uploadTo(writerClient, article.id, await phonePhoto(50, 50), 'p.jpg', 'files');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.fields).toHaveProperty('file');
    expect(await rowsOf(article.id)).toBe(0);
  });

  it('When someone who may not edit the article uploads, then it is refused and nothing is stored', async () => {
    const article = await newDraft();
    const otherTech = await signedInClient(server, await makeUser({ role: 'tech' }));
    await otherTech.csrf();
    // A tech cannot see another writer's draft at all.
    expect((await uploadTo(otherTech, article.id, await phonePhoto(50, 50))).status).toBe(404);
    await contractorClient.csrf();
    expect((await uploadTo(contractorClient, article.id, await phonePhoto(50, 50))).status).toBe(404);
    await publish(article.id);
    // Once published they can read it, but still not change it.
    expect((await uploadTo(otherTech, article.id, await phonePhoto(50, 50))).status).toBe(403);
    expect((await uploadTo(contractorClient, article.id, await phonePhoto(50, 50))).status).toBe(403);
    expect(await rowsOf(article.id)).toBe(0);
    expect(await filesOf(article.id)).toEqual([]);
  });

  it('When a tech writes their own draft, then they may add pictures to it; a retired article takes none', async () => {
    const tech = await signedInClient(server, await makeUser({ role: 'tech' }));
    const article = await newDraft(tech);
    await tech.csrf();
    expect((await uploadTo(tech, article.id, await phonePhoto(60, 40))).status).toBe(201);
    expect((await reviewerClient.post(`/api/articles/${article.id}/retire`)).status).toBe(200);
    await writerClient.csrf();
    expect((await uploadTo(writerClient, article.id, await phonePhoto(60, 40))).status).toBe(409);
    expect(await rowsOf(article.id)).toBe(1);
  });

  it('When the upload comes without the CSRF token, then 403 and nothing is stored', async () => {
    const article = await newDraft();
    const res = await writerClient.agent
      .post(`/api/articles/${article.id}/images`)
      .attach('file', await phonePhoto(50, 50), 'p.jpg');
    expect(res.status).toBe(403);
    expect(await rowsOf(article.id)).toBe(0);
  });
});

describe('who sees an article picture', () => {
  it('When the article is a draft, then only staff who may see the draft get the picture; a contractor gets 404 until it is published for contractors', async () => {
    const article = await newDraft();
    await writerClient.csrf();
    const { image } = (await uploadTo(writerClient, article.id, await phonePhoto(100, 80))).body;
    const otherTech = await signedInClient(server, await makeUser({ role: 'tech' }));

    expect((await contractorClient.get(image.url)).status).toBe(404);
    expect((await otherTech.get(image.url)).status).toBe(404);
    expect((await reviewerClient.get(image.url)).status).toBe(200);

    await publish(article.id);
    expect((await binary(contractorClient, image.url)).status).toBe(200);
    expect((await otherTech.get(image.url)).status).toBe(200);
  });

  it('When the article is for staff only, then a contractor gets 404 even once it is published', async () => {
    const article = await newDraft(writerClient, { audience: 'staff' });
    await writerClient.csrf();
    const { image } = (await uploadTo(writerClient, article.id, await phonePhoto(100, 80))).body;
    await publish(article.id);
    expect((await contractorClient.get(image.url)).status).toBe(404);
    expect((await contractorClient.get(`${image.url}/thumb`)).status).toBe(404);
    expect((await reviewerClient.get(image.url)).status).toBe(200);
  });

  it('When the picture is asked for under another article, or does not exist, then 404; signed out, 401', async () => {
    const first = await newDraft();
    const second = await newDraft();
    await writerClient.csrf();
    const { image } = (await uploadTo(writerClient, first.id, await phonePhoto(100, 80))).body;
    expect((await writerClient.get(`/api/articles/${second.id}/images/${image.id}`)).status).toBe(404);
    expect((await writerClient.get(`/api/articles/${first.id}/images/${image.id + 100000}`)).status).toBe(
      404,
    );
    expect((await writerClient.get(`/api/articles/${first.id}/images/abc`)).status).toBe(400);
    const anonymous = new TestClient(server);
    expect((await anonymous.get(image.url)).status).toBe(401);
  });
});

describe('copying a picture in from elsewhere (the write-up)', () => {
  it('When a picture is added inside a transaction that is rolled back, then no row is left', async () => {
    const article = await newDraft();
    const photo = await phonePhoto(120, 90);
    const rollback = new Error('rolled back on purpose');
    await expect(
      server.ctx.db.transaction(async (tx) => {
        const image = await addArticleImage(
          server.ctx,
          { articleId: article.id, uploadedById: writer.id, bytes: photo, fileName: 'from-ticket.jpg' },
          tx,
        );
        expect(image.url).toBe(`/api/articles/${article.id}/images/${image.id}`);
        throw rollback;
      }),
    ).rejects.toBe(rollback);
    expect(await rowsOf(article.id)).toBe(0);

    const kept = await addArticleImage(server.ctx, {
      articleId: article.id,
      uploadedById: writer.id,
      bytes: photo,
      fileName: '../../etc/passwd.jpg',
    });
    expect(kept).toMatchObject({ width: 90, height: 120 });
    const { rows } = await testDb().pool.query('select file_name from article_images where id = $1', [
      kept.id,
    ]);
    expect(rows[0].file_name).not.toContain('/');
  });
});
