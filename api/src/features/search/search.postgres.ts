import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import type { SearchQuery } from '../../../../shared/src/index';
import { groupQuery, type QueryGroup } from './query';
import type { EngineResult, SearchEngine, SearchReader } from './search.engine';

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

  private async synonyms(): Promise<string[][]> {
    const { rows } = await this.db.$client.query<{ terms: string[] }>('select terms from search_synonyms');
    return rows.map((r) => r.terms);
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
    const base = sql.join(filters, sql` and `);
    const kindFilter = q.kind ? sql` and a.kind = ${q.kind}` : sql``;
    // Every idea matched ranks first; articles matching only some ideas follow, by weight.
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
    }>(sql`
      with q as (select ${all} as all_q, ${any} as any_q),
      matched as (
        select a.id, a.kind,
               (case when a.search_vector @@ q.all_q then 1 else 0 end)
               + ts_rank_cd(a.search_vector, q.any_q, 1) as score
          from articles a, q
         where ${base} and a.search_vector @@ q.any_q
      )
      select a.id, a.slug, a.title, a.summary, a.kind, a.audience, round(m.score::numeric, 4)::float8 as score,
             ts_headline('english', a.body, q.any_q, 'MaxFragments=1, MaxWords=28, MinWords=10, StartSel=⟦, StopSel=⟧') as snippet,
             count(*) over ()::int as total
        from matched m join articles a on a.id = m.id, q
       where true ${kindFilter}
       order by m.score desc, a.updated_at desc
       limit ${q.limit} offset ${q.offset}`);
    const facets = await this.db.execute<{ kind: string; n: number }>(sql`
      select a.kind, count(*)::int as n from articles a
       where ${base} and a.search_vector @@ (${any}) group by a.kind`);
    return {
      hits: result.rows.map(({ total: _t, ...h }) => ({
        ...h,
        kind: h.kind as never,
        audience: h.audience as never,
      })),
      total: result.rows[0]?.total ?? 0,
      facets: { kind: Object.fromEntries(facets.rows.map((f) => [f.kind, f.n])) },
    };
  }

  async suggest(reader: SearchReader, text: string, limit: number) {
    const result = await this.db.execute<{ id: number; slug: string; title: string }>(sql`
      select a.id, a.slug, a.title from articles a
       where ${audienceFilter(reader)}
         and (a.title ilike ${`%${text.replace(/[\\%_]/g, '\\$&')}%`} or word_similarity(${text}, a.title) > 0.35)
       order by word_similarity(${text}, a.title) desc, a.title
       limit ${limit}`);
    return result.rows;
  }
}
