import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import type { MailKind } from '../../../../shared/src/schemas/mail';
import type { Fuel, Urgency } from '../../../../shared/src/schemas/tickets';
import { appUrl, renderMail, type MailContent } from './mail.layout';
import { queueMail } from './mail.queue';
import * as repo from './mail.repository';
import { unsubscribeLinks } from './mail.tokens';

/**
 * The e-mails ticket events send. Each is queued inside the caller's transaction (`tx`), so it goes
 * out only when the change commits.
 */

const URGENCY_LABEL: Record<Urgency, string> = {
  emergency: 'No heat / no cooling',
  'job-held': 'Job on hold',
  question: 'Question',
};
const GAS_FUELS: readonly Fuel[] = ['natural-gas', 'propane'];
/** The usual gas caution, worded for advice passed on by e-mail (the checks' own says "estimate"). */
const GAS_CAUTION =
  'Gas work is for qualified, licensed technicians only. Follow the manufacturer’s installation ' +
  'instructions and the code in force locally (in the US the National Fuel Gas Code, NFPA 54/ANSI ' +
  'Z223.1; in Canada CSA B149.1), which override anything in this e-mail. Shut the gas off before ' +
  'opening a test port, leak-test every fitting that was opened, and check for CO.';

const when = new Intl.DateTimeFormat('en-US', {
  month: 'short',
  day: 'numeric',
  hour: 'numeric',
  minute: '2-digit',
  timeZone: 'UTC',
  timeZoneName: 'short',
});

const ticketLine = (t: repo.TicketForMail) => `ticket ${t.number}, “${t.subject}”`;
const equipmentLine = (t: repo.TicketForMail) =>
  [URGENCY_LABEL[t.urgency], t.modelText].filter(Boolean).join(' · ');

/** Queues an optional e-mail to a user, unless they turned that kind off or are no longer active. */
async function queueOptional(
  ctx: AppContext,
  tx: Executor,
  to: repo.Recipient,
  kind: MailKind,
  subject: string,
  content: Omit<MailContent, 'unsubscribeUrl'>,
) {
  if (!to.active || !to[kind]) return false;
  const { pageUrl, headers } = unsubscribeLinks(ctx.config, to.id, kind);
  await queueMail(
    ctx,
    { to: to.email, subject, headers, ...renderMail({ ...content, unsubscribeUrl: pageUrl }) },
    tx,
  );
  return true;
}

/** Ticket received: to the contractor who opened it; an emergency also to the branch's desk address. */
export async function notifyTicketReceived(ctx: AppContext, tx: Executor, ticketId: number) {
  const t = await repo.findTicketForMail(tx, ticketId);
  if (!t) return;
  const opener = await repo.findRecipient(tx, t.openedById);
  const ticketUrl = appUrl(ctx.config, `/tickets/${t.id}`);
  const item = { title: t.subject, meta: equipmentLine(t), text: t.description || undefined };
  if (opener) {
    await queueOptional(ctx, tx, opener, 'ticketReceived', `Ticket ${t.number} received: ${t.subject}`, {
      heading: 'The desk has your ticket',
      paragraphs: [
        `The ${t.branchName} desk has ${ticketLine(t)}. A desk tech answers in the ticket's chat.`,
        'If you are not in Lightoff when they answer, we send you one e-mail with the replies.',
      ],
      items: [item],
      action: { label: 'Open the ticket', url: ticketUrl },
      footer: `You get this e-mail because you opened this ticket in Lightoff for ${t.company}.`,
    });
  }
  if (t.urgency === 'emergency' && t.deskEmail) {
    await queueMail(
      ctx,
      {
        to: t.deskEmail,
        subject: `No heat / no cooling: ticket ${t.number} from ${t.company}`,
        ...renderMail({
          heading: `Emergency ticket for ${t.branchName}`,
          paragraphs: [
            `${t.company} opened ${ticketLine(t)} and marked it no heat / no cooling.`,
            'Claim it on the desk board so the contractor knows someone has it.',
          ],
          items: [item],
          action: { label: 'Open the ticket', url: ticketUrl },
          footer: `Sent to the ${t.branchName} branch's desk address for every emergency ticket; an admin changes the address on the branch.`,
        }),
      },
      tx,
    );
  }
}

export const REPLIES_QUEUE = 'mail.replies';

/**
 * A desk reply to a contractor who is not connected: the first one of a burst schedules one
 * gathering job `MAIL_REPLY_DELAY_SECONDS` later; while it waits, further sends are dropped
 * (the queue keeps one waiting job per ticket and user).
 */
