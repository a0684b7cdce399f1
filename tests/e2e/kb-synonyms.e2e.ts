// A specialist tells search that two words mean the same, and a search that found nothing finds the article.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeUser, unique } from '../support/fixtures';
import { csrfToken, signIn } from './helpers';

/** A made-up word no article holds: letters only, so search treats it as one word. */
const word = (prefix: string) => `${prefix}${unique('').replace(/\d/g, (d) => 'abcdefghij'[Number(d)]!)}`;

describe('words that mean the same', () => {
  afterAll(() => closeTestDb());

  it('When a specialist groups a word nobody found with the article’s word, then searching for it finds the article; groups can be changed and removed', async () => {
    const admin = await makeUser({ role: 'admin', name: 'Ari Publish' });
    const specialist = await makeUser({ role: 'specialist', name: 'Sol Wordsmith' });
    const inArticle = word('zelt');
    const typed = word('quom');
    const title = `Lighting the ${inArticle} pilot`;

    const publishing = await newSession({ viewport: DESKTOP });
    try {
      const { page } = publishing;
      await signIn(page, admin.email, admin.password);
      const headers = { 'X-CSRF-Token': await csrfToken(page) };
      const res = await page.request.post('/api/articles', {
        headers,
        data: {
          title,
          summary: `How to light the ${inArticle} standing pilot safely.`,
          body: `Hold the ${inArticle} knob down for a minute after the pilot lights.`,
          kind: 'procedure',
          audience: 'contractor',
        },
      });
      const { article } = (await res.json()) as { article: { id: number } };
      expect((await page.request.post(`/api/articles/${article.id}/publish`, { headers })).status()).toBe(
        200,
      );
    } finally {
      await publishing.close();
    }

    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, specialist.email, specialist.password);

      // The word people typed finds nothing yet.
      await page.goto(`/kb?q=${typed}`);
      await page.getByText('Nothing matches that yet.').waitFor();

      await page.getByRole('link', { name: 'Words that mean the same' }).click();
      await page.getByRole('heading', { level: 1, name: 'Words that mean the same' }).waitFor();
      const terms = page.getByTestId('synonym-terms').first();

      // One word is not a group: the form says so by the field and sends nothing.
      await terms.fill(`${typed}, ${typed.toUpperCase()}`);
      await page.getByRole('button', { name: 'Add the group' }).click();
      await page.getByText('Give at least two different terms').waitFor();

      await terms.fill(`${typed} = ${inArticle}`);
      await page.getByText('Search will treat as one:').waitFor();
      await screenshot(page, 'kb-synonyms-form');
      await page.getByRole('button', { name: 'Add the group' }).click();
      const list = page.getByTestId('synonym-list');
      await list.getByText(typed, { exact: true }).waitFor();
      await list.getByText(inArticle, { exact: true }).waitFor();
      expect(await terms.inputValue()).toBe('');
      await screenshot(page, 'kb-synonyms');

      // Now the same search finds the article.
      await page.goto(`/kb?q=${typed}`);
      await page.getByTestId('kb-hits').getByRole('link', { name: title }).waitFor();

      // A group can take another word, and be removed again after asking.
      await page.goto('/kb/synonyms');
      const third = word('brel');
      await page.getByRole('button', { name: new RegExp(`^Change the group .*${typed}`) }).click();
      const editBox = list.getByTestId('synonym-terms');
      await editBox.fill(`${typed}, ${inArticle}, ${third}`);
      await list.getByRole('button', { name: 'Save the group' }).click();
      await list.getByText(third, { exact: true }).waitFor();

      await page.getByRole('button', { name: new RegExp(`^Remove the group .*${typed}`) }).click();
      const ask = page.getByRole('dialog', { name: 'Remove this group?' });
      await ask.getByRole('button', { name: 'Remove' }).click();
      await expect.poll(() => page.getByText(third, { exact: true }).count()).toBe(0);

      await page.goto(`/kb?q=${typed}`);
      await page.getByText('Nothing matches that yet.').waitFor();
    } finally {
      await session.close();
    }
  });

  it('When a tech opens the page, then they are sent home and the knowledge base shows no link to it', async () => {
    const tech = await makeUser({ role: 'tech' });
    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, tech.email, tech.password);
      await page.goto('/kb/synonyms');
      await page.waitForURL((url) => url.pathname === '/desk');
      await page.goto('/kb');
      await page.getByRole('heading', { level: 1, name: 'Knowledge base' }).waitFor();
      expect(await page.getByRole('link', { name: 'Words that mean the same' }).count()).toBe(0);
    } finally {
      await session.close();
    }
  });
});
