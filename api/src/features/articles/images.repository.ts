import { and, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { articleImages, articles } from '../../db/schema/index';
import { visibleTo } from './articles.repository';

export async function insertImage(db: Executor, row: typeof articleImages.$inferInsert) {
  const [inserted] = await db
    .insert(articleImages)
    .values(row)
    .returning({ id: articleImages.id, width: articleImages.width, height: articleImages.height });
  return inserted!;
}

/** An article's image, only when the reader may see the article itself (the same rule as reading it). */
export async function findVisibleImage(
  db: Executor,
  reader: { role: string; id: number },
  articleId: number,
  imageId: number,
) {
  const [row] = await db
    .select({
      storageKey: articleImages.storageKey,
      thumbnailKey: articleImages.thumbnailKey,
      contentType: articleImages.contentType,
      fileName: articleImages.fileName,
    })
    .from(articleImages)
    .innerJoin(articles, eq(articles.id, articleImages.articleId))
    .where(and(eq(articleImages.id, imageId), eq(articleImages.articleId, articleId), visibleTo(reader)));
  return row;
}

/** Who wrote the article, to decide who may add pictures to it; undefined when the reader cannot see it. */
export async function findEditable(db: Executor, reader: { role: string; id: number }, articleId: number) {
  const [row] = await db
    .select({ authorId: articles.authorId, status: articles.status })
    .from(articles)
    .where(and(eq(articles.id, articleId), visibleTo(reader)));
  return row;
}
