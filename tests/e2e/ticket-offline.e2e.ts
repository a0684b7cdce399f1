// A contractor in a basement with no signal writes to the desk; the message waits on the phone and
// reaches the tech once, when the phone is back online.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser } from '../support/fixtures';
import { openTicket, signIn } from './helpers';

describe('ticket chat offline', () => {
  afterAll(() => closeTestDb());

  it('When the contractor writes while offline, then it shows as waiting, and the tech gets it exactly once when the phone is back online', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id });
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Rowan Fielding' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Sam Okafor' });
    const text = `Pressure reads 3.5 in. w.c. at the outlet ${Date.now()}`;

    const desk = await newSession({ viewport: DESKTOP });
    const phone = await newSession({ viewport: PHONE });
    try {
      const { page } = phone;
      await signIn(page, contractor.email, contractor.password);
      const ticketId = await openTicket(page, 'No ignition after board swap');
      await page.goto(`/tickets/${ticketId}`);
      await page.getByTestId('composer').waitFor();
      await page.locator('main[data-live="up"]').waitFor();

      await signIn(desk.page, tech.email, tech.password);
      await desk.page.goto(`/tickets/${ticketId}`);
      await desk.page.getByTestId('composer').waitFor();
      await desk.page.locator('main[data-live="up"]').waitFor();

      await phone.context.setOffline(true);
      await page.getByTestId('composer-offline').waitFor();
      await page.getByTestId('composer').fill(text);
      await page.getByTestId('send').click();

      const mine = page.getByTestId('message').filter({ hasText: text });
      await mine.getByText('Waiting to send').waitFor();
      expect(await page.getByTestId('composer').inputValue()).toBe('');
      // Kept in the browser with its clientId, so a reload does not lose it.
      const kept = await page.evaluate(() =>
        Object.entries(localStorage)
          .filter(([key]) => key.startsWith('lightoff.outbox.'))
          .flatMap(([, value]) => JSON.parse(value) as { clientId: string; body: string }[]),
      );
      expect(kept).toHaveLength(1);
      expect(kept[0]).toMatchObject({ body: text });
      expect(kept[0]!.clientId.length).toBeGreaterThanOrEqual(8);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );
      await screenshot(page, 'ticket-waiting-to-send-phone');
      expect(await desk.page.getByText(text).count()).toBe(0);

      await phone.context.setOffline(false);
      await desk.page.getByTestId('message').filter({ hasText: text }).waitFor({ timeout: 20_000 });
      await mine.getByText('Waiting to send').waitFor({ state: 'detached', timeout: 20_000 });
      await page.getByTestId('composer-offline').waitFor({ state: 'detached', timeout: 20_000 });

      // Let any second try (socket reconnect, "online" event) land before counting.
      await desk.page.waitForTimeout(2000);
      expect(await desk.page.getByTestId('message').filter({ hasText: text }).count()).toBe(1);
      expect(await page.getByTestId('message').filter({ hasText: text }).count()).toBe(1);
      expect(
        await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('lightoff.outbox.'))),
      ).toEqual([]);

      const res = await desk.page.request.get(`/api/tickets/${ticketId}/messages`);
      expect(res.status()).toBe(200);
      const { items } = (await res.json()) as { items: { body: string; clientId: string }[] };
      const rows = items.filter((m) => m.body === text);
      expect(rows).toHaveLength(1);
      expect(rows[0]!.clientId).toBe(kept[0]!.clientId);
    } finally {
      await desk.close();
      await phone.close();
    }
  });
});
