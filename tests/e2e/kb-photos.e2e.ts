// A writer puts photos into an article from the editor: picked from the device, or pasted into the text.
import { afterAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { DESKTOP, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeUser, unique } from '../support/fixtures';
import { signIn } from './helpers';

const photo = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 3, background: { r: 164, g: 67, b: 27 } } })
    .jpeg()
    .toBuffer();

const IMAGE_MARKDOWN = /!\[([^\]]*)\]\((\/api\/articles\/\d+\/images\/\d+)\)/g;

describe('photos in the article editor', () => {
  afterAll(() => closeTestDb());

  it('When a writer adds a photo to a new article, then it asks for the draft to be saveable, saves it, and the photo shows in the saved preview; a pasted photo goes in too', async () => {
    const writer = await makeUser({ role: 'specialist', name: 'Piper Plate' });
    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, writer.email, writer.password);
      await page.goto('/kb/new');
      await page.getByRole('heading', { level: 1, name: 'New article' }).waitFor();
      await page.getByText('adding the first one saves this draft').waitFor();

      // Nothing filled in yet: the draft cannot be saved, and the writer is told why the photo waits.
      const picker = page.getByTestId('photo-input');
      await picker.setInputFiles({
        name: 'rating-plate.jpg',
        mimeType: 'image/jpeg',
        buffer: await photo(640, 480),
      });
      await page.getByTestId('photo-error').getByText('it needs a saved draft to belong to').waitFor();
      expect(new URL(page.url()).pathname).toBe('/kb/new');
      await screenshot(page, 'kb-photo-needs-draft');

      const title = `Rating plate photo ${unique()}`;
      await page.getByLabel('Title', { exact: true }).fill(title);
      await page
        .getByLabel('Summary', { exact: true })
        .fill('Where to find the input rating and the gas type on the unit.');
      await picker.setInputFiles({
        name: 'rating-plate.jpg',
        mimeType: 'image/jpeg',
        buffer: await photo(640, 480),
      });
      await page.waitForURL(/\/kb\/[a-z0-9-]+\/edit$/);
      await expect.poll(() => page.locator('.cm-content').innerText()).toMatch(IMAGE_MARKDOWN);
      const text = await page.locator('.cm-content').innerText();
      const [, alt, url] = [...text.matchAll(IMAGE_MARKDOWN)][0]!;
      expect(alt).toBe('rating-plate');

      // A photo pasted into the text is uploaded and put in where the cursor is.
      await page.locator('.cm-content').click();
      await page.keyboard.press('Control+End');
      const pasted = (await photo(300, 200)).toString('base64');
      await page.locator('.cm-content').evaluate((el, b64) => {
        const bytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
        const data = new DataTransfer();
        data.items.add(new File([bytes], 'burner flame.jpg', { type: 'image/jpeg' }));
        el.dispatchEvent(
          new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
        );
      }, pasted);
      await expect
        .poll(
          async () => [...(await page.locator('.cm-content').innerText()).matchAll(IMAGE_MARKDOWN)].length,
        )
        .toBe(2);
      expect(await page.locator('.cm-content').innerText()).toContain('![burner flame](');

      // Saved, the preview (the server's rendering) shows both pictures, loaded from our own route.
      await page.getByRole('button', { name: 'Save changes' }).click();
      const images = page.getByTestId('article-body').locator('img');
      await expect.poll(() => images.count()).toBe(2);
      await expect
        .poll(() => images.first().evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth))
        .toBe(640);
      expect(await images.first().getAttribute('src')).toBe(url);
      await screenshot(page, 'kb-photo-editor');
    } finally {
      await session.close();
    }
  });

  it('When the file is not a photo, then nothing is uploaded and the writer is told what goes in', async () => {
    const writer = await makeUser({ role: 'tech', name: 'Tad Wirer' });
    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, writer.email, writer.password);
      await page.goto('/kb/new');
      await page.getByLabel('Title', { exact: true }).fill(`Wiring notes ${unique()}`);
      await page
        .getByLabel('Summary', { exact: true })
        .fill('What the wiring diagram on the door says about the limit switch.');
      const uploads: string[] = [];
      page.on('request', (req) => {
        if (/\/api\/articles\/\d+\/images/.test(req.url())) uploads.push(req.url());
      });
      await page
        .getByTestId('photo-input')
        .setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('limit switch') });
      await page.getByTestId('photo-error').getByText('Only photos go into an article').waitFor();
      expect(uploads).toEqual([]);
    } finally {
      await session.close();
    }
  });
});
