import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import exifr from 'exifr';
import { closeTestDb, testDb } from '../support/fixtures';
import { startTestServer } from '../support/server';
import { phonePhoto } from '../support/photos';
import { newClientId, ticketWorld } from '../support/tickets';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer({ UPLOAD_DIR: `/tmp/lightoff-test-uploads-${process.pid}` });
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const countAttachments = async (ticketId: number) =>
  (await testDb().pool.query('select count(*)::int n from attachments where ticket_id = $1', [ticketId]))
    .rows[0].n;

describe('photo uploads', () => {
  it('When a JPEG with GPS EXIF is uploaded, then what comes back has no metadata, is turned upright and at most 2560 px', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const original = await phonePhoto();
    expect((await exifr.gps(original))?.latitude).toBeCloseTo(42.35, 1);
    const res = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', original, 'IMG_0001.jpg');
    expect(res.status).toBe(201);
    const [att] = res.body.attachments;
    // Orientation 6 means a 90° turn: 3000×2000 becomes portrait, then fits 2560 on the long side.
    expect([att.width, att.height]).toEqual([1707, 2560]);
    const file = await contractorClient
      .get(att.url)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(file.status).toBe(200);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(file.headers['content-disposition']).toMatch(/filename\*=UTF-8''IMG_0001\.jpg/);
    const body = file.body as Buffer;
    expect(await exifr.parse(body).catch(() => undefined)).toBeUndefined();
    expect(await exifr.gps(body).catch(() => undefined)).toBeUndefined();
    const meta = await sharp(body).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    const thumb = await contractorClient.get(att.thumbnailUrl).expect(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
  });

  it('When a file is over 15 MB, then 413 and nothing is stored', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const big = Buffer.alloc(16 * 1024 * 1024, 0xff);
    const res = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', await phonePhoto(200, 200), 'ok.jpg')
      .attach('files', big, 'huge.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(await countAttachments(ticket.id)).toBe(0);
  });

  it('When a ".jpg" is really a script or text, then 415 and nothing is stored, even beside a good photo', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const res = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', await phonePhoto(200, 200), 'good.jpg')
      .attach('files', Buffer.from('<script>alert(1)</script>'), {
        filename: 'evil.jpg',
        contentType: 'image/jpeg',
      });
    expect(res.status).toBe(415);
    expect(await countAttachments(ticket.id)).toBe(0);
  });

  it('When more than 10 files come at once, then 400 and nothing is stored', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const photo = await phonePhoto(50, 50);
    let req = contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken);
    for (let i = 0; i < 11; i++) req = req.attach('files', photo, `p${i}.jpg`);
    const res = await req;
    expect(res.status).toBe(400);
    expect(await countAttachments(ticket.id)).toBe(0);
  });

  it('When an image has more pixels than any camera makes, then it is refused', async () => {
    const { ticket, contractorClient } = await ticketWorld(server);
    const flood = await sharp({ create: { width: 10_000, height: 10_000, channels: 3, background: '#000' } })
      .png({ compressionLevel: 9 })
      .toBuffer();
    const res = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', flood, 'flood.png');
    expect(res.status).toBe(413);
    expect(await countAttachments(ticket.id)).toBe(0);
  });

  it('When a photo is sent with a message, then the message carries it inline', async () => {
    const { ticket, contractorClient, techClient } = await ticketWorld(server);
    const up = await contractorClient.agent
      .post(`/api/tickets/${ticket.id}/attachments`)
      .set('X-CSRF-Token', contractorClient.csrfToken)
      .attach('files', await phonePhoto(400, 300), 'plate.jpg');
    const id = up.body.attachments[0].id;
    const msg = await contractorClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'Rating plate',
      clientId: newClientId(),
      attachmentIds: [id],
    });
    expect(msg.body.message.attachments.map((a: { id: number }) => a.id)).toEqual([id]);
    await techClient.get(`/api/attachments/${id}`).expect(200);
    const again = await techClient.post(`/api/tickets/${ticket.id}/messages`, {
      body: 'steal',
      clientId: newClientId(),
      attachmentIds: [id],
    });
    expect(again.status).toBe(400);
  });
});
