import { and, asc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { articles, attachments, contractorAccounts, ticketMessages, users } from '../../db/schema/index';
import type { WriteUpLink } from '../../../../shared/src/index';
import { visibleTo } from '../articles/articles.repository';

/** Who is behind a contractor account: the company and its people, for the scrubber. */
export async function contactsOf(db: Executor, accountId: number) {
  const [account] = await db
    .select({ company: contractorAccounts.company })
    .from(contractorAccounts)
    .where(eq(contractorAccounts.id, accountId));
  const people = await db
    .select({ name: users.name, email: users.email })
    .from(users)
    .where(eq(users.accountId, accountId));
  return { company: account?.company ?? null, people };
}

/** The given messages of this ticket only, oldest first, with which side wrote them. */
export async function messagesOfTicket(db: Executor, ticketId: number, ids: number[]) {
  if (ids.length === 0) return [];
  return db
    .select({
      id: ticketMessages.id,
      kind: ticketMessages.kind,
      body: ticketMessages.body,
      authorRole: users.role,
    })
    .from(ticketMessages)
    .leftJoin(users, eq(users.id, ticketMessages.authorId))
    .where(and(eq(ticketMessages.ticketId, ticketId), inArray(ticketMessages.id, ids)))
    .orderBy(asc(ticketMessages.id));
}

/** The given files of this ticket that were sent in its conversation (not uploads left unsent). */
export async function sentFilesOfTicket(db: Executor, ticketId: number, ids: number[]) {
  if (ids.length === 0) return [];
  return db
    .select({
      id: attachments.id,
      storageKey: attachments.storageKey,
      contentType: attachments.contentType,
      fileName: attachments.fileName,
    })
    .from(attachments)
    .where(
      and(eq(attachments.ticketId, ticketId), inArray(attachments.id, ids), isNotNull(attachments.messageId)),
    )
    .orderBy(asc(attachments.id));
}

/** The articles written up from a ticket that this reader may see. */
export async function writeUpsOf(
  db: Executor,
  reader: { role: string; id: number },
  ticketId: number,
): Promise<WriteUpLink[]> {
  return db
    .select({ id: articles.id, slug: articles.slug, title: articles.title, status: articles.status })
    .from(articles)
    .where(and(eq(articles.sourceTicketId, ticketId), visibleTo(reader)))
    .orderBy(asc(articles.id));
}
