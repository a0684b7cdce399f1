// Proves the end-to-end harness itself: the built server answers, Chromium loads the built app, and
// two sessions are independent of each other.
import { describe, expect, inject, it } from 'vitest';
import { newSession, PHONE, screenshot } from '../support/browser';

describe('end-to-end harness', () => {
  it('When the built server runs, then the app shell loads in Chromium and /api/health answers', async () => {
    const baseUrl = inject('baseUrl');
    const session = await newSession({ viewport: PHONE });
    const uncaught: string[] = [];
    session.page.on('pageerror', (error) => uncaught.push(error.message));
    try {
      const health = await session.page.request.get(`${baseUrl}/api/health`);
      expect(health.status()).toBe(200);
      expect(health.headers()['content-type']).toMatch(/^application\/json/);
      expect(await health.json()).toMatchObject({ status: 'ok' });

      const response = await session.page.goto('/');
      expect(response?.status()).toBe(200);
      expect(await session.page.title()).toMatch(/Lightoff/);
      // The shell has mounted when Vue has rendered something into #app.
      await session.page.waitForFunction(
        () => (document.querySelector('#app')?.childElementCount ?? 0) > 0,
        undefined,
        {
          timeout: 15_000,
        },
      );
      expect(await session.page.locator('#app').count()).toBe(1);
      await screenshot(session.page, 'harness-app-shell-phone');
      expect(uncaught).toEqual([]);
    } finally {
      await session.close();
    }
  });

  it('When two sessions are open, then a cookie set in one is not seen by the other', async () => {
    const baseUrl = inject('baseUrl');
    const [contractor, tech] = await Promise.all([newSession({ viewport: PHONE }), newSession()]);
    try {
      await contractor.context.addCookies([{ name: 'harness_probe', value: 'contractor', url: baseUrl }]);
      expect((await contractor.context.cookies(baseUrl)).map((c) => c.name)).toContain('harness_probe');
      expect((await tech.context.cookies(baseUrl)).map((c) => c.name)).not.toContain('harness_probe');
    } finally {
      await Promise.all([contractor.close(), tech.close()]);
    }
  });
});
