// A contractor on the job site: signing in from a phone and finding their company.
import { afterAll, describe, expect, it } from 'vitest';
import { newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeUser } from '../support/fixtures';
import { signIn } from './helpers';

describe('contractor home on a phone', () => {
  afterAll(() => closeTestDb());

  it('When a contractor signs in on a phone-sized screen (390×844), then they see their company', async () => {
    const account = await makeAccount();
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Rowan Fielding' });
    const session = await newSession({ viewport: { width: 390, height: 844 } });
    try {
      const { page } = session;
      await signIn(page, contractor.email, contractor.password);

      await page.getByRole('heading', { level: 1, name: account.company }).waitFor();
      expect(await page.getByText(account.accountNumber, { exact: true }).isVisible()).toBe(true);
      expect(new URL(page.url()).pathname).toBe('/company');
      // Nothing sticks out sideways on a phone.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await screenshot(page, 'contractor-home-phone');

      // Their own name in the bar leads to their password and e-mail choices.
      await page.getByRole('link', { name: /Rowan Fielding/ }).click();
      await page.getByRole('heading', { level: 1, name: 'Change password' }).waitFor();
      await page.getByText('E-mails from Lightoff').waitFor();
    } finally {
      await session.close();
    }
  });
});
