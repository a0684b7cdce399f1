import type { Page } from 'playwright-core';

/** Sign in through the sign-in form, and wait until the app has moved on from it. */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  if (!new URL(page.url(), 'http://x').pathname.startsWith('/sign-in')) await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** The session's CSRF token, for calls made straight to the API from the page's browser context. */
export async function csrfToken(page: Page): Promise<string> {
  const res = await page.request.get('/api/auth/csrf');
  return ((await res.json()) as { token: string }).token;
}

/** Open a ticket through the API as the signed-in contractor; resolves with its id. */
export async function openTicket(page: Page, subject: string): Promise<number> {
  const res = await page.request.post('/api/tickets', {
    headers: { 'X-CSRF-Token': await csrfToken(page) },
    data: { subject, description: 'Igniter glows, then nothing.', fuel: 'natural-gas', urgency: 'job-held' },
  });
  if (res.status() !== 201) throw new Error(`ticket create failed: ${res.status()} ${await res.text()}`);
  return ((await res.json()) as { ticket: { id: number } }).ticket.id;
}
