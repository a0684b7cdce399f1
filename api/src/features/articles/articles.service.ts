import { eq } from 'drizzle-orm';
import type { AppContext } from '../../context';

/** Articles need the database; with the job queue and config they also keep the search index in step. */
type Ctx = Pick<AppContext, 'db'> & Partial<Pick<AppContext, 'jobs' | 'config'>>;
import { articles } from '../../db/schema/index';
import type {
  Article,
  ArticleCreate,
  ArticleListQuery,
  ArticleUpdate,
  SessionUser,
} from '../../../../shared/src/index';
import { RESERVED_SLUGS } from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { authorize, can } from '../../lib/policies';
import { and } from 'drizzle-orm';
import * as repo from './articles.repository';
import { originOf } from './origin';
import { renderArticle, touchesGas } from './render';
import { queueSearchSync } from '../search/search.sync';

const slugify = (title: string) =>
  title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80) || 'article';

export async function uniqueSlug(ctx: Ctx, title: string) {
  const base = slugify(title);
  for (let n = 1; ; n++) {
    const slug = n === 1 ? base : `${base}-${n}`;
    // "new", "missed", "synonyms" are pages of the knowledge base: such an article gets "-2".
    if (RESERVED_SLUGS.includes(slug)) continue;
    if (!(await repo.slugTaken(ctx.db, slug))) return slug;
  }
}

/** The whole article for a reader who may see it; anyone else gets 404, drafts included. */
async function load(ctx: Ctx, user: SessionUser, where: ReturnType<typeof eq>): Promise<Article> {
  const row = await repo.findArticleRow(ctx.db, and(where, repo.visibleTo(user))!);
  if (!row) throw AppError.notFound('Article');
  const { authorId, authorName, body, ...rest } = row;
  const gas = touchesGas(rest.title, body);
  return {
    ...rest,
    body,
    bodyHtml: renderArticle(body, { gasCaution: gas }),
    models: await repo.modelsOf(ctx.db, row.id),
    author: { id: authorId, name: authorName },
    touchesGas: gas,
    origin: await originOf(ctx.db, user, { id: row.id, authorId }),
  };
}

export async function getArticleBySlug(ctx: Ctx, user: SessionUser, slug: string) {
  const article = await load(ctx, user, eq(articles.slug, slug));
  if (article.status === 'published') await repo.countView(ctx.db, article.id);
  return article;
}

export const getArticle = (ctx: Ctx, user: SessionUser, id: number) => load(ctx, user, eq(articles.id, id));

export const listArticles = (ctx: Ctx, user: SessionUser, q: ArticleListQuery) =>
  repo.listArticles(ctx.db, user, q);

export async function createArticle(
  ctx: Ctx,
  user: SessionUser,
  input: ArticleCreate,
  extra: { sourceTicketId?: number; slug?: string; status?: 'draft' | 'published' } = {},
) {
  authorize(user, 'article.write');
  const slug = extra.slug ?? (await uniqueSlug(ctx, input.title));
  const id = await ctx.db.transaction(async (tx) => {
    const articleId = await repo.insertArticle(tx, {
      slug,
      title: input.title,
      summary: input.summary,
      body: input.body,
      kind: input.kind,
      audience: input.audience,
      authorId: user.id,
      sourceTicketId: extra.sourceTicketId ?? null,
      status: extra.status ?? 'draft',
      publishedAt: extra.status === 'published' ? new Date() : null,
    });
    const modelText = await repo.setModels(tx, articleId, input.equipmentModelIds);
    if (modelText) await repo.updateArticleRow(tx, articleId, { modelText });
    await repo.insertRevision(tx, {
      articleId,
      title: input.title,
      summary: input.summary,
      body: input.body,
      authorId: user.id,
      note: 'First draft',
    });
    if (extra.status === 'published')
      await repo.recordWords(tx, `${input.title} ${input.summary} ${input.body}`);
    await audit(tx, {
      actorId: user.id,
      action: 'article.create',
      targetType: 'article',
      targetId: articleId,
    });
    await queueSearchSync(ctx, articleId, tx);
    return articleId;
  });
  return getArticle(ctx, user, id);
}

