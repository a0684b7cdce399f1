import type { Executor } from '../../db/client';
import { removedItemSchema, type ArticleOrigin, type SessionUser } from '../../../../shared/src/index';
import { can } from '../../lib/policies';
import * as repo from './origin.repository';

/**
 * Where an article came from, as far as this reader may know: everyone sees how many tickets it
 * was written up from; staff get links to the ones they may open; whoever may edit the article
 * sees what the write-up removed, to check it in review.
 */
export async function originOf(
  db: Executor,
  user: SessionUser,
  article: { id: number; authorId: number },
): Promise<ArticleOrigin | null> {
  const sources = await repo.sourceTicketsOf(db, article.id);
  if (sources.length === 0) return null;
  const staff = can(user, 'note.view');
  const origin: ArticleOrigin = {
    ticketCount: sources.length,
    tickets: staff
      ? sources.filter((t) => can(user, 'ticket.view', t)).map((t) => ({ id: t.id, number: t.number }))
      : [],
  };
  if (can(user, 'article.edit', { authorId: article.authorId })) {
    const details = await repo.lastWriteUpDetails(db, article.id);
    const removed = removedItemSchema.array().safeParse(details?.removed);
    origin.removed = removed.success ? removed.data : [];
  }
  return origin;
}
