import { and, asc, eq, gt, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import {
  articles,
  auditLog,
  branches,
  contractorAccounts,
  ticketMessages,
  tickets,
  users,
} from '../../db/schema/index';
import type { MailKind, MailPreferences } from '../../../../shared/src/schemas/mail';

const PREFERENCE_COLUMNS = {
  ticketReceived: 'mailTicketReceived',
  replies: 'mailReplies',
  resolved: 'mailResolved',
} as const satisfies Record<MailKind, keyof typeof users.$inferSelect>;

/** Who an e-mail goes to, with the e-mails they chose to get. */
export async function findRecipient(db: Executor, userId: number) {
  const [row] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      active: users.active,
      ticketReceived: users.mailTicketReceived,
      replies: users.mailReplies,
      resolved: users.mailResolved,
    })
    .from(users)
    .where(eq(users.id, userId));
  return row;
}
export type Recipient = NonNullable<Awaited<ReturnType<typeof findRecipient>>>;

export async function updatePreferences(db: Executor, userId: number, patch: Partial<MailPreferences>) {
  const set: Partial<typeof users.$inferInsert> = { updatedAt: new Date() };
  for (const [kind, on] of Object.entries(patch) as [MailKind, boolean][]) set[PREFERENCE_COLUMNS[kind]] = on;
  const [row] = await db.update(users).set(set).where(eq(users.id, userId)).returning({ id: users.id });
  return Boolean(row);
}

/** A ticket as the e-mails describe it. */
export async function findTicketForMail(db: Executor, ticketId: number) {
  const [row] = await db
    .select({
      id: tickets.id,
      number: tickets.number,
      subject: tickets.subject,
      urgency: tickets.urgency,
      fuel: tickets.fuel,
      modelText: tickets.modelText,
      description: tickets.description,
      resolutionSummary: tickets.resolutionSummary,
      openedById: tickets.openedById,
      branchName: branches.name,
      deskEmail: branches.deskEmail,
      company: contractorAccounts.company,
    })
    .from(tickets)
    .innerJoin(branches, eq(branches.id, tickets.branchId))
    .innerJoin(contractorAccounts, eq(contractorAccounts.id, tickets.accountId))
    .where(eq(tickets.id, ticketId));
  return row;
}
export type TicketForMail = NonNullable<Awaited<ReturnType<typeof findTicketForMail>>>;

/**
 * Desk replies (never internal notes or events) the contractor has neither read nor received on
 * a socket, newer than `afterId`.
 */
export async function unseenDeskReplies(db: Executor, ticketId: number, afterId: number) {
  return db
    .select({
      id: ticketMessages.id,
      body: ticketMessages.body,
      createdAt: ticketMessages.createdAt,
      authorName: users.name,
    })
    .from(ticketMessages)
    .innerJoin(users, eq(users.id, ticketMessages.authorId))
    .where(
      and(
        eq(ticketMessages.ticketId, ticketId),
        eq(ticketMessages.kind, 'message'),
        ne(users.role, 'contractor'),
        gt(ticketMessages.id, afterId),
        isNull(ticketMessages.readAt),
        isNull(ticketMessages.deliveredAt),
      ),
    )
    .orderBy(asc(ticketMessages.id));
}

const REPLIES_MAILED = 'mail.replies-sent';

/** The newest desk reply already e-mailed to this user on this ticket (0: none yet). */
export async function lastMailedReplyId(db: Executor, ticketId: number, userId: number): Promise<number> {
  const [row] = await db
    .select({ last: sql<number | null>`max((${auditLog.details}->>'lastMessageId')::int)` })
    .from(auditLog)
    .where(
      and(
        eq(auditLog.action, REPLIES_MAILED),
        eq(auditLog.targetType, 'ticket'),
        eq(auditLog.targetId, String(ticketId)),
        sql`(${auditLog.details}->>'userId')::int = ${userId}`,
      ),
    );
  return Number(row?.last ?? 0);
}

export async function recordRepliesMailed(
  db: Executor,
  e: { ticketId: number; userId: number; lastMessageId: number; count: number },
) {
  await db.insert(auditLog).values({
    actorId: null,
    action: REPLIES_MAILED,
    targetType: 'ticket',
    targetId: String(e.ticketId),
    details: { userId: e.userId, lastMessageId: e.lastMessageId, count: e.count },
  });
}

/** Article paths the desk types or pastes into replies: `/kb/<slug>`. */
const ARTICLE_PATH = /\/kb\/([a-z0-9]+(?:-[a-z0-9]+)*)/g;

/**
 * Published contractor articles the desk linked in the ticket: posted as article cards (message
 * data `{ type: 'article', articleId }`), linked by path in a reply, or written up from it.
 */
export async function linkedArticles(db: Executor, ticketId: number) {
  const rows = await db
    .select({ body: ticketMessages.body, data: ticketMessages.data, role: users.role })
    .from(ticketMessages)
    .leftJoin(users, eq(users.id, ticketMessages.authorId))
    .where(and(eq(ticketMessages.ticketId, ticketId), ne(ticketMessages.kind, 'internal-note')));
  const ids = new Set<number>();
  const slugs = new Set<string>();
  for (const { body, data, role } of rows) {
    if (role === 'contractor') continue;
    if (data?.type === 'article' && Number.isInteger(data.articleId)) ids.add(data.articleId as number);
    for (const m of body.matchAll(ARTICLE_PATH)) if (m[1]) slugs.add(m[1]);
  }
  const linked = [eq(articles.sourceTicketId, ticketId)];
  if (ids.size) linked.push(inArray(articles.id, [...ids]));
  if (slugs.size) linked.push(inArray(articles.slug, [...slugs]));
  return db
    .select({ slug: articles.slug, title: articles.title, summary: articles.summary })
    .from(articles)
    .where(and(eq(articles.status, 'published'), eq(articles.audience, 'contractor'), or(...linked)))
    .orderBy(asc(articles.title));
}
