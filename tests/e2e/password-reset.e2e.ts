// "Forgot your password?" in real Chromium: from the sign-in page to the e-mail in the run's mail
// sink, through the link to a new password, and signed in with it.
import { afterAll, describe, expect, it } from 'vitest';
import { PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeUser } from '../support/fixtures';
import { linkToken, waitForMails } from '../support/mailbox';
import { signIn } from './helpers';

const NEW_PASSWORD = 'Orchard-kettle-lantern-27';

describe('password reset', () => {
  afterAll(() => closeTestDb());

  it('When a contractor forgets their password, then the e-mailed link sets a new one that signs them in', async () => {
    const user = await makeUser({ name: 'Rory Forgetful' });
    const session = await newSession({ viewport: PHONE, isMobile: true, hasTouch: true });
    try {
      const { page } = session;
      await page.goto('/sign-in');
      await page.getByRole('link', { name: 'Forgot your password?' }).click();
      await page.getByRole('heading', { level: 1, name: 'Forgot your password?' }).waitFor();
      await page.getByLabel('E-mail').fill(user.email);
      await page.getByRole('button', { name: 'Send me a link' }).click();
      await page.getByText('Check your e-mail').waitFor();

      const [mail] = await waitForMails(user.email);
      const token = linkToken(mail!, 'reset');
      await page.goto(`/reset/${token}`);
      await page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();
      await page.getByText(`For the sign-in ${user.email}`).waitFor();
      await page.getByLabel('New password', { exact: true }).fill(NEW_PASSWORD);
      await page.getByLabel('Password again', { exact: true }).fill(NEW_PASSWORD);
      await screenshot(page, 'password-reset-form');
      await page.getByRole('button', { name: 'Set new password' }).click();
      await page.getByText('Your new password is set').waitFor();

      await signIn(page, user.email, NEW_PASSWORD);
      expect(new URL(page.url()).pathname).toBe('/company');

      // The link worked once; opening it again says so and offers a new one.
      await page.goto(`/reset/${token}`);
      await page.getByText('This reset link has already been used').waitFor();
      expect(await page.getByRole('link', { name: 'Ask for a new link' }).isVisible()).toBe(true);
    } finally {
      await session.close();
    }
  });
});
