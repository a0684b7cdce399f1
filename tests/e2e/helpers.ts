import type { Page } from 'playwright-core';

/** Sign in through the sign-in form, and wait until the app has moved on from it. */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  if (!new URL(page.url(), 'http://x').pathname.startsWith('/sign-in')) await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