/** Saves a change as a new revision; a published article stays published and searchable. */
export async function updateArticle(ctx: Ctx, user: SessionUser, id: number, input: ArticleUpdate) {
  const current = await getArticle(ctx, user, id);
  authorize(user, 'article.edit', { authorId: current.author.id });
  if (current.status === 'retired') throw AppError.conflict('A retired article cannot be edited');
  const next = {
    title: input.title ?? current.title,
    summary: input.summary ?? current.summary,
    body: input.body ?? current.body,
  };
  await ctx.db.transaction(async (tx) => {
    await repo.updateArticleRow(tx, id, {
      ...next,
      ...(input.kind ? { kind: input.kind } : {}),
      ...(input.audience ? { audience: input.audience } : {}),
    });
    if (input.equipmentModelIds)
      await repo.updateArticleRow(tx, id, {
        modelText: await repo.setModels(tx, id, input.equipmentModelIds),
      });
    await repo.insertRevision(tx, { articleId: id, ...next, authorId: user.id, note: input.note ?? null });
    if (current.status === 'published')
      await repo.recordWords(tx, `${next.title} ${next.summary} ${next.body}`);
    await queueSearchSync(ctx, id, tx);
  });
  return getArticle(ctx, user, id);
}

type Move = 'submit' | 'publish' | 'send-back' | 'retire';
const FROM: Record<Move, Article['status'][]> = {
  submit: ['draft'],
  publish: ['draft', 'in-review'],
  'send-back': ['in-review'],
  retire: ['published', 'draft', 'in-review'],
};

/** The review workflow: draft → in review → published (or sent back to draft with a note) → retired. */
export async function moveArticle(ctx: Ctx, user: SessionUser, id: number, move: Move, note?: string) {
  const current = await getArticle(ctx, user, id);
  if (move === 'submit') authorize(user, 'article.edit', { authorId: current.author.id });
  if (move === 'publish' || move === 'send-back')
    authorize(user, 'article.publish', { authorId: current.author.id });
  if (move === 'retire') authorize(user, 'article.retire');
  if (!FROM[move].includes(current.status)) {
    throw AppError.conflict(
      `An article that is ${current.status} cannot be ${move === 'send-back' ? 'sent back' : `${move}ed`.replace('ee', 'e')}`,
    );
  }
  const patch =
    move === 'submit'
      ? { status: 'in-review' as const, reviewNote: null }
      : move === 'publish'
        ? { status: 'published' as const, reviewerId: user.id, publishedAt: new Date(), reviewNote: null }
        : move === 'send-back'
          ? { status: 'draft' as const, reviewerId: user.id, reviewNote: note ?? null }
          : { status: 'retired' as const };
  await ctx.db.transaction(async (tx) => {
    await repo.updateArticleRow(tx, id, patch);
    if (move === 'publish') await repo.recordWords(tx, `${current.title} ${current.summary} ${current.body}`);
    await audit(tx, {
      actorId: user.id,
      action: `article.${move}`,
      targetType: 'article',
      targetId: id,
      details: note ? { note } : undefined,
    });
    if (move === 'publish' || move === 'retire') await queueSearchSync(ctx, id, tx);
  });
  return getArticle(ctx, user, id);
}

export async function listRevisions(ctx: Ctx, user: SessionUser, id: number) {
  const article = await getArticle(ctx, user, id);
  if (!can(user, 'article.write')) throw AppError.notFound('Article');
  return repo.listRevisions(ctx.db, article.id);
}

export async function giveFeedback(
  ctx: Ctx,
  user: SessionUser,
  id: number,
  helped: boolean,
  comment?: string,
) {
  const article = await getArticle(ctx, user, id);
  if (article.status !== 'published') throw AppError.conflict('Only published articles take feedback');
  await repo.upsertFeedback(ctx.db, id, user.id, helped, comment);
  return getArticle(ctx, user, id);
}
