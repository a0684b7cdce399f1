// Real Chromium (Debian's) driven through playwright-core. Every session gets its own fresh profile
// directory, so two sessions (say, a contractor on a phone and a desk tech) share nothing: cookies,
// storage, service workers and caches are all separate.
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inject } from 'vitest';

type LaunchOptions = NonNullable<Parameters<typeof chromium.launchPersistentContext>[1]>;

export type SessionOptions = Omit<LaunchOptions, 'executablePath' | 'headless' | 'args'>;

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1366, height: 860 };

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

const SCREENSHOTS = fileURLToPath(new URL('../e2e/screenshots/', import.meta.url));

/** The app's address from the e2e global setup (inject in a test worker, the env var elsewhere). */
export function baseUrl(): string {
  try {
    const provided = inject('baseUrl');
    if (provided) return provided;
  } catch {
    // not inside a vitest worker
  }
  const fromEnv = process.env.E2E_BASE_URL;
  if (!fromEnv) throw new Error('no base URL: run the end-to-end tests with `npm test -- --only e2e`');
  return fromEnv;
}

/** A new, independent browser session: its own profile dir (removed on close), context and page. */
export async function newSession(options: SessionOptions = {}): Promise<BrowserSession> {
  const profile = await mkdtemp(join(tmpdir(), 'lightoff-chromium-'));
  let context: BrowserContext;
  try {
    context = await chromium.launchPersistentContext(profile, {
      viewport: DESKTOP,
      locale: 'en-US',
      baseURL: baseUrl(),
      ...options,
      executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
      headless: true,
      args: CHROMIUM_ARGS,
    });
  } catch (error) {
    await rm(profile, { recursive: true, force: true });
    throw error;
  }
  const page = context.pages()[0] ?? (await context.newPage());
  let closed = false;
  return {
    context,
    page,
    async close() {
      if (closed) return;
      closed = true;
      await context.close().catch(() => undefined);
      await rm(profile, { recursive: true, force: true });
    },
  };
}

/** One session; the name the harness was first described with. */
export const launchBrowser = newSession;

/** Save a full-page screenshot as tests/e2e/screenshots/<name>.png (git-ignored) and return its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  await mkdir(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name.replace(/[^a-z0-9._-]+/gi, '-')}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}
