// The desk manager sets up a contractor's sign-in, and the contractor can use it.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeUser, unique } from '../support/fixtures';
import { signIn } from './helpers';

describe('admin: people', () => {
  afterAll(() => closeTestDb());

  it('When the admin creates a contractor user, then that user can sign in', async () => {
    const admin = await makeUser({ role: 'admin', name: 'Avery Admin' });
    const account = await makeAccount({ company: `Copperline Heating ${unique('')}` });
    const newcomer = {
      name: 'Jordan Newcomer',
      email: `${unique('new')}@test.example`,
      password: 'Fresh-start-2026',
    };

    const session = await newSession({ viewport: DESKTOP });
    try {
      const { page } = session;
      await signIn(page, admin.email, admin.password);
      await page.getByRole('navigation').getByRole('link', { name: 'People' }).click();
      await page.getByRole('heading', { level: 1, name: 'People' }).waitFor();

      await page.getByRole('button', { name: 'New person' }).first().click();
      const dialog = page.getByRole('dialog', { name: 'New person' });
      await dialog.waitFor();
      await dialog.getByLabel('Full name').fill(newcomer.name);
      await dialog.getByLabel('E-mail').fill(newcomer.email);
      // Role starts as Contractor; find the account by part of its name.
      await dialog.getByLabel('Contractor account').click();
      await dialog.getByLabel('Contractor account').fill(account.company.split(' ').pop()!);
      await page.getByRole('option', { name: new RegExp(account.accountNumber) }).click();
      await dialog.getByLabel('First password').fill(newcomer.password);
      await dialog.getByRole('button', { name: 'Create' }).click();
      await dialog.waitFor({ state: 'hidden' });

      await page.getByText(newcomer.email, { exact: true }).waitFor();
      await screenshot(page, 'admin-people-after-create');

      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();

      await signIn(page, newcomer.email, newcomer.password);
      await page.getByRole('heading', { level: 1, name: account.company }).waitFor();
      expect(await page.getByText(account.accountNumber, { exact: true }).isVisible()).toBe(true);
      expect(await page.getByText(newcomer.name, { exact: true }).first().isVisible()).toBe(true);
    } finally {
      await session.close();
    }
  });
});
