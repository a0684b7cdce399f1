import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import type { SearchQuery } from '../../../../shared/src/index';
import { groupQuery, type QueryGroup } from './query';
import type { EngineResult, SearchEngine, SearchReader } from './search.engine';

/** The most rows one pass ranks; totals and facets count up to it (shown as "1,000+" by screens). */
export const CANDIDATES = 1000;

/** What the reader may find, inside the query: contractors only published contractor articles. */
function audienceFilter(reader: SearchReader): SQL {
  return reader.role === 'contractor'
    ? sql`a.status = 'published' and a.audience = 'contractor'`
    : sql`a.status = 'published'`;
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

  // Read again at most every 30 s: a specialist's edit shows up within half a minute on every instance.
  private cached: { at: number; groups: string[][] } | undefined;
  private async synonyms(): Promise<string[][]> {
    if (this.cached && Date.now() - this.cached.at < 30_000) return this.cached.groups;
    const { rows } = await this.db.$client.query<{ terms: string[] }>('select terms from search_synonyms');
    this.cached = { at: Date.now(), groups: rows.map((r) => r.terms) };
    return this.cached.groups;
  }

  /** Adds the nearest known word to each single-word group that the articles never use (typos). */
  private async correct(groups: QueryGroup[]): Promise<QueryGroup[]> {
    const words = groups
      .filter((g) => g.terms.length === 1 && !g.prefix && /^[a-z]{4,}$/.test(g.terms[0]!))
      .map((g) => g.terms[0]!);
    if (words.length === 0) return groups;
    const { rows } = await this.db.$client.query<{ typed: string; word: string | null; known: boolean }>(
      `select t.typed,
              exists(select 1 from search_words w where w.word = t.typed) as known,
              (select w.word from search_words w where w.word % t.typed order by similarity(w.word, t.typed) desc limit 1) as word
         from unnest($1::text[]) as t(typed)`,
      [words],
    );
    const fix = new Map(rows.filter((r) => !r.known && r.word).map((r) => [r.typed, r.word!]));
    return groups.map((g) =>
      g.terms.length === 1 && fix.has(g.terms[0]!)
        ? { ...g, terms: [g.terms[0]!, fix.get(g.terms[0]!)!] }
        : g,
    );
  }

  async search(reader: SearchReader, q: SearchQuery): Promise<EngineResult> {
    const groups = await this.correct(groupQuery(q.q, await this.synonyms()));
    if (groups.length === 0) return { hits: [], total: 0, facets: { kind: {} } };
    const all = sql.join(groups.map(groupTsquery), sql` && `);
    const any = sql.join(groups.map(groupTsquery), sql` || `);
    const filters: SQL[] = [audienceFilter(reader)];
    if (q.equipmentType || q.brand || q.fuel) {
      const conds: SQL[] = [];
      if (q.equipmentType) conds.push(sql`m.type::text = ${q.equipmentType}`);
      if (q.brand) conds.push(sql`lower(m.brand) = lower(${q.brand})`);
      if (q.fuel) conds.push(sql`${q.fuel}::fuel = any(m.fuels)`);
      filters.push(sql`exists (select 1 from article_models am join equipment_models m on m.id = am.equipment_model_id
        where am.article_id = a.id and ${sql.join(conds, sql` and `)})`);
    }
    // Articles matching every idea come first; only when there are too few of them does the
    // search widen to articles matching some ideas. Ranking then touches few rows.
    const strict = await this.run(all, all, filters, q);
    if (strict.total >= q.offset + q.limit || groups.length === 1) return strict;
    const wide = await this.run(any, all, filters, q);
    return wide.total > strict.total ? wide : strict;
  }

  /** One pass: the matches, their rank, the page with snippets, the total and the facets. */
  private async run(match: SQL, all: SQL, filters: SQL[], q: SearchQuery): Promise<EngineResult> {
    const base = sql.join(filters, sql` and `);
    const result = await this.db.execute<{
      id: number;
      slug: string;
      title: string;
      summary: string;
      kind: string;
      audience: string;
      score: number;
      snippet: string;
      total: number;
      facets: Record<string, number>;
    }>(sql`
      with q as (select ${match} as match_q, ${all} as all_q),
      candidates as (
        -- Ranking reads every candidate's vector: past CANDIDATES rows the order is already
        -- settled by the strict pass above, so the widened pass ranks a bounded set.
        select a.id, a.kind, a.updated_at, a.search_vector
          from articles a, q
         where ${base} and a.search_vector @@ q.match_q
         limit ${CANDIDATES}
      ),
      matched as (
        select c.id, c.kind, c.updated_at,
               (case when c.search_vector @@ q.all_q then 1 else 0 end) + ts_rank_cd(c.search_vector, q.match_q, 1) as score
          from candidates c, q
      ),
      facets as (select coalesce(jsonb_object_agg(kind, n), '{}') as f from (select kind, count(*)::int as n from matched group by kind) k),
      page as (
        select m.* from matched m ${q.kind ? sql`where m.kind = ${q.kind}` : sql``}
         order by m.score desc, m.updated_at desc limit ${q.limit} offset ${q.offset}
      )
      select a.id, a.slug, a.title, a.summary, a.kind, a.audience, round(p.score::numeric, 4)::float8 as score,
             ts_headline('english', a.body, q.match_q, 'MaxFragments=1, MaxWords=28, MinWords=10, StartSel=⟦, StopSel=⟧') as snippet,
             (select count(*)::int from matched m ${q.kind ? sql`where m.kind = ${q.kind}` : sql``}) as total,
             (select f from facets) as facets
        from page p join articles a on a.id = p.id, q
       order by p.score desc, p.updated_at desc`);
    const first = result.rows[0];
    return {
      hits: result.rows.map(({ total: _t, facets: _f, ...h }) => ({
        ...h,
        kind: h.kind as never,
        audience: h.audience as never,
      })),
      total: first?.total ?? 0,
      facets: { kind: first?.facets ?? {} },
    };
  }

  async suggest(reader: SearchReader, text: string, limit: number) {
    const like = `%${text.replace(/[\\%_]/g, '\\$&')}%`;
    // Two small candidate sets from the trigram index (contains, or close to), then the best few.
    // `<%` uses the index at pg_trgm's word-similarity threshold; 0.45 lets one slip per word through.
    const result = await this.db.transaction(async (tx) => {
      await tx.execute(sql`select set_config('pg_trgm.word_similarity_threshold', '0.45', true)`);
      return tx.execute<{ id: number; slug: string; title: string }>(sql`
      with c as (
        (select a.id from articles a where ${audienceFilter(reader)} and a.title ilike ${like} limit 50)
        union
        (select a.id from articles a where ${audienceFilter(reader)} and ${text} <% a.title limit 50)
      )
      select a.id, a.slug, a.title from c join articles a on a.id = c.id
       order by word_similarity(${text}, a.title) desc, a.title
       limit ${limit}`);
    });
    return result.rows;
  }
}
