import { sql } from 'drizzle-orm';
import type { AppContext } from '../../context';

/** The daily clean-up of files nobody uses any more. */
export const FILE_SWEEP_QUEUE = 'files.sweep';

/**
 * How long an unused file is kept. A ticket photo is unused until the message that carries it is
 * sent: a phone that lost its signal may hold that message for days, so a week.
 */
export const UNUSED_FILE_DAYS = 7;

/**
 * Deletes, with their stored files:
 * - ticket photos and files uploaded but never sent in a message (taken off before sending);
 * - article pictures that neither the article's text nor any of its saved versions shows (a
 *   restore brings an old version's pictures back, so those stay).
 * Only rows older than `olderThanDays` go. The rows go first, in one statement each; a file whose
 * removal from storage fails is logged and left (nothing points at it any more).
 */
export async function sweepUnusedFiles(ctx: AppContext, olderThanDays = UNUSED_FILE_DAYS) {
  const photos = await ctx.db.execute<{ storage_key: string; thumbnail_key: string | null }>(sql`
    delete from attachments
     where message_id is null and created_at < now() - make_interval(days => ${olderThanDays})
    returning storage_key, thumbnail_key`);
  const pictures = await ctx.db.execute<{ storage_key: string; thumbnail_key: string | null }>(sql`
    delete from article_images i
     where i.created_at < now() - make_interval(days => ${olderThanDays})
       and not exists (
         select 1 from articles a where a.id = i.article_id
            and a.body ~ ('/api/articles/' || i.article_id || '/images/' || i.id || '([^0-9]|$)'))
       and not exists (
         select 1 from article_revisions r where r.article_id = i.article_id
            and r.body ~ ('/api/articles/' || i.article_id || '/images/' || i.id || '([^0-9]|$)'))
    returning storage_key, thumbnail_key`);
  const keys = [...photos.rows, ...pictures.rows].flatMap((r) =>
    r.thumbnail_key ? [r.storage_key, r.thumbnail_key] : [r.storage_key],
  );
  for (const key of keys) {
    await ctx.storage
      .remove(key)
      .catch((err: unknown) => ctx.logger.warn({ err, key }, 'could not remove a file'));
  }
  if (keys.length > 0)
    ctx.logger.info(
      { attachments: photos.rows.length, articleImages: pictures.rows.length },
      'removed unused files',
    );
  return { attachments: photos.rows.length, articleImages: pictures.rows.length };
}

/** Every night at 03:17 UTC. */
export async function registerFileSweep(ctx: AppContext) {
  await ctx.jobs.work(FILE_SWEEP_QUEUE, async () => {
    await sweepUnusedFiles(ctx);
  });
  await ctx.jobs.schedule(FILE_SWEEP_QUEUE, '17 3 * * *');
}
