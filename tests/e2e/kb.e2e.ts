// A specialist writes an article, another publishes it, and a contractor finds it while opening a ticket.
import { afterAll, describe, expect, it } from 'vitest';
import { DESKTOP, PHONE, baseUrl, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeBranch, makeUser, unique } from '../support/fixtures';
import { openTicket, signIn } from './helpers';

/** A word no other test's article holds, letters only so the search engine treats it as a word. */
const marker = () => `quirl${unique('').replace(/\d/g, (d) => 'abcdefghij'[Number(d)]!)}`;

describe('knowledge base', () => {
  afterAll(() => closeTestDb());

  it('When a specialist writes and submits an article and another publishes it, then a contractor is offered it on a new ticket and can say it solved it, and the desk can post it into a chat', async () => {
    const writer = await makeUser({ role: 'specialist', name: 'Wren Writer' });
    const reviewer = await makeUser({ role: 'specialist', name: 'Remy Reviewer' });
    const branch = await makeBranch();
    const account = await makeAccount({ homeBranchId: branch.id });
    const contractor = await makeUser({ accountId: account.id, name: 'Casey Contractor' });
    const tech = await makeUser({ role: 'tech', branchIds: [branch.id], name: 'Tam Deskworth' });
    const word = marker();
    const title = `Burner ${word} drops out after ignition`;

    // The writer drafts and submits it in the editor.
    const writing = await newSession({ viewport: DESKTOP });
    let slug: string;
    let ticketId: number;
    try {
      const { page } = writing;
      // The editor must work offline: nothing is fetched from anywhere but our own server.
      const elsewhere: string[] = [];
      const ours = new URL(baseUrl()).origin;
      page.on('request', (req) => {
        if (new URL(req.url()).origin !== ours) elsewhere.push(req.url());
      });
      await signIn(page, writer.email, writer.password);
      await page.getByRole('navigation').getByRole('link', { name: 'Knowledge base' }).click();
      await page.getByRole('heading', { level: 1, name: 'Knowledge base' }).waitFor();
      await page.getByRole('heading', { name: 'Recently updated' }).waitFor();
      await screenshot(page, 'kb-home');

      await page.getByRole('button', { name: 'Write an article' }).click();
      await page.getByRole('heading', { level: 1, name: 'New article' }).waitFor();
      await page.getByLabel('Title', { exact: true }).fill(title);
      await page
        .getByLabel('Summary', { exact: true })
        .fill(`What to check when the ${word} burner lights and drops out.`);
      await page.locator('.cm-content').click();
      await page.keyboard.type(`The ${word} control proves flame through the sensor rod.\n`);
      await page.getByTestId('insert-steps').click();
      await expect.poll(() => page.locator('.cm-content').innerText()).toContain('::: steps');

      // A summary too short to say anything is refused, with the server's message by the field.
      const summary = page.getByLabel('Summary', { exact: true });
      const fullSummary = await summary.inputValue();
      await summary.fill('Short');
      await page.getByRole('button', { name: 'Save draft' }).click();
      await page.getByText('Say in a sentence what it answers').waitFor();
      expect(new URL(page.url()).pathname).toBe('/kb/new');

      await summary.fill(fullSummary);
      await page.getByRole('button', { name: 'Save draft' }).click();
      await page.waitForURL(/\/kb\/[a-z0-9-]+\/edit$/);
      slug = new URL(page.url()).pathname.split('/')[2]!;
      await page.getByTestId('article-status').filter({ hasText: 'Draft' }).first().waitFor();
      // The preview is the server's rendering: the steps come back as a list with tick boxes.
      await page.getByTestId('article-body').locator('.kb-steps li input[type=checkbox]').first().waitFor();
      await screenshot(page, 'kb-editor');

      await page.getByRole('button', { name: 'Send for review' }).click();
      await page.getByTestId('article-status').filter({ hasText: 'Awaiting review' }).first().waitFor();
      // The writer may not publish their own article.
      expect(await page.getByRole('button', { name: 'Publish' }).count()).toBe(0);
      expect(elsewhere).toEqual([]);
    } finally {
      await writing.close();
    }

    // A second specialist publishes it.
    const review = await newSession({ viewport: DESKTOP });
    try {
      const { page } = review;
      await signIn(page, reviewer.email, reviewer.password);
      // The reviewer finds it among those waiting for review on the knowledge-base home.
      await page.getByRole('navigation').getByRole('link', { name: 'Knowledge base' }).click();
      await page.getByTestId('kb-awaiting').getByRole('link', { name: title }).click();
      await page.waitForURL(`**/kb/${slug}/edit`);
      await page.getByTestId('article-status').filter({ hasText: 'Awaiting review' }).first().waitFor();
      await page.getByRole('button', { name: 'Publish' }).click();
      await page.getByTestId('article-status').filter({ hasText: 'Live' }).first().waitFor();

      // Now it is found on the knowledge-base home, the matched word highlighted.
      await page.getByRole('navigation').getByRole('link', { name: 'Knowledge base' }).click();
      await page.getByTestId('kb-search').fill(`${word} ignition`);
      const hits = page.getByTestId('kb-hits');
      await hits.getByRole('link', { name: title }).waitFor();
      expect((await hits.locator('mark').allInnerTexts()).map((m) => m.toLowerCase())).toContain(word);
      await screenshot(page, 'kb-search');
    } finally {
      await review.close();
    }

    // A contractor on a phone types a matching subject and is offered the article.
    const asking = await newSession({ viewport: PHONE });
    try {
      const { page } = asking;
      await signIn(page, contractor.email, contractor.password);
      await page.goto(`/kb/${slug}`);
      await page.getByRole('heading', { level: 1, name: title }).waitFor();
      await page.getByRole('checkbox', { name: 'Step 1 done' }).check();
      await screenshot(page, 'kb-article-phone');

      await page.goto('/tickets/new');
      await page.getByLabel('What is wrong, in a few words').fill(`${word} burner drops out`);
      const suggestions = page.getByTestId('ticket-suggestions');
      await suggestions.getByRole('button', { name: new RegExp(title) }).click();
      const drawer = page.getByRole('dialog', { name: title });
      await drawer.getByTestId('article-body').waitFor();
      await drawer.getByRole('button', { name: 'This solved it' }).click();
      await page.getByRole('heading', { name: 'Glad that sorted it' }).waitFor();

      // No ticket was opened.
      const res = await page.request.get('/api/tickets');
      expect(((await res.json()) as { total: number }).total).toBe(0);
      ticketId = await openTicket(page, `${word} burner still drops out`);
    } finally {
      await asking.close();
    }

    // On the desk, the workspace finds the article from the ticket and posts it into the chat.
    const desk = await newSession({ viewport: DESKTOP });
    try {
      const { page } = desk;
      await signIn(page, tech.email, tech.password);
      await page.goto(`/tickets/${ticketId}`);
      const kb = page.getByTestId('workspace-kb');
      await kb.getByRole('link', { name: title }).waitFor();
      await kb.getByRole('button', { name: 'Post to chat' }).first().click();
      await page.getByText(`/kb/${slug}`).first().waitFor();
    } finally {
      await desk.close();
    }
  });
});
