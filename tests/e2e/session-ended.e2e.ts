// When the desk manager turns off someone's sign-in, their open page must not carry on as if nothing happened.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, newSession, PHONE } from '../support/browser';
import { closeTestDb, makeAccount, makeUser } from '../support/fixtures';
import { signIn } from './helpers';

describe('a session ended by the desk', () => {
  afterAll(() => closeTestDb());

  it("When the admin turns off a contractor's sign-in, then the contractor's open page goes to sign-in and says why", async () => {
    const admin = await makeUser({ role: 'admin', name: 'Avery Admin' });
    const account = await makeAccount();
    const contractor = await makeUser({ role: 'contractor', accountId: account.id, name: 'Casey Offline' });
    const [phone, desk] = await Promise.all([
      newSession({ viewport: PHONE }),
      newSession({ viewport: DESKTOP }),
    ]);
    try {
      await signIn(phone.page, contractor.email, contractor.password);
      await phone.page.getByRole('heading', { level: 1, name: account.company }).waitFor();
      await phone.page.locator('main[data-live="up"]').waitFor();

      await signIn(desk.page, admin.email, admin.password);
      await desk.page.getByRole('navigation').getByRole('link', { name: 'People' }).click();
      await desk.page.getByLabel('Search').fill(contractor.email);
      await desk.page.getByRole('button', { name: 'Edit Casey Offline' }).click();
      const dialog = desk.page.getByRole('dialog', { name: 'Edit Casey Offline' });
      await dialog.getByRole('switch', { name: 'Can sign in' }).focus();
      await desk.page.keyboard.press('Space');
      await dialog.getByRole('button', { name: 'Save changes' }).click();
      await desk.page
        .getByRole('dialog', { name: 'Turn off sign-in?' })
        .getByRole('button', { name: 'Turn off sign-in' })
        .click();
      await dialog.waitFor({ state: 'hidden' });

      await phone.page.waitForURL((url) => url.pathname === '/sign-in');
      await phone.page.getByText('Your access was turned off').waitFor();
      expect(new URL(phone.page.url()).searchParams.get('redirect')).toBe('/company');
      // And it really is off: signing in again is refused.
      await phone.page.getByLabel('E-mail').fill(contractor.email);
      await phone.page.getByLabel('Password', { exact: true }).fill(contractor.password);
      await phone.page.getByRole('button', { name: 'Sign in' }).click();
      await phone.page.getByRole('alert').waitFor();
      expect(new URL(phone.page.url()).pathname).toBe('/sign-in');
    } finally {
      await Promise.all([phone.close(), desk.close()]);
    }
  });
});
