// Joining by invitation in real Chromium: the admin invites a desk tech from the people page, the
// e-mail arrives in the run's mail sink, the newcomer opens its link, chooses a name and password,
// lands signed in, and can sign out and in again. An account owner's teammate does the same on a phone.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DESKTOP, PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser, unique } from '../support/fixtures';
import { linkToken, waitForMails } from '../support/mailbox';
import { signIn } from './helpers';

const PASSWORD = 'Lantern-copper-ridge-62';

/** Opens the e-mailed link, fills the join form, and waits to land on the home page. */
async function join(
  page: Page,
  token: string,
  name: string,
  expected: { heading: string; invitedBy: string },
) {
  await page.goto(`/join/${token}`);
  await page.getByRole('heading', { level: 1, name: 'Join Lightoff' }).waitFor();
  await page.getByText(expected.invitedBy).waitFor();

  // The rule is shown before anything is typed; a common password gets the server's reason.
  await page.getByText('not a common or easily guessed password').first().waitFor();
  await page.getByLabel('Your full name').fill(name);
  await page.getByLabel('Choose a password', { exact: true }).fill('password1234');
  await page.getByLabel('Password again', { exact: true }).fill('password1234');
  await page.getByRole('button', { name: 'Join and sign in' }).click();
  await page.getByText(/too easy to guess/).waitFor();
  await screenshot(page, `invitation-join-form-${expected.heading === 'Desk' ? 'staff' : 'teammate'}`);

  await page.getByLabel('Choose a password', { exact: true }).fill(PASSWORD);
  await page.getByLabel('Password again', { exact: true }).fill(PASSWORD);
  await page.getByRole('button', { name: 'Join and sign in' }).click();
  await page.getByRole('heading', { level: 1, name: expected.heading }).waitFor();
}

async function signOutAndIn(page: Page, email: string, heading: string) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
  await signIn(page, email, PASSWORD);
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
}

describe('joining by invitation', () => {
  afterAll(() => closeTestDb());

  it('When the admin invites a desk tech, then the tech joins from the e-mailed link and can sign in again', async () => {
    const admin = await makeUser({ role: 'admin', name: 'Avery Admin' });
    const branch = await makeBranch({ name: `Millbrook ${unique('')}` });
    const email = `${unique('newtech')}@test.example`;

    const desk = await newSession({ viewport: DESKTOP });
    try {
      const { page } = desk;
      await signIn(page, admin.email, admin.password);
      await page.getByRole('navigation').getByRole('link', { name: 'People' }).click();
      await page.getByRole('heading', { level: 1, name: 'People' }).waitFor();

      await page.getByRole('button', { name: 'Invite staff by e-mail' }).click();
      const dialog = page.getByRole('dialog', { name: 'Invite a staff member' });
      await dialog.waitFor();
      await dialog.getByLabel('Their e-mail').fill(email);
      // The multi-select opens from its placeholder (the input inside takes no clicks until then).
      await dialog.getByText('Choose one or more branches').click();
      await page.getByRole('option', { name: new RegExp(branch.name) }).click();
      // Close the option list by clicking the dialog's text (Escape would close the dialog).
      await dialog.getByText('They get an e-mail').click();
      await dialog.getByRole('button', { name: 'Send invitation' }).click();
      await dialog.waitFor({ state: 'hidden' });
      await page.getByText(email, { exact: true }).waitFor();
      await screenshot(page, 'invitation-admin-sent');
    } finally {
      await desk.close();
    }

    const [mail] = await waitForMails(email);
    expect(mail!.subject).toBe('Avery Admin invited you to Lightoff');
    const token = linkToken(mail!, 'join');

    const newcomer = await newSession({ viewport: DESKTOP });
    try {
      const { page } = newcomer;
      await join(page, token, 'Tam Newcomer', { heading: 'Desk', invitedBy: 'Avery Admin invited you' });
      await screenshot(page, 'invitation-joined-desk');
      await signOutAndIn(page, email, 'Desk');

      // The link was used up: opening it again says so.
      await page.goto(`/join/${token}`);
      await page.getByText('This invitation has already been used').waitFor();
    } finally {
      await newcomer.close();
    }
  });

  it("When an account owner invites a teammate from the company page, then the teammate joins that company's account", async () => {
    const account = await makeAccount({ company: `Copperline Heating ${unique('')}` });
    const owner = await makeUser({ accountId: account.id, isAccountOwner: true, name: 'Olive Owner' });
    const email = `${unique('mate')}@test.example`;

    const phone = await newSession({ viewport: PHONE, isMobile: true, hasTouch: true });
    try {
      const { page } = phone;
      await signIn(page, owner.email, owner.password);
      await page.getByRole('heading', { level: 1, name: account.company }).waitFor();
      await page.getByRole('button', { name: 'Invite a teammate' }).click();
      const dialog = page.getByRole('dialog', { name: 'Invite a teammate' });
      await dialog.waitFor();
      await dialog.getByLabel('Their e-mail').fill(email);
      await dialog.getByRole('button', { name: 'Send invitation' }).click();
      await dialog.waitFor({ state: 'hidden' });
      await page.getByText(email, { exact: true }).waitFor();
      await screenshot(page, 'invitation-owner-sent');
    } finally {
      await phone.close();
    }

    const token = linkToken((await waitForMails(email))[0]!, 'join');
    const teammate = await newSession({ viewport: PHONE, isMobile: true, hasTouch: true });
    try {
      const { page } = teammate;
      await join(page, token, 'Mae Teammate', {
        heading: account.company,
        invitedBy: `Olive Owner invited you to join ${account.company}`,
      });
      await signOutAndIn(page, email, account.company);
    } finally {
      await teammate.close();
    }
  });
});
