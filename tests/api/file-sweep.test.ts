// The nightly sweep removes files nobody uses: ticket photos never sent, article pictures no
// version of the article shows. Everything else stays, rows and stored files alike.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { closeTestDb, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';
import { newClientId, ticketWorld } from '../support/tickets';
import { sweepUnusedFiles } from '../../api/src/features/attachments/sweep';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
let writer: TestClient;
beforeAll(async () => {
  server = await startTestServer({ UPLOAD_DIR: `/tmp/lightoff-test-sweep-${process.pid}` });
  writer = await signedInClient(server, await makeUser({ role: 'specialist' }));
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const photo = () =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 200, g: 90, b: 40 } } })
    .jpeg()
    .toBuffer();

async function storedKeys(table: 'attachments' | 'article_images', id: number) {
  const { rows } = await testDb().pool.query(
    `select storage_key, thumbnail_key from ${table} where id = $1`,
    [id],
  );
  return rows[0] as { storage_key: string; thumbnail_key: string | null } | undefined;
}
const age = (table: 'attachments' | 'article_images', id: number, days: number) =>
  testDb().pool.query(`update ${table} set created_at = now() - make_interval(days => $2) where id = $1`, [
    id,
    days,
  ]);
const exists = (key: string) =>
  server.ctx.storage.get(key).then(
    () => true,
    () => false,
  );

describe('sweeping unused files', () => {
  it('When the server starts, then the sweep is scheduled for every night', async () => {
    const schema = server.ctx.config.JOBS_SCHEMA;
    await expect
      .poll(async () => {
        const { rows } = await testDb().pool.query(
          `select cron, timezone from ${schema}.schedule where name = $1`,
          ['files.sweep'],
        );
        return rows[0];
      })
      .toEqual({ cron: '17 3 * * *', timezone: 'UTC' });
  });

  it('When a ticket photo was uploaded but never sent, then after a week it and its file are gone, and a sent one stays', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const upload = async () =>
      (
        await contractorClient.agent
          .post(`/api/tickets/${ticket.id}/attachments`)
          .set('X-CSRF-Token', contractorClient.csrfToken)
          .attach('files', await photo(), 'unit.jpg')
          .expect(201)
      ).body.attachments[0].id as number;
    const [unsent, sent, fresh] = [await upload(), await upload(), await upload()];
    await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'The unit',
      clientId: newClientId(),
      attachmentIds: [sent],
    });
    await age('attachments', unsent, 8);
    await age('attachments', sent, 8);
    const keys = (await storedKeys('attachments', unsent))!;
    expect(await exists(keys.storage_key)).toBe(true);

    await sweepUnusedFiles(server.ctx);

    expect(await storedKeys('attachments', unsent)).toBeUndefined();
    expect(await exists(keys.storage_key)).toBe(false);
    expect(await exists(keys.thumbnail_key!)).toBe(false);
    expect(await storedKeys('attachments', sent)).toBeDefined();
    expect(await storedKeys('attachments', fresh)).toBeDefined(); // unsent, but younger than a week
  });

  it('When an article picture is in no version of the article, then it goes; one shown now or in an earlier version stays', async () => {
    const created = await writer.post('/api/articles', {
      title: `Reading the rating plate ${unique()}`,
      summary: 'Where the input rating is printed.',
      body: 'The plate is inside the burner door.',
      kind: 'procedure',
      audience: 'contractor',
    });
    const article = created.body.article as { id: number };
    const upload = async () =>
      (
        await writer.agent
          .post(`/api/articles/${article.id}/images`)
          .set('X-CSRF-Token', writer.csrfToken)
          .attach('file', await photo(), 'plate.jpg')
          .expect(201)
      ).body.image as { id: number; url: string };
    const [shown, earlier, never] = [await upload(), await upload(), await upload()];
    // Saved once with the "earlier" picture, then again with only the one shown now.
    await writer
      .patch(`/api/articles/${article.id}`, { body: `Old photo:\n\n![plate](${earlier.url})` })
      .then((r) => {
        expect(r.status).toBe(200);
      });
    await writer
      .patch(`/api/articles/${article.id}`, { body: `Photo:\n\n![plate](${shown.url})` })
      .then((r) => {
        expect(r.status).toBe(200);
      });
    for (const img of [shown, earlier, never]) await age('article_images', img.id, 8);
    const neverKeys = (await storedKeys('article_images', never.id))!;

    await sweepUnusedFiles(server.ctx);

    expect(await storedKeys('article_images', never.id)).toBeUndefined();
    expect(await exists(neverKeys.storage_key)).toBe(false);
    expect(await storedKeys('article_images', shown.id)).toBeDefined();
    expect(await storedKeys('article_images', earlier.id)).toBeDefined();
  });
});
