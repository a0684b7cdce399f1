// Readings from the job: the contractor's phone posts a manifold reading, its check result lands in
// the chat as a card for both sides, and the tech runs it again with a changed value.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeUser } from '../support/fixtures';
import { openTicket, signIn } from './helpers';

const GAS_CAUTION_START = 'Gas work is for qualified, licensed technicians only.';
const card = (page: Page, verdict: string) =>
  page.locator(`[data-testid="reading-card"][data-verdict="${verdict}"]`);

describe('ticket readings', () => {
  afterAll(() => closeTestDb());

  it('When a contractor posts a 4.2 in. w.c. high-fire manifold reading on a natural-gas ticket, then both see a "High" card live', async () => {
    const account = await makeAccount();
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Rowan Fielding' });
    const tech = await makeUser({ role: 'tech', branchIds: [account.homeBranchId], name: 'Sam Okafor' });
    const phone = await newSession({ viewport: PHONE });
    const desk = await newSession({ viewport: DESKTOP });
    try {
      const { page } = phone;
      await signIn(page, contractor.email, contractor.password);
      const ticketId = await openTicket(page, `Burner rumbles on high fire ${Date.now()}`);

      await signIn(desk.page, tech.email, tech.password);
      await desk.page.goto(`/tickets/${ticketId}`);
      await desk.page.getByRole('heading', { level: 2, name: 'Readings on the job' }).waitFor();
      await desk.page.getByText('No readings yet.').waitFor();

      await page.goto(`/tickets/${ticketId}`);
      await page.getByTestId('reading-add').click();
      expect(await page.getByTestId('reading-gas-caution').textContent()).toContain(GAS_CAUTION_START);

      // Not a number: said in place, nothing posted.
      const high = page.getByLabel('Manifold, high fire');
      await high.fill('4,2x');
      await page.getByTestId('reading-post').click();
      await page.getByText('Enter a number, such as 3.5').waitFor();
      expect(await page.getByTestId('reading-card').count()).toBe(0);

      // Big inputs for gloved thumbs, and nothing wider than the phone.
      const box = await high.boundingBox();
      expect(box?.height ?? 0).toBeGreaterThanOrEqual(44);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );

      // Natural gas, no model spec: high fire 3.5 ± 0.3 in. w.c. (TYPICAL_SPEC, common practice (no source)).
      await high.fill('4.2');
      await page.getByTestId('reading-post').click();
      const mine = card(page, 'high');
      await mine.waitFor();
      const item = mine.locator('[data-item="manifold-high"]');
      expect(await item.getByText('4.2 in. w.c.').isVisible()).toBe(true);
      expect(await item.getByText('High', { exact: true }).isVisible()).toBe(true);
      expect(
        await item.getByText('Target 3.5 in. w.c. (range 3.2 in. w.c. – 3.8 in. w.c.)').isVisible(),
      ).toBe(true);
      expect(await item.textContent()).toContain('lower it');
      expect(await mine.getByText(GAS_CAUTION_START).isVisible()).toBe(true);
      await page.locator('[data-testid="reading-row"][data-verdict="high"]').waitFor();
      await mine.scrollIntoViewIfNeeded();
      await screenshot(page, 'ticket-reading-card-phone');
      expect(await page.getByTestId('reading-again').count()).toBe(0);

      // The tech's page, never reloaded, shows the same card and the reading in its list.
      const theirs = card(desk.page, 'high');
      await theirs.waitFor();
      expect(await theirs.locator('[data-item="manifold-high"]').getByText('4.2 in. w.c.').isVisible()).toBe(
        true,
      );
      await desk.page.locator('[data-testid="reading-row"][data-verdict="high"]').waitFor();

      // Staff run it again with the value changed: the form comes back filled in, the new card says OK.
      await desk.page.getByTestId('reading-again').click();
      const again = desk.page.getByLabel('Manifold, high fire');
      expect(await again.inputValue()).toBe('4.2');
      await again.fill('3.6');
      await desk.page.getByTestId('reading-post').click();
      await card(desk.page, 'ok').waitFor();
      await card(page, 'ok').waitFor();
      // The list refreshes when the reading's card arrives; give it a moment after the card shows.
      await expect.poll(() => page.getByTestId('reading-row').count(), { timeout: 10_000 }).toBe(2);
    } finally {
      await phone.close();
      await desk.close();
    }
  });
});
