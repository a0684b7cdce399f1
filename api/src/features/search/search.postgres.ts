import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import type { SearchFacets, SearchHit, SearchQuery } from '../../../../shared/src/index';
import { groupQuery, type QueryGroup } from './query';
import { noFacets, type EngineResult, type SearchEngine, type SearchReader } from './search.engine';

/**
 * The most rows one pass ranks; totals and facets count up to it (`totalIsLowerBound`, shown as
 * "300+"). Ranking reads each candidate's whole vector and is most of a search's cost: 300 keeps a
 * search of 100,000 articles near 5 ms in the database, and a knowledge base's strict matches (every
 * idea of the query) rarely number more.
 */
export const CANDIDATES = 300;

/** What the reader may find, inside the query: contractors only published contractor articles. */
function audienceFilter(reader: SearchReader): SQL {
  return reader.role === 'contractor'
    ? sql`a.status = 'published' and a.audience = 'contractor'`
    : sql`a.status = 'published'`;
}

type RawHit = SearchHit & { updated_at: string };

/** Whether a candidate article (`c`) passes each filter; `true` where the filter is not set. */
function filterFlags(q: SearchQuery): Record<'kind' | 'type' | 'brand' | 'fuel', SQL> {
  // An article passes a model filter when any of its linked models has that value.
  const anyModel = (cond: SQL) =>
    sql`exists (select 1 from article_models am join equipment_models m on m.id = am.equipment_model_id
                 where am.article_id = c.id and ${cond})`;
  return {
    kind: q.kind ? sql`c.kind::text = ${q.kind}` : sql`true`,
    type: q.equipmentType ? anyModel(sql`m.type::text = ${q.equipmentType}`) : sql`true`,
    brand: q.brand ? anyModel(sql`lower(m.brand) = lower(${q.brand})`) : sql`true`,
    fuel: q.fuel ? anyModel(sql`${q.fuel}::fuel = any(m.fuels)`) : sql`true`,
  };
}

/** One group: any of its terms (as English text search), or its model-number prefix. */
function groupTsquery(group: QueryGroup): SQL {
  const parts = group.terms.map((t) => sql`plainto_tsquery('english', immutable_unaccent(${t}))`);
  if (group.prefix) parts.push(sql`to_tsquery('simple', ${`${group.prefix}:*`})`);
  return sql`(${sql.join(parts, sql` || `)})`;
}

export class PostgresSearch implements SearchEngine {
  readonly name = 'postgres' as const;
  constructor(private readonly db: Db) {}

  // Read again at most every 30 s: a specialist's edit shows up at once on the instance that made
  // it (forgetSynonyms) and within half a minute on every other one.
  private cached: { at: number; groups: string[][] } | undefined;
  forgetSynonyms() {
    this.cached = undefined;
  }
  private async synonyms(): Promise<string[][]> {
    if (this.cached && Date.now() - this.cached.at < 30_000) return this.cached.groups;
    const { rows } = await this.db.$client.query<{ terms: string[] }>('select terms from search_synonyms');
    this.cached = { at: Date.now(), groups: rows.map((r) => r.terms) };
    return this.cached.groups;
  }

  // What each typed word was corrected to (null: it needs none), kept 30 s like the synonyms: the
  // same few hundred words come back all day, and each lookup is a trigram scan of the vocabulary.
  private corrections: { at: number; words: Map<string, string | null> } = { at: 0, words: new Map() };
  /** Adds the nearest known word to each single-word group that the articles never use (typos). */
  private async correct(groups: QueryGroup[]): Promise<QueryGroup[]> {
    const words = groups
      .filter((g) => g.terms.length === 1 && !g.prefix && /^[a-z]{4,}$/.test(g.terms[0]!))
      .map((g) => g.terms[0]!);
    if (words.length === 0) return groups;
    if (Date.now() - this.corrections.at > 30_000 || this.corrections.words.size > 10_000)
      this.corrections = { at: Date.now(), words: new Map() };
    const known = this.corrections.words;
    const unknown = words.filter((w) => !known.has(w));
    if (unknown.length > 0) {
      const { rows } = await this.db.$client.query<{ typed: string; word: string | null; known: boolean }>(
        `select t.typed,
                exists(select 1 from search_words w where w.word = t.typed) as known,
                (select w.word from search_words w where w.word % t.typed order by similarity(w.word, t.typed) desc limit 1) as word
           from unnest($1::text[]) as t(typed)`,
        [unknown],
      );
      for (const r of rows) known.set(r.typed, !r.known && r.word ? r.word : null);
    }
    return groups.map((g) => {
      const fix = g.terms.length === 1 ? known.get(g.terms[0]!) : null;
      return fix ? { ...g, terms: [g.terms[0]!, fix] } : g;
    });
  }

