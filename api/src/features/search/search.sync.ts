import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import { enginesOf } from './search.engines';
import type { MeiliSearchEngine } from './search.meilisearch';
import { allSearchDocuments, searchDocument, synonymGroups } from './search.repository';

/** `{ articleId }`: put the article's document in the index when published, take it out otherwise. */
export const SEARCH_SYNC_QUEUE = 'search.sync';
/** `{ fill? }`: apply the index settings (synonyms included); `fill` also indexes an empty index. */
export const SEARCH_SETTINGS_QUEUE = 'search.settings';

/** Callers that may run without the job queue (the seed's import) pass what they have. */
type QueueCtx = Partial<Pick<AppContext, 'jobs' | 'config'>>;
const indexed = (ctx: QueueCtx): ctx is Required<QueueCtx> => !!ctx.jobs && !!ctx.config?.MEILI_URL;

/** Queues the article's index update inside `tx`; nothing to do when Meilisearch is not configured. */
export async function queueSearchSync(ctx: QueueCtx, articleId: number, tx?: Executor): Promise<void> {
  if (indexed(ctx)) await ctx.jobs.send(SEARCH_SYNC_QUEUE, { articleId }, {}, tx);
}

/** Queues an index settings update (after a synonym change) inside `tx`. */
export async function queueSearchSettings(ctx: QueueCtx, tx?: Executor, fill = false): Promise<void> {
  if (indexed(ctx)) await ctx.jobs.send(SEARCH_SETTINGS_QUEUE, fill ? { fill } : {}, {}, tx);
}

/** Fills the index with every published article; returns how many were sent. */
export async function indexAll(ctx: Pick<AppContext, 'db'>, meili: MeiliSearchEngine): Promise<number> {
  let sent = 0;
  for await (const batch of allSearchDocuments(ctx.db)) {
    await meili.upsert(batch);
    sent += batch.length;
  }
  return sent;
}

/**
 * Rebuilds the index in place: settings, every published article, and out with whatever the index
 * holds that is no longer published. Searches keep working throughout.
 */
export async function rebuildIndex(ctx: Pick<AppContext, 'db'>, meili: MeiliSearchEngine) {
  const groups = await synonymGroups(ctx.db);
  await meili.applySettings(groups);
  const published = new Set<number>();
  for await (const batch of allSearchDocuments(ctx.db)) {
    await meili.upsert(batch);
    for (const doc of batch) published.add(doc.id);
  }
  const stale: number[] = [];
  for await (const ids of meili.indexedIds()) stale.push(...ids.filter((id) => !published.has(id)));
  await meili.remove(stale);
  return { synonymGroups: groups.length, indexed: published.size, removed: stale.length };
}

/** The index workers; registered only when Meilisearch is configured (see workers.ts). */
export async function registerSearchWorkers(ctx: AppContext): Promise<void> {
  const meili = enginesOf(ctx).meili;
  if (!meili) return;
  // The worker reads the article when it runs, so the index gets the state that committed last.
  await ctx.jobs.work<{ articleId: number }>(SEARCH_SYNC_QUEUE, async ({ articleId }) => {
    const doc = await searchDocument(ctx.db, articleId);
    if (doc) await meili.upsert([doc]);
    else await meili.remove([articleId]);
  });
  await ctx.jobs.work<{ fill?: boolean }>(SEARCH_SETTINGS_QUEUE, async ({ fill }) => {
    await meili.applySettings(await synonymGroups(ctx.db));
    // A new, empty index (first start, or a fresh Meilisearch) gets every published article.
    if (fill && (await meili.documentCount()) === 0) {
      const n = await indexAll(ctx, meili);
      ctx.logger.info({ documents: n }, 'search index filled');
    }
  });
  // Settings at start-up: through the queue, so a Meilisearch that is down is retried with backoff.
  await queueSearchSettings(ctx, undefined, true);
}
