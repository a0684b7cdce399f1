// The knowledge-base search lives in the address: a shared link opens the same search, and
// back/forward step through the filters chosen.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeEquipmentModel, makeUser, unique } from '../support/fixtures';
import { csrfToken, signIn } from './helpers';

/** A word no other test's article holds, letters only so the search engine treats it as a word. */
const marker = () => `vorn${unique('').replace(/\d/g, (d) => 'abcdefghij'[Number(d)]!)}`;

describe('knowledge-base filters in the address', () => {
  afterAll(() => closeTestDb());

  it('When a reader searches and picks a kind, then the address holds both, back and forward step through them, and the link opens the same search', async () => {
    const admin = await makeUser({ role: 'admin', name: 'Avery Filter' });
    const word = marker();
    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, admin.email, admin.password);
      const headers = { 'X-CSRF-Token': await csrfToken(page) };
      const titles = {
        procedure: `Setting the ${word} gas valve`,
        bulletin: `Notice about the ${word} valve`,
      };
      // Only the procedure covers a model: a furnace, for natural gas and propane.
      const furnace = await makeEquipmentModel({ type: 'furnace' });
      for (const [kind, title] of Object.entries(titles)) {
        const res = await page.request.post('/api/articles', {
          headers,
          data: {
            title,
            summary: `What to know about the ${word} valve.`,
            body: `The ${word} valve.`,
            kind,
            audience: 'contractor',
            equipmentModelIds: kind === 'procedure' ? [furnace.id] : [],
          },
        });
        const { article } = (await res.json()) as { article: { id: number } };
        expect((await page.request.post(`/api/articles/${article.id}/publish`, { headers })).status()).toBe(
          200,
        );
      }

      await page.goto('/kb');
      await page.getByRole('heading', { name: 'Recently updated' }).waitFor();
      await page.getByTestId('kb-search').fill(word);
      await page.waitForURL((url) => url.searchParams.get('q') === word);
      const hits = page.getByTestId('kb-hits');
      await hits.getByRole('link', { name: titles.procedure }).waitFor();
      await hits.getByRole('link', { name: titles.bulletin }).waitFor();
      // Each kind shows how many of the matches it holds.
      await expect.poll(() => page.getByTestId('kind-procedure').innerText()).toMatch(/Procedure\s*1/);

      // The equipment type list counts what each type would find.
      await page.getByTestId('filter-equipment-type').click();
      const furnaceOption = page.getByRole('option', { name: /Furnace/ });
      await expect.poll(() => furnaceOption.innerText()).toMatch(/Furnace\s*1/);
      await expect.poll(() => page.getByRole('option', { name: /Boiler/ }).innerText()).toMatch(/Boiler\s*0/);
      await screenshot(page, 'kb-filters-type');
      await furnaceOption.click();
      await page.waitForURL((url) => url.searchParams.get('equipmentType') === 'furnace');
      await expect.poll(() => hits.getByRole('link').allInnerTexts()).toEqual([titles.procedure]);
      await page.goBack();
      await page.waitForURL((url) => !url.searchParams.has('equipmentType'));
      await expect.poll(() => hits.getByRole('link').count()).toBe(2);

      await page.getByTestId('kind-bulletin').click();
      await page.waitForURL((url) => url.searchParams.get('kind') === 'bulletin');
      await expect.poll(() => hits.getByRole('link').allInnerTexts()).toEqual([titles.bulletin]);
      await screenshot(page, 'kb-filters');

      await page.goBack();
      await page.waitForURL((url) => !url.searchParams.has('kind') && url.searchParams.get('q') === word);
      await expect.poll(() => hits.getByRole('link').count()).toBe(2);
      await page.goForward();
      await page.waitForURL((url) => url.searchParams.get('kind') === 'bulletin');
      await expect.poll(() => hits.getByRole('link').allInnerTexts()).toEqual([titles.bulletin]);

      // The address shared with someone else opens the same search, filters set.
      const link = page.url();
      const other = await newSession({ viewport: DESKTOP });
      try {
        const reader = await makeUser({ role: 'contractor' });
        await signIn(other.page, reader.email, reader.password);
        await other.page.goto(link);
        await other.page.getByTestId('kb-hits').getByRole('link', { name: titles.bulletin }).waitFor();
        expect(await other.page.getByTestId('kb-search').inputValue()).toBe(word);
        expect(await other.page.getByTestId('kind-bulletin').locator('input').isChecked()).toBe(true);
        expect(await other.page.getByTestId('kb-hits').getByRole('link').count()).toBe(1);
      } finally {
        await other.close();
      }

      // Clearing the filters and the words brings back what changed lately.
      await page.getByRole('button', { name: 'Clear filters' }).click();
      await page.waitForURL((url) => !url.searchParams.has('kind'));
      await page.getByTestId('kb-search').fill('');
      await page.getByRole('heading', { name: 'Recently updated' }).waitFor();
      await page.waitForURL((url) => url.search === '');
    } finally {
      await session.close();
    }
  });
});