  async search(reader: SearchReader, q: SearchQuery): Promise<EngineResult> {
    const groups = await this.correct(groupQuery(q.q, await this.synonyms()));
    if (groups.length === 0) return { hits: [], total: 0, facets: noFacets() };
    const all = sql.join(groups.map(groupTsquery), sql` && `);
    const any = sql.join(groups.map(groupTsquery), sql` || `);
    // Articles matching every idea come first; only when there are too few of them does the
    // search widen to articles matching some ideas. Ranking then touches few rows.
    const strict = await this.run(all, all, reader, q);
    if (strict.total >= q.offset + q.limit || groups.length === 1) return strict;
    const wide = await this.run(any, all, reader, q);
    return wide.total > strict.total ? wide : strict;
  }

  /** One pass: the matches, their rank, the page with snippets, the total and the facets. */
  private async run(match: SQL, all: SQL, reader: SearchReader, q: SearchQuery): Promise<EngineResult> {
    // Each filter is a flag on the matched rows rather than a condition on them: the hits need
    // every flag, and each facet every flag but its own.
    const ok = filterFlags(q);
    const but = (own: keyof typeof ok) =>
      sql.join(
        (Object.keys(ok) as (keyof typeof ok)[]).filter((k) => k !== own).map((k) => sql.raw(`mt.${k}_ok`)),
        sql` and `,
      );
    const allOk = sql.raw('mt.kind_ok and mt.type_ok and mt.brand_ok and mt.fuel_ok');
    const result = await this.db.execute<{
      hits: RawHit[];
      total: number;
      candidates: number;
      facets: SearchFacets;
    }>(sql`
      with q as (select ${match} as match_q, ${all} as all_q),
      candidates as (
        -- Ranking reads every candidate's vector: past CANDIDATES rows the order is already
        -- settled by the strict pass above, so the widened pass ranks a bounded set.
        select a.id, a.kind, a.updated_at, a.search_vector
          from articles a, q
         where ${audienceFilter(reader)} and a.search_vector @@ q.match_q
         limit ${CANDIDATES}
      ),
      matched as (
        select c.id, c.kind::text as kind, c.updated_at,
               (case when c.search_vector @@ q.all_q then 1 else 0 end) + ts_rank_cd(c.search_vector, q.match_q, 1) as score,
               ${ok.kind} as kind_ok, ${ok.type} as type_ok, ${ok.brand} as brand_ok, ${ok.fuel} as fuel_ok
          from candidates c, q
      ),
      linked as (
        select mt.*, m.type::text as type, m.brand, m.fuels
          from matched mt
          join article_models am on am.article_id = mt.id
          join equipment_models m on m.id = am.equipment_model_id
      ),
      page as (
        select mt.* from matched mt where ${allOk}
         order by mt.score desc, mt.updated_at desc limit ${q.limit} offset ${q.offset}
      )
      select
        (select count(*)::int from matched mt where ${allOk}) as total,
        (select count(*)::int from matched) as candidates,
        jsonb_build_object(
          'kind', coalesce((select jsonb_object_agg(k, n) from (
              select mt.kind as k, count(*)::int as n from matched mt where ${but('kind')} group by mt.kind) f), '{}'),
          'equipmentType', coalesce((select jsonb_object_agg(k, n) from (
              select mt.type as k, count(distinct mt.id)::int as n from linked mt where ${but('type')} group by mt.type) f), '{}'),
          'brand', coalesce((select jsonb_object_agg(k, n) from (
              select mt.brand as k, count(distinct mt.id)::int as n from linked mt where ${but('brand')} group by mt.brand) f), '{}'),
          'fuel', coalesce((select jsonb_object_agg(k, n) from (
              select fuel::text as k, count(distinct mt.id)::int as n from linked mt, unnest(mt.fuels) as fuel
               where ${but('fuel')} group by fuel) f), '{}')
        ) as facets,
        coalesce((select jsonb_agg(h order by h.score desc, h.updated_at desc) from (
          select a.id, a.slug, a.title, a.summary, a.kind, a.audience, p.updated_at,
                 round(p.score::numeric, 4)::float8 as score,
                 ts_headline('english', a.body, q.match_q, 'MaxFragments=1, MaxWords=28, MinWords=10, StartSel=⟦, StopSel=⟧') as snippet
            from page p join articles a on a.id = p.id, q) h), '[]') as hits`);
    const row = result.rows[0]!;
    return {
      hits: row.hits.map(({ updated_at: _u, ...h }) => h),
      total: row.total,
      totalIsLowerBound: row.candidates >= CANDIDATES,
      facets: row.facets,
    };
  }

  async suggest(reader: SearchReader, text: string, limit: number) {
    const like = `%${text.replace(/[\\%_]/g, '\\$&')}%`;
    // Two small candidate sets from the trigram index (contains, or close to), then the best few.
    // `<%` uses the index at pg_trgm's word-similarity threshold, which the connection sets to
    // 0.45 (see db/client.ts): that lets one slip per word through.
    const result = await this.db.execute<{ id: number; slug: string; title: string }>(sql`
      with c as (
        (select a.id from articles a where ${audienceFilter(reader)} and a.title ilike ${like} limit 50)
        union
        (select a.id from articles a where ${audienceFilter(reader)} and ${text} <% a.title limit 50)
      )
      select a.id, a.slug, a.title from c join articles a on a.id = c.id
       order by word_similarity(${text}, a.title) desc, a.title
       limit ${limit}`);
    return result.rows;
  }
}
