// A desk tech works a contractor's ticket from the workspace beside the chat, and narrows the board.
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser, unique } from '../support/fixtures';
import type { Snippet, Ticket } from '../../shared/src/index';
import { signIn } from './helpers';

const DESK = { width: 1280, height: 800 };

/** A call to the API as the browser session's user (its cookies, a fresh CSRF token). */
async function api<T>(context: BrowserContext, method: 'POST' | 'PATCH', path: string, data: object) {
  const { token } = (await (await context.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await context.request.fetch(path, { method, data, headers: { 'X-CSRF-Token': token } });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

const openTicket = (context: BrowserContext, body: Record<string, unknown>) =>
  api<{ ticket: Ticket }>(context, 'POST', '/api/tickets', {
    description: 'Igniter glows, burners light, then it shuts off.',
    fuel: 'natural-gas',
    urgency: 'job-held',
    ...body,
  }).then((r) => r.ticket);

/** Choose an option of an Element Plus select by the select's test id and the option's text. */
async function choose(page: Page, testId: string, option: string): Promise<void> {
  await page.getByTestId(testId).click();
  await page.getByRole('option', { name: option, exact: true }).click();
}

describe('desk workspace', () => {
  afterAll(() => closeTestDb());

  it('When a tech answers with a shared snippet and resolves, then the summary is required and the contractor sees it solved live', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id, company: `Keane Heating ${unique('')}` });
    const contractor = await makeUser({ accountId: account.id, name: 'Rowan Fielding' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Sam Okafor' });
    const word = unique('sensor');

    const desk = await newSession({ viewport: DESK });
    const phone = await newSession({ viewport: PHONE });
    try {
      await signIn(phone.page, contractor.email, contractor.password);
      const ticket = await openTicket(phone.context, {
        subject: `Furnace locks out ${word}`,
        modelText: 'CV-T96 test',
        serial: 'SN-40417',
        urgency: 'emergency',
      });
      await phone.page.goto(`/tickets/${ticket.id}`);
      await phone.page.getByRole('heading', { level: 1, name: ticket.subject }).waitFor();

      await signIn(desk.page, tech.email, tech.password);
      const body = `Clean the flame sensor rod (${word}) and check the ground.`;
      await api<{ snippet: Snippet }>(desk.context, 'POST', '/api/snippets', {
        title: `Flame sensor ${word}`,
        body,
        shared: true,
      });
      const { page } = desk;
      await page.goto(`/tickets/${ticket.id}`);
      const workspace = page.getByTestId('ticket-workspace');
      await workspace.waitFor();

      // The job's details, and the gas caution once, in full.
      const details = page.getByTestId('workspace-details');
      expect(await details.getByText('CV-T96 test').isVisible()).toBe(true);
      expect(await details.getByText('SN-40417').isVisible()).toBe(true);
      expect(await details.getByText(account.company).isVisible()).toBe(true);
      expect(
        await page
          .getByTestId('workspace-gas-caution')
          .getByText(/NFPA 54\/ANSI Z223\.1/)
          .isVisible(),
      ).toBe(true);
      expect(await page.getByRole('note').count()).toBe(1);
      // The tech is online at the branch desk.
      await page.getByTestId('presence-entry').filter({ hasText: 'Sam Okafor' }).waitFor();

      // Find the shared snippet, insert it into the message and send it.
      await page.getByTestId('snippet-search').fill(word);
      const snippet = page.getByTestId('snippet').filter({ hasText: `Flame sensor ${word}` });
      await snippet.waitFor();
      expect(await page.getByTestId('snippet').count()).toBe(1);
      await screenshot(page, 'desk-workspace-ticket');
      await snippet.getByTestId('snippet-insert').click();
      expect(await page.getByTestId('composer').inputValue()).toBe(body);
      await page.getByTestId('send').click();
      await phone.page.getByTestId('message').filter({ hasText: body }).waitFor();

      // Resolving without a summary: the server's words, in place; with one: resolved.
      await page.getByTestId('workspace-resolve').click();
      const form = page.getByTestId('resolve-form');
      await form.getByRole('button', { name: 'Resolve ticket' }).click();
      await form.getByText('Say how it was solved before resolving').waitFor();
      expect(await page.getByTestId('ticket-status').first().textContent()).not.toContain('Solved');
      await page.getByTestId('resolution-summary').fill('Flame rod was dirty; cleaned it.');
      await form.getByRole('button', { name: 'Resolve ticket' }).click();
      await form.waitFor({ state: 'hidden' });
      await page.getByTestId('ticket-status').filter({ hasText: 'Solved' }).first().waitFor();

      // The contractor's page, never reloaded, shows it solved.
      await phone.page.getByTestId('ticket-status').filter({ hasText: 'Solved' }).waitFor();
    } finally {
      await desk.close();
      await phone.close();
    }
  });

  it('When the tech filters the board by urgency and searches a ticket number, then only that ticket is left, after a reload too', async () => {
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id });
    const contractor = await makeUser({ accountId: account.id });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id] });
    const tag = unique('board');

    const desk = await newSession({ viewport: DESK });
    const phone = await newSession({ viewport: PHONE });
    try {
      await signIn(phone.page, contractor.email, contractor.password);
      const first = await openTicket(phone.context, { subject: `No heat ${tag} one`, urgency: 'emergency' });
      await openTicket(phone.context, { subject: `Job held ${tag}`, urgency: 'job-held' });
      const second = await openTicket(phone.context, { subject: `No heat ${tag} two`, urgency: 'emergency' });

      const { page } = desk;
      await signIn(page, tech.email, tech.password);
      await page.goto('/desk/board');
      const rows = page.getByTestId('board-row');
      await rows.filter({ hasText: `Job held ${tag}` }).waitFor();
      expect(await rows.count()).toBe(3);

      await choose(page, 'board-urgency', 'No heat / no cooling');
      await page.waitForURL(/urgency=emergency/);
      await rows.filter({ hasText: `Job held ${tag}` }).waitFor({ state: 'detached' });
      await expect.poll(() => rows.count()).toBe(2);

      await page.getByTestId('board-search').fill(second.number);
      await page.waitForURL((url) => url.searchParams.get('q') === second.number);
      await rows.filter({ hasText: first.subject }).waitFor({ state: 'detached' });
      expect(await rows.allTextContents()).toEqual([expect.stringContaining(second.subject)]);

      await page.reload();
      await rows.filter({ hasText: second.subject }).waitFor();
      expect(await rows.count()).toBe(1);
      expect(await page.getByTestId('board-search').inputValue()).toBe(second.number);
      await screenshot(page, 'desk-board-filters');

      // Still live: with only the urgency filter left, a new emergency appears and a question does not.
      await page.getByTestId('board-search').fill('');
      await page.waitForURL((url) => !url.searchParams.has('q'));
      await rows.filter({ hasText: first.subject }).waitFor();
      await openTicket(phone.context, { subject: `Question ${tag}`, urgency: 'question' });
      const third = await openTicket(phone.context, {
        subject: `No heat ${tag} three`,
        urgency: 'emergency',
      });
      await rows.filter({ hasText: third.subject }).waitFor();
      await expect.poll(() => rows.count()).toBe(3);
      expect(await rows.filter({ hasText: `Question ${tag}` }).count()).toBe(0);

      // A ticket that is solved leaves the board.
      await api(desk.context, 'PATCH', `/api/tickets/${third.id}`, {
        status: 'resolved',
        resolutionSummary: 'Answered by phone.',
      });
      await rows.filter({ hasText: third.subject }).waitFor({ state: 'detached' });
    } finally {
      await desk.close();
      await phone.close();
    }
  });
});
