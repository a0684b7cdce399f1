// A contractor photographs the control board and sends it in the chat; the tech sees the photo.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser } from '../support/fixtures';
import { openTicket, signIn } from './helpers';

/** A phone-camera-sized JPEG (4000×3000, noisy so it does not shrink to nothing). */
async function cameraPhoto(dir: string): Promise<{ path: string; bytes: number }> {
  const body = await sharp({
    create: {
      width: 4000,
      height: 3000,
      channels: 3,
      background: { r: 90, g: 120, b: 160 },
      noise: { type: 'gaussian', mean: 120, sigma: 40 },
    },
  })
    .jpeg({ quality: 92 })
    .toBuffer();
  const path = join(dir, 'control-board.jpg');
  await writeFile(path, body);
  return { path, bytes: body.length };
}

describe('photos in the ticket chat', () => {
  afterAll(() => closeTestDb());

  it('When the contractor adds a camera photo, then it is made smaller before upload, and the tech sees its thumbnail and can enlarge it', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id });
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Rowan Fielding' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Sam Okafor' });
    const dir = await mkdtemp(join(tmpdir(), 'lightoff-photo-'));
    const photo = await cameraPhoto(dir);

    const desk = await newSession({ viewport: DESKTOP });
    const phone = await newSession({ viewport: PHONE });
    try {
      const { page } = phone;
      const problems: string[] = [];
      page.on('console', (m) => {
        if (m.type() === 'error' && /Content Security Policy|importScripts/i.test(m.text()))
          problems.push(m.text());
      });
      let workers = 0;
      page.on('worker', () => (workers += 1));
      const libraryLoads: number[] = [];
      page.on('response', (r) => {
        if (/\/assets\/browser-image-compression-[\w-]+\.js$/.test(r.url())) libraryLoads.push(r.status());
      });
      const uploads: number[] = [];
      page.on('request', (r) => {
        if (r.method() === 'POST' && r.url().endsWith('/attachments'))
          uploads.push(r.postDataBuffer()?.length ?? 0);
      });

      await signIn(page, contractor.email, contractor.password);
      const ticketId = await openTicket(page, 'Board flashes three times');
      await page.goto(`/tickets/${ticketId}`);
      await page.getByTestId('composer').waitFor();

      await signIn(desk.page, tech.email, tech.password);
      await desk.page.goto(`/tickets/${ticketId}`);
      await desk.page.getByTestId('composer').waitFor();

      await page.getByTestId('photo-library').setInputFiles(photo.path);
      const item = page.getByTestId('photo-item');
      await item.getByText('Uploaded').waitFor({ timeout: 40_000 });
      await screenshot(page, 'ticket-photo-uploaded-phone');

      // Compressed in the browser (in its worker, which our CSP allows) to about 1 MB before upload.
      expect(problems).toEqual([]);
      expect(workers).toBeGreaterThanOrEqual(1);
      // The worker fetched the library from our own server (the page's copy is a separate chunk).
      expect(libraryLoads.filter((status) => status === 200).length).toBeGreaterThanOrEqual(2);
      expect(uploads).toHaveLength(1);
      expect(uploads[0]!).toBeLessThan(1.2 * 1024 * 1024);
      expect(uploads[0]!).toBeLessThan(photo.bytes / 2);

      await page.getByTestId('composer').fill('Board code, see photo.');
      await page.getByTestId('send').click();
      const sent = page.getByTestId('message').filter({ hasText: 'Board code, see photo.' });
      await sent.getByTestId('message-photo').locator('img').waitFor();
      await item.waitFor({ state: 'detached' });

      const seen = desk.page.getByTestId('message').filter({ hasText: 'Board code, see photo.' });
      const thumb = seen.getByTestId('message-photo').locator('img');
      await thumb.waitFor();
      expect(await thumb.getAttribute('src')).toMatch(/^\/api\/attachments\/\d+\/thumb$/);
      await expect
        .poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), {
          timeout: 10_000,
        })
        .toBeGreaterThan(0);

      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );
      await sent.scrollIntoViewIfNeeded();
      await screenshot(page, 'ticket-chat-photo-phone');

      // Tap to enlarge: the full photo opens over the page.
      await sent.getByTestId('message-photo').locator('img').click();
      const viewer = page.locator('.el-image-viewer__wrapper');
      await viewer.waitFor();
      const full = viewer.locator('img.el-image-viewer__img');
      expect(await full.getAttribute('src')).toMatch(/^\/api\/attachments\/\d+$/);
      await expect
        .poll(() => full.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), {
          timeout: 10_000,
        })
        .toBeGreaterThan(0);
      await page.screenshot({ path: await screenshot(page, 'ticket-photo-enlarged-phone') });

      // On the desk, the keyboard opens it too: the thumbnail takes focus, Enter enlarges it.
      const deskThumb = seen.getByRole('button', { name: /Enlarge/ });
      await deskThumb.focus();
      await desk.page.keyboard.press('Enter');
      await desk.page.locator('.el-image-viewer__wrapper img.el-image-viewer__img').waitFor();
    } finally {
      await desk.close();
      await phone.close();
      await rm(dir, { recursive: true, force: true });
    }
  });
});