export async function scheduleRepliesMail(ctx: AppContext, tx: Executor, ticketId: number, userId: number) {
  await ctx.jobs.send(
    REPLIES_QUEUE,
    { ticketId, userId },
    { singletonKey: `${ticketId}:${userId}`, startAfter: ctx.config.MAIL_REPLY_DELAY_SECONDS },
    tx,
  );
}

/**
 * The gathering job: one e-mail with every desk reply the contractor has neither read nor received
 * since the last such e-mail; nothing when there are none (they came back and read them).
 */
export async function sendRepliesMail(ctx: AppContext, job: { ticketId: number; userId: number }) {
  await ctx.db.transaction(async (tx) => {
    const t = await repo.findTicketForMail(tx, job.ticketId);
    const to = await repo.findRecipient(tx, job.userId);
    if (!t || !to) return;
    const after = await repo.lastMailedReplyId(tx, t.id, to.id);
    const replies = await repo.unseenDeskReplies(tx, t.id, after);
    const last = replies.at(-1);
    if (!last) return;
    const n = replies.length;
    await queueOptional(
      ctx,
      tx,
      to,
      'replies',
      `${n === 1 ? 'A reply' : `${n} replies`} on ticket ${t.number}: ${t.subject}`,
      {
        heading: n === 1 ? 'The desk replied' : `The desk sent ${n} replies`,
        paragraphs: [
          `The ${t.branchName} desk answered on ${ticketLine(t)} while you were away from Lightoff.`,
        ],
        items: replies.map((r) => ({ title: r.authorName, meta: when.format(r.createdAt), text: r.body })),
        caution: GAS_FUELS.includes(t.fuel) ? GAS_CAUTION : undefined,
        action: { label: 'Answer in the ticket', url: appUrl(ctx.config, `/tickets/${t.id}`) },
        footer:
          'You get this e-mail because you opened this ticket and were not in Lightoff when the desk answered.',
      },
    );
    // Recorded even when they turned these e-mails off, so turning them on again does not resend old replies.
    await repo.recordRepliesMailed(tx, { ticketId: t.id, userId: to.id, lastMessageId: last.id, count: n });
  });
}

/** Resolved by the desk: the summary and the linked articles, to the contractor who opened it. */
export async function notifyResolved(ctx: AppContext, tx: Executor, ticketId: number) {
  const t = await repo.findTicketForMail(tx, ticketId);
  const to = t && (await repo.findRecipient(tx, t.openedById));
  if (!t || !to) return;
  const articles = await repo.linkedArticles(tx, t.id);
  const paragraphs = [`The ${t.branchName} desk marked ${ticketLine(t)} resolved.`];
  if (t.resolutionSummary) paragraphs.push(`How it was solved:\n${t.resolutionSummary}`);
  if (articles.length) paragraphs.push('Articles from the knowledge base the desk linked:');
  await queueOptional(ctx, tx, to, 'resolved', `Ticket ${t.number} resolved: ${t.subject}`, {
    heading: 'Your ticket is resolved',
    paragraphs,
    items: articles.map((a) => ({
      title: a.title,
      text: a.summary,
      url: appUrl(ctx.config, `/kb/${a.slug}`),
    })),
    caution: GAS_FUELS.includes(t.fuel) ? GAS_CAUTION : undefined,
    action: { label: 'Open the ticket', url: appUrl(ctx.config, `/tickets/${t.id}`) },
    footer:
      'You get this e-mail because you opened this ticket. If the problem comes back, reopen it from its page within 14 days.',
  });
}

/** An account's address changed: both the old and the new address hear of it (always sent). */
export async function notifyEmailChanged(
  ctx: AppContext,
  tx: Executor,
  change: { name: string; oldEmail: string; newEmail: string },
) {
  const content = renderMail({
    heading: 'Your e-mail address was changed',
    paragraphs: [
      `The e-mail address of the Lightoff account of ${change.name} was changed from ${change.oldEmail} to ${change.newEmail}.`,
      `From now on you sign in with ${change.newEmail}, and e-mails from Lightoff go there.`,
      'If you did not expect this, call your branch desk or your support manager right away.',
    ],
    action: { label: 'Sign in', url: appUrl(ctx.config, '/sign-in') },
    footer:
      'This notice goes to the old and the new address whenever an account’s e-mail address changes; it cannot be turned off.',
  });
  const subject = 'Your Lightoff e-mail address was changed';
  for (const to of new Set([change.oldEmail, change.newEmail]))
    await queueMail(ctx, { to, subject, ...content }, tx);
}
