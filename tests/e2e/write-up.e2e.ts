// A tech resolves a contractor's ticket, marks the answer and writes it up; another person, a
// product specialist, publishes the draft, and the knowledge-base search finds it.
import type { BrowserContext } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser, unique } from '../support/fixtures';
import type { Ticket } from '../../shared/src/index';
import { signIn } from './helpers';

/** A call to the API as the browser session's user (its cookies, a fresh CSRF token). */
async function api<T>(context: BrowserContext, path: string, data: object) {
  const { token } = (await (await context.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await context.request.post(path, { data, headers: { 'X-CSRF-Token': token } });
  if (!res.ok()) throw new Error(`POST ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

// Invented contact details (the 555-01xx range is kept for fiction).
const PHONE_NUMBER = '(207) 555-0182';
const ADDRESS = '42 Elm Street';

describe('write-up', () => {
  afterAll(() => closeTestDb());

  it('When the tech resolves a ticket, marks the answer and writes it up, then a specialist publishes it and search finds it without the contact details', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({
      homeBranchId: branch.id,
      company: `Brightline Mechanical ${unique('')}`,
    });
    const contractor = await makeUser({ accountId: account.id, name: 'Dana Whitfield' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Sam Okafor' });
    const specialist = await makeUser({ role: 'specialist', branchIds: [branch.id], name: 'Lee Marsh' });
    const word = unique('lowfire');
    const answer = `Low-fire manifold was low; set it to 1.7 in. w.c. (${word}).`;

    const phone = await newSession({ viewport: PHONE });
    const desk = await newSession({ viewport: DESKTOP });
    const subject = `Two-stage furnace drops out on low fire ${word}`;
    const title = `${subject} — CV-T96 test`;
    let slug: string | undefined;
    try {
      await signIn(phone.page, contractor.email, contractor.password);
      const ticket = (
        await api<{ ticket: Ticket }>(phone.context, '/api/tickets', {
          subject,
          description: `At ${ADDRESS}. Call Dana on ${PHONE_NUMBER} if you need me.`,
          modelText: 'CV-T96 test',
          fuel: 'natural-gas',
          urgency: 'emergency',
        })
      ).ticket;

      const { page } = desk;
      await signIn(page, tech.email, tech.password);
      await page.goto(`/tickets/${ticket.id}`);
      await page.getByTestId('ticket-workspace').waitFor();
      await page.getByTestId('composer').fill(answer);
      await page.getByTestId('send').click();
      const sent = page.getByTestId('message').filter({ hasText: answer });
      await sent.getByTestId('message-mark').waitFor();
      // The contractor's phone shows the answer but no way to mark it.
      await phone.page.goto(`/tickets/${ticket.id}`);
      await phone.page.getByTestId('message').filter({ hasText: answer }).waitFor();
      expect(await phone.page.getByTestId('message-mark').count()).toBe(0);

      // Mark it as the answer, then resolve with a summary.
      await sent.getByTestId('message-mark').click();
      await expect.poll(() => sent.getByTestId('message-mark').getAttribute('aria-pressed')).toBe('true');
      await page.getByTestId('workspace-resolve').click();
      await page.getByTestId('resolution-summary').fill('Raised the low-fire manifold pressure to spec.');
      await page.getByTestId('resolve-form').getByRole('button', { name: 'Resolve ticket' }).click();
      await page.getByTestId('resolve-form').waitFor({ state: 'hidden' });

      // Write it up: the marked message comes ticked.
      await page.getByTestId('workspace-write-up').click();
      const form = page.getByTestId('write-up-form');
      const choice = form.getByTestId('write-up-message').filter({ hasText: answer });
      await choice.waitFor();
      expect(await choice.locator('input[type=checkbox]').isChecked()).toBe(true);
      expect(await form.getByTestId('write-up-message').count()).toBe(1);
      await screenshot(page, 'write-up-dialog');
      await form.getByTestId('write-up-create').click();

      // The editor opens on the draft, awaiting review, with what was removed listed at the top.
      await page.waitForURL(/\/kb\/[a-z0-9-]+\/edit$/);
      slug = new URL(page.url()).pathname.split('/')[2];
      await page.getByTestId('article-status').filter({ hasText: 'Awaiting review' }).first().waitFor();
      const removed = page.getByTestId('article-removed');
      await removed.getByText(PHONE_NUMBER).waitFor();
      await removed.getByText(ADDRESS).waitFor();
      await removed.getByText('Dana', { exact: true }).waitFor();
      expect(
        await page.getByTestId('article-origin').getByRole('link', { name: ticket.number }).count(),
      ).toBe(1);
      await screenshot(page, 'write-up-editor');
    } finally {
      await desk.close();
    }

    // A specialist (not the author) finds it waiting for review and publishes it.
    const review = await newSession({ viewport: DESKTOP });
    try {
      const { page } = review;
      await signIn(page, specialist.email, specialist.password);
      await page.getByRole('navigation').getByRole('link', { name: 'Knowledge base' }).click();
      await page.getByTestId('kb-awaiting').getByRole('link', { name: title }).click();
      await page.waitForURL(`**/kb/${slug}/edit`);
      await page.getByRole('button', { name: 'Publish' }).click();
      await page.getByTestId('article-status').filter({ hasText: 'Live' }).first().waitFor();

      // Search finds it; the article says where it came from and holds none of the contact details.
      await page.getByRole('navigation').getByRole('link', { name: 'Knowledge base' }).click();
      await page.getByTestId('kb-search').fill(word);
      await page.getByTestId('kb-hits').getByRole('link', { name: title }).click();
      await page.getByRole('heading', { level: 1, name: title }).waitFor();
      await page.getByTestId('article-origin').getByText('From 1 ticket').waitFor();
      const body = (await page.getByTestId('article-body').innerText()) ?? '';
      expect(body).toContain(answer);
      expect(body).not.toContain(PHONE_NUMBER);
      expect(body).not.toContain(ADDRESS);
      expect(body).not.toContain('Dana');
      expect(body).toContain('NFPA 54/ANSI Z223.1');
    } finally {
      await review.close();
    }

    // The contractor's ticket now says what it was written up as.
    try {
      await phone.page.reload();
      await phone.page.getByTestId('written-up-as').getByRole('link', { name: title }).waitFor();
    } finally {
      await phone.close();
    }
  });
});
