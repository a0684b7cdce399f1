import { and, desc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { articles, auditLog, tickets } from '../../db/schema/index';

/** The tickets an article was written up from, with what the ticket policy needs to know. */
export async function sourceTicketsOf(db: Executor, articleId: number) {
  return db
    .select({
      id: tickets.id,
      number: tickets.number,
      accountId: tickets.accountId,
      branchId: tickets.branchId,
      assigneeId: tickets.assigneeId,
    })
    .from(articles)
    .innerJoin(tickets, eq(tickets.id, articles.sourceTicketId))
    .where(eq(articles.id, articleId));
}

/** The details of the latest write-up into this article, as recorded when it was made. */
export async function lastWriteUpDetails(db: Executor, articleId: number) {
  const [row] = await db
    .select({ details: auditLog.details })
    .from(auditLog)
    .where(
      and(
        eq(auditLog.action, 'article.write-up'),
        eq(auditLog.targetType, 'article'),
        eq(auditLog.targetId, String(articleId)),
      ),
    )
    .orderBy(desc(auditLog.id))
    .limit(1);
  return row?.details ?? null;
}
