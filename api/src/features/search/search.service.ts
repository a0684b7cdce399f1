import { and, eq, sql } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { searchQueries } from '../../db/schema/index';
import type { SearchQuery, SearchResponse, SessionUser } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { answer, enginesOf } from './search.engines';
import { noFacets } from './search.engine';

/** Runs a search and logs it (who, what, how many hits) so specialists can see what is missing. */
export async function search(ctx: AppContext, user: SessionUser, q: SearchQuery): Promise<SearchResponse> {
  const started = performance.now();
  const answered = q.q
    ? await answer(ctx, (engine) => engine.search(user, q))
    : {
        value: { hits: [], total: 0, facets: noFacets() },
        // Nothing was asked: name the engine configured for this server.
        engine: enginesOf(ctx).meili ? ('meilisearch' as const) : ('postgres' as const),
        fallback: false,
      };
  const result = answered.value;
  let queryId: number | null = null;
  if (q.q && q.offset === 0) {
    const [row] = await ctx.db
      .insert(searchQueries)
      .values({
        userId: user.id,
        text: q.q.slice(0, 200),
        filters: { kind: q.kind, equipmentType: q.equipmentType, brand: q.brand, fuel: q.fuel },
        context: q.context,
        hits: result.total,
      })
      .returning({ id: searchQueries.id });
    queryId = row!.id;
  }
  return {
    ...result,
    totalIsLowerBound: result.totalIsLowerBound ?? false,
    engine: answered.engine,
    fallback: answered.fallback,
    tookMs: Math.round((performance.now() - started) * 10) / 10,
    queryId,
  };
}

export async function suggest(ctx: AppContext, user: SessionUser, q: string) {
  if (q.trim().length < 2) return [];
  return (await answer(ctx, (engine) => engine.suggest(user, q.trim(), 8))).value;
}

/** The reader opened a result; from the new-ticket form, "this solved it" records a deflection. */
export async function recordOutcome(
  ctx: AppContext,
  user: SessionUser,
  queryId: number,
  input: { articleId: number; deflected: boolean },
) {
  const updated = await ctx.db
    .update(searchQueries)
    .set({ clickedArticleId: input.articleId, deflected: input.deflected })
    .where(and(eq(searchQueries.id, queryId), eq(searchQueries.userId, user.id)))
    .returning({ id: searchQueries.id });
  if (updated.length === 0) throw AppError.notFound('Search');
}

/** Searches that found nothing, grouped by wording, most frequent then newest first. */
export async function searchesWithoutResults(ctx: AppContext, user: SessionUser, days: number) {
  authorize(user, 'search.insights');
  const result = await ctx.db.execute<{ text: string; times: number; last: string }>(sql`
    select lower(trim(text)) as text, count(*)::int as times,
           to_char(max(created_at) at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') as last
      from search_queries
     where hits = 0 and created_at > now() - make_interval(days => ${days})
     group by lower(trim(text))
     order by times desc, max(created_at) desc
     limit 100`);
  return result.rows;
}
