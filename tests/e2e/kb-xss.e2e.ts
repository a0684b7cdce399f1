// Hostile article text, saved and published through the API, then opened in Chromium on the article
// page and in the editor's preview: no payload may run, and the harmless text must still be there.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DESKTOP, newSession, screenshot, type BrowserSession } from '../support/browser';
import { closeTestDb, makeUser, unique } from '../support/fixtures';
import {
  ALLOWED_ATTRIBUTES,
  ALLOWED_TAGS,
  FLAG,
  HOSTILE_BODY,
  HOSTILE_MARKDOWN,
  HOSTILE_SUMMARY,
  HOSTILE_TITLE,
  MARKER_PATH,
} from '../support/hostile-markdown';
import { csrfToken, signIn } from './helpers';

interface Watch {
  dialogs: string[];
  markerRequests: string[];
}

let session: BrowserSession;
let page: Page;
const watch: Watch = { dialogs: [], markerRequests: [] };

beforeAll(async () => {
  session = await newSession({ viewport: DESKTOP });
  page = session.page;
  // Whatever a payload would do shows up here: a dialog, a request for the marker, a blocked script.
  page.on('dialog', (dialog) => {
    watch.dialogs.push(dialog.message());
    void dialog.dismiss();
  });
  session.context.on('request', (req) => {
    if (req.url().includes(MARKER_PATH)) watch.markerRequests.push(req.url());
  });
  await session.context.addInitScript(() => {
    const w = window as unknown as { __cspViolations: string[] };
    w.__cspViolations = [];
    document.addEventListener('securitypolicyviolation', (e) => {
      // zod probes once whether it may compile parsers with new Function; the policy says no, and
      // zod carries on without. Only our own code can ask for eval, so it is no sign of a payload.
      if (e.blockedURI === 'eval') return;
      w.__cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`);
    });
  });
  const admin = await makeUser({ role: 'admin', name: 'Ada Keeper' });
  await signIn(page, admin.email, admin.password);
});

afterAll(async () => {
  await session?.close();
  await closeTestDb();
});

/** An article written and published through the API by the signed-in admin. */
async function publish(title: string, summary: string, body: string): Promise<string> {
  const headers = { 'X-CSRF-Token': await csrfToken(page) };
  const created = await page.request.post('/api/articles', {
    headers,
    data: { title, summary, body, kind: 'troubleshooting', audience: 'contractor' },
  });
  if (created.status() !== 201) throw new Error(`create failed: ${created.status()} ${await created.text()}`);
  const { article } = (await created.json()) as { article: { id: number; slug: string } };
  const published = await page.request.post(`/api/articles/${article.id}/publish`, { headers });
  if (published.status() !== 200) throw new Error(`publish failed: ${published.status()}`);
  return article.slug;
}

/**
 * What is inside the rendered article that the renderer never makes: other tags, handlers, links
 * that are not web or mail addresses, images that are not article images. Read from the live DOM.
 */
async function auditBody(): Promise<string[]> {
  return page.getByTestId('article-body').evaluate(
    (root, { tags, attributes }) => {
      const found: string[] = [];
      for (const el of Array.from(root.querySelectorAll('*'))) {
        const tag = el.tagName.toLowerCase();
        // The reader's page adds a tick box to each step.
        if (tag === 'input' && el.classList.contains('kb-step-check')) continue;
        if (!tags.includes(tag)) found.push(`<${tag}>`);
        for (const attr of Array.from(el.attributes)) {
          if (!(attributes[tag] ?? []).includes(attr.name)) found.push(`<${tag} ${attr.name}>`);
        }
        if (el instanceof HTMLAnchorElement && el.hasAttribute('href')) {
          if (!['http:', 'https:', 'mailto:'].includes(el.protocol)) found.push(`<a href=${el.href}>`);
        }
        if (el instanceof HTMLImageElement) {
          const src = new URL(el.src);
          if (src.origin !== location.origin || !/^\/api\/articles\/\d+\/images\/\d+$/.test(src.pathname))
            found.push(`<img src=${el.src}>`);
        }
      }
      return found;
    },
    { tags: [...ALLOWED_TAGS], attributes: ALLOWED_ATTRIBUTES },
  );
}

/** Hover everything in the body, so handlers that wait for a pointer get their chance. */
async function poke(): Promise<void> {
  const targets = page.getByTestId('article-body').locator('a, div, p, li, td, span, strong, em');
  const n = Math.min(await targets.count(), 200);
  for (let i = 0; i < n; i++) {
    await targets
      .nth(i)
      .hover({ timeout: 300 })
      .catch(() => undefined);
  }
}

async function nothingRan(where: string): Promise<void> {
  await page.waitForTimeout(150);
  const state = await page.evaluate((flag) => {
    const w = window as unknown as Record<string, unknown> & { __cspViolations: string[] };
    return { flag: w[flag] ?? null, csp: w.__cspViolations };
  }, FLAG);
  expect({ where, ...state, ...watch }).toEqual({
    where,
    flag: null,
    // A script the sanitizer let through but the browser blocked would be reported here.
    csp: [],
    dialogs: [],
    markerRequests: [],
  });
}

describe('hostile Markdown in the browser', () => {
  it('When each hostile article is opened, then no payload runs, the HTML is only the renderer’s own, and the harmless text is shown', async () => {
    const articles: { name: string; visible: string; slug: string }[] = [];
    for (const entry of HOSTILE_MARKDOWN) {
      const slug = await publish(
        `Hostile ${entry.name} ${unique()}`,
        'Text that tries to run in the reader’s browser.',
        entry.markdown,
      );
      articles.push({ name: entry.name, visible: entry.visible, slug });
    }
    for (const article of articles) {
      await page.goto(`/kb/${article.slug}`);
      const body = page.getByTestId('article-body');
      await body.waitFor();
      expect(await body.innerText(), article.name).toContain(article.visible);
      expect(await auditBody(), article.name).toEqual([]);
      await poke();
      await nothingRan(article.name);
    }
  }, 240_000);

  it('When one article holds every payload, a hostile title and summary, then neither the article page nor the editor preview runs any of it', async () => {
    const slug = await publish(HOSTILE_TITLE, HOSTILE_SUMMARY, HOSTILE_BODY);

    await page.goto(`/kb/${slug}`);
    // The title is shown as text, angle brackets and all.
    await page.getByRole('heading', { level: 1, name: HOSTILE_TITLE }).waitFor();
    const body = page.getByTestId('article-body');
    const text = await body.innerText();
    for (const entry of HOSTILE_MARKDOWN) expect(text).toContain(entry.visible);
    expect(await auditBody()).toEqual([]);
    await poke();
    await screenshot(page, 'kb-xss-article');
    await nothingRan('article page');

    await page.goto(`/kb/${slug}/edit`);
    await page.getByRole('heading', { level: 1, name: 'Edit article' }).waitFor();
    await page.getByTestId('article-body').waitFor();
    const preview = await page.getByTestId('article-body').innerText();
    for (const entry of HOSTILE_MARKDOWN) expect(preview).toContain(entry.visible);
    expect(await auditBody()).toEqual([]);
    // The editor shows the raw text as text.
    await expect.poll(() => page.locator('.cm-content').innerText()).toContain('<script>');
    await poke();
    await screenshot(page, 'kb-xss-editor');
    await nothingRan('editor preview');

    // The knowledge-base home lists it by its hostile title, as text.
    await page.goto('/kb');
    await page.getByRole('heading', { name: 'Recently updated' }).waitFor();
    await page.getByRole('link', { name: HOSTILE_TITLE }).first().waitFor();
    await nothingRan('knowledge-base home');
  }, 120_000);
});
