// A contractor asks the desk from a phone; the tech watching the open-tickets board sees it arrive live.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser } from '../support/fixtures';
import { signIn } from './helpers';

describe('ticket flow', () => {
  afterAll(() => closeTestDb());

  it('When a contractor opens a ticket, then the tech’s board shows it without a reload and the chat works both ways', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id });
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Rowan Fielding' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Sam Okafor' });
    const subject = `Furnace locks out ${Date.now()}`;

    const dir = await mkdtemp(join(tmpdir(), 'lightoff-plate-'));
    const platePhoto = join(dir, 'rating-plate.jpg');
    await writeFile(
      platePhoto,
      await sharp({ create: { width: 800, height: 600, channels: 3, background: '#8a9bb0' } })
        .jpeg()
        .toBuffer(),
    );

    const desk = await newSession({ viewport: DESKTOP });
    const phone = await newSession({ viewport: PHONE });
    try {
      await signIn(desk.page, tech.email, tech.password);
      await desk.page.getByRole('link', { name: 'Open tickets' }).click();
      await desk.page.getByRole('heading', { level: 1, name: 'Open tickets' }).waitFor();
      expect(await desk.page.getByText(subject).count()).toBe(0);

      const { page } = phone;
      await signIn(page, contractor.email, contractor.password);
      await page.getByRole('link', { name: 'My tickets' }).click();
      await page.getByText('You have not opened a ticket yet.').waitFor();
      await page.getByRole('link', { name: 'New ticket' }).click();

      // A missing subject is shown in place and nothing is sent.
      await page.getByRole('button', { name: 'Send to the desk' }).click();
      await page.getByText('Say in a few words what is wrong').first().waitFor();
      expect(new URL(page.url()).pathname).toBe('/tickets/new');

      await page.getByLabel('What is wrong, in a few words').fill(subject);
      await page.getByText('Job on hold', { exact: true }).click();
      await page.getByText('Natural gas', { exact: true }).click();
      await page.getByLabel('What you see and what you have tried').fill('Three tries, then hard lockout.');
      await page.getByTestId('photo-library').setInputFiles(platePhoto);
      await page.getByTestId('photo-item').getByText('Ready to upload').waitFor();
      await screenshot(page, 'ticket-new-photo-phone');
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );
      await page.getByRole('button', { name: 'Send to the desk' }).click();
      await page.waitForURL(/\/tickets\/\d+$/);
      await page.getByRole('heading', { level: 1, name: subject }).waitFor();
      // The photo from the form is the conversation's first message.
      await page.getByTestId('message').getByTestId('message-photo').locator('img').waitFor();

      // The tech's board, never reloaded, now lists it.
      const row = desk.page.getByTestId('board-row').filter({ hasText: subject });
      await row.waitFor();
      expect(await row.getByText(account.company).isVisible()).toBe(true);
      await screenshot(desk.page, 'desk-board-live');

      // The contractor writes; the tech opens the ticket, sees it, takes the ticket and answers.
      await page.getByTestId('composer').fill('Inducer runs, no ignition.');
      await page.getByTestId('send').click();
      await page.getByTestId('message').filter({ hasText: 'Inducer runs, no ignition.' }).waitFor();

      await row.getByRole('link', { name: subject }).click();
      await desk.page.getByTestId('message').filter({ hasText: 'Inducer runs, no ignition.' }).waitFor();
      await desk.page.getByTestId('claim').click();
      await desk.page.getByTestId('ticket-assignee').filter({ hasText: 'Sam Okafor' }).waitFor();
      await desk.page.getByTestId('composer').fill('Check the flame sensor first.');
      await desk.page.getByTestId('send').click();

      await page.getByTestId('message').filter({ hasText: 'Check the flame sensor first.' }).waitFor();
      await screenshot(page, 'ticket-chat-phone');
    } finally {
      await desk.close();
      await phone.close();
      await rm(dir, { recursive: true, force: true });
    }
  });
});
