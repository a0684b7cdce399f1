import { and, asc, count, desc, eq, ilike, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import {
  articleFeedback,
  articleModels,
  articleRevisions,
  articles,
  equipmentModels,
  searchWords,
  users,
} from '../../db/schema/index';
import type { ArticleListQuery } from '../../../../shared/src/index';
import { likePattern, offsetOf } from '../../lib/pagination';

export const summaryColumns = {
  id: articles.id,
  slug: articles.slug,
  title: articles.title,
  summary: articles.summary,
  kind: articles.kind,
  audience: articles.audience,
  status: articles.status,
  updatedAt: isoTime(articles.updatedAt),
};

/** Who may see which articles, as a condition inside the query (never filtered afterwards). */
export function visibleTo(reader: { role: string; id: number }): SQL {
  if (reader.role === 'contractor')
    return and(eq(articles.status, 'published'), eq(articles.audience, 'contractor'))!;
  if (reader.role === 'specialist' || reader.role === 'admin') return sql`true`;
  // Techs: everything published, and their own drafts and reviews.
  return or(eq(articles.status, 'published'), eq(articles.authorId, reader.id))!;
}

export async function listArticles(db: Executor, reader: { role: string; id: number }, q: ArticleListQuery) {
  const where = and(
    visibleTo(reader),
    q.kind ? eq(articles.kind, q.kind) : undefined,
    q.status ? eq(articles.status, q.status) : undefined,
    q.audience ? eq(articles.audience, q.audience) : undefined,
    q.equipmentModelId
      ? sql`exists (select 1 from ${articleModels} am where am.article_id = ${articles.id} and am.equipment_model_id = ${q.equipmentModelId})`
      : undefined,
    q.q ? or(ilike(articles.title, likePattern(q.q)), ilike(articles.summary, likePattern(q.q))) : undefined,
  );
  const [items, [total]] = await Promise.all([
    db
      .select(summaryColumns)
      .from(articles)
      .where(where)
      .orderBy(desc(articles.updatedAt), desc(articles.id))
      .limit(q.pageSize)
      .offset(offsetOf(q)),
    db.select({ n: count() }).from(articles).where(where),
  ]);
  return { items, total: total?.n ?? 0 };
}

export async function findArticleRow(db: Executor, where: SQL) {
  const [row] = await db
    .select({
      ...summaryColumns,
      body: articles.body,
      authorId: articles.authorId,
      authorName: users.name,
      publishedAt: isoTime(articles.publishedAt),
      reviewNote: articles.reviewNote,
      helpedCount: articles.helpedCount,
      notHelpedCount: articles.notHelpedCount,
      viewCount: articles.viewCount,
    })
    .from(articles)
    .innerJoin(users, eq(users.id, articles.authorId))
    .where(where);
  return row;
}

export async function modelsOf(db: Executor, articleId: number) {
  return db
    .select({
      id: equipmentModels.id,
      brand: equipmentModels.brand,
      modelNumber: equipmentModels.modelNumber,
    })
    .from(articleModels)
    .innerJoin(equipmentModels, eq(equipmentModels.id, articleModels.equipmentModelId))
    .where(eq(articleModels.articleId, articleId))
    .orderBy(asc(equipmentModels.modelNumber));
}

export async function slugTaken(db: Executor, slug: string) {
  const [row] = await db.select({ id: articles.id }).from(articles).where(eq(articles.slug, slug));
  return !!row;
}

export async function insertArticle(db: Executor, values: typeof articles.$inferInsert) {
  const [row] = await db.insert(articles).values(values).returning({ id: articles.id });
  return row!.id;
}

export async function updateArticleRow(
  db: Executor,
  id: number,
  patch: Partial<typeof articles.$inferInsert>,
) {
  await db
    .update(articles)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(articles.id, id));
}

export async function insertRevision(db: Executor, values: typeof articleRevisions.$inferInsert) {
  await db.insert(articleRevisions).values(values);
}

export async function listRevisions(db: Executor, articleId: number) {
  return db
    .select({
      id: articleRevisions.id,
      title: articleRevisions.title,
      summary: articleRevisions.summary,
      body: articleRevisions.body,
      note: articleRevisions.note,
      author: { id: users.id, name: users.name },
      createdAt: isoTime(articleRevisions.createdAt),
    })
    .from(articleRevisions)
    .innerJoin(users, eq(users.id, articleRevisions.authorId))
    .where(eq(articleRevisions.articleId, articleId))
    .orderBy(desc(articleRevisions.id));
}

/** Links the models and returns their numbers, with and without dashes and sizes, for search. */
export async function setModels(db: Executor, articleId: number, modelIds: number[]): Promise<string> {
  await db.delete(articleModels).where(eq(articleModels.articleId, articleId));
  if (modelIds.length === 0) return '';
  const models = await db
    .select({ id: equipmentModels.id, n: equipmentModels.modelNumber })
    .from(equipmentModels)
    .where(inArray(equipmentModels.id, modelIds));
  if (models.length)
    await db.insert(articleModels).values(models.map((m) => ({ articleId, equipmentModelId: m.id })));
  return models.map((m) => modelSearchText(m.n)).join(' ');
}

/** CV-M98-80 → "CV-M98-80 CVM9880 CVM98": found typed with or without dashes, with or without the size. */
export function modelSearchText(modelNumber: string) {
  const squashed = modelNumber.replace(/[^A-Za-z0-9]/g, '');
  const family = modelNumber
    .split('-')
    .slice(0, -1)
    .join('')
    .replace(/[^A-Za-z0-9]/g, '');
  return [modelNumber, squashed, family.length >= 3 ? family : ''].filter(Boolean).join(' ');
}

export async function recordWords(db: Executor, text: string) {
  const words = [...new Set(text.toLowerCase().match(/[a-z][a-z0-9]{3,29}/g) ?? [])];
  if (words.length)
    await db
      .insert(searchWords)
      .values(words.map((word) => ({ word })))
      .onConflictDoNothing();
}

export async function upsertFeedback(
  db: Executor,
  articleId: number,
  userId: number,
  helped: boolean,
  comment: string | undefined,
) {
  const [prev] = await db
    .select({ helped: articleFeedback.helped })
    .from(articleFeedback)
    .where(and(eq(articleFeedback.articleId, articleId), eq(articleFeedback.userId, userId)));
  await db
    .insert(articleFeedback)
    .values({ articleId, userId, helped, comment })
    .onConflictDoUpdate({
      target: [articleFeedback.articleId, articleFeedback.userId],
      set: { helped, comment, createdAt: new Date() },
    });
  const delta = (h: boolean | undefined, v: boolean) => (h === v ? 1 : 0);
  await db
    .update(articles)
    .set({
      helpedCount: sql`${articles.helpedCount} + ${delta(helped, true) - delta(prev?.helped, true)}`,
      notHelpedCount: sql`${articles.notHelpedCount} + ${delta(helped, false) - delta(prev?.helped, false)}`,
    })
    .where(eq(articles.id, articleId));
}

export async function countView(db: Executor, id: number) {
  await db
    .update(articles)
    .set({ viewCount: sql`${articles.viewCount} + 1` })
    .where(eq(articles.id, id));
}
