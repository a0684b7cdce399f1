import { asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import { searchSynonyms } from '../../db/schema/index';
import type { ArticleKind, Audience, SearchSynonym } from '../../../../shared/src/index';

/** What the Meilisearch index holds for one published article. */
export interface SearchDocument {
  id: number;
  slug: string;
  title: string;
  summary: string;
  body: string;
  kind: ArticleKind;
  audience: Audience;
  status: 'published';
  /** Model numbers of the linked equipment, with and without dashes (see `modelSearchText`). */
  models: string[];
  equipmentType: string[];
  brand: string[];
  fuel: string[];
  /** Epoch milliseconds, so the index can sort on it. */
  updatedAt: number;
}

type DocumentRow = {
  id: number;
  slug: string;
  title: string;
  summary: string;
  body: string;
  kind: ArticleKind;
  audience: Audience;
  model_text: string;
  types: string[];
  brands: string[];
  fuels: string[];
  updated_ms: string;
};

const toDocument = (r: DocumentRow): SearchDocument => ({
  id: r.id,
  slug: r.slug,
  title: r.title,
  summary: r.summary,
  body: r.body,
  kind: r.kind,
  audience: r.audience,
  status: 'published',
  models: r.model_text.split(/\s+/).filter(Boolean),
  equipmentType: r.types,
  brand: r.brands,
  fuel: r.fuels,
  updatedAt: Number(r.updated_ms),
});

/** Published articles with their models' types, brands and fuels, in id order, `after` an id. */
async function publishedDocuments(db: Executor, where: ReturnType<typeof sql>, limit: number) {
  const { rows } = await db.execute<DocumentRow>(sql`
    select a.id, a.slug, a.title, a.summary, a.body, a.kind, a.audience, a.model_text,
           (extract(epoch from a.updated_at) * 1000)::bigint::text as updated_ms,
           array(select distinct m.type::text from article_models am join equipment_models m on m.id = am.equipment_model_id
                  where am.article_id = a.id order by 1) as types,
           array(select distinct m.brand from article_models am join equipment_models m on m.id = am.equipment_model_id
                  where am.article_id = a.id order by 1) as brands,
           array(select distinct f::text from article_models am join equipment_models m on m.id = am.equipment_model_id,
                  unnest(m.fuels) as f where am.article_id = a.id order by 1) as fuels
      from articles a
     where a.status = 'published' and ${where}
     order by a.id
     limit ${limit}`);
  return rows.map(toDocument);
}

/** The article's document when it is published; null when it is not (or no longer exists). */
export async function searchDocument(db: Executor, articleId: number): Promise<SearchDocument | null> {
  const [doc] = await publishedDocuments(db, sql`a.id = ${articleId}`, 1);
  return doc ?? null;
}

/** Every published article, a batch at a time (the reindex). */
export async function* allSearchDocuments(db: Executor, batchSize = 500): AsyncGenerator<SearchDocument[]> {
  for (let after = 0; ;) {
    const batch = await publishedDocuments(db, sql`a.id > ${after}`, batchSize);
    if (batch.length === 0) return;
    yield batch;
    after = batch[batch.length - 1]!.id;
  }
}

const synonymColumns = {
  id: searchSynonyms.id,
  terms: searchSynonyms.terms,
  updatedAt: isoTime(searchSynonyms.updatedAt),
};

export function listSynonyms(db: Executor): Promise<SearchSynonym[]> {
  return db.select(synonymColumns).from(searchSynonyms).orderBy(asc(searchSynonyms.id));
}

export async function findSynonym(db: Executor, id: number): Promise<SearchSynonym | undefined> {
  const [row] = await db.select(synonymColumns).from(searchSynonyms).where(eq(searchSynonyms.id, id));
  return row;
}

export async function insertSynonym(db: Executor, terms: string[]): Promise<SearchSynonym> {
  const [row] = await db.insert(searchSynonyms).values({ terms }).returning(synonymColumns);
  return row!;
}

export async function updateSynonym(db: Executor, id: number, terms: string[]) {
  const [row] = await db
    .update(searchSynonyms)
    .set({ terms, updatedAt: new Date() })
    .where(eq(searchSynonyms.id, id))
    .returning(synonymColumns);
  return row;
}

export async function deleteSynonym(db: Executor, id: number): Promise<boolean> {
  const rows = await db
    .delete(searchSynonyms)
    .where(eq(searchSynonyms.id, id))
    .returning({ id: searchSynonyms.id });
  return rows.length > 0;
}

/** The synonym groups as plain term lists, for the engines. */
export async function synonymGroups(db: Executor): Promise<string[][]> {
  const rows = await db.select({ terms: searchSynonyms.terms }).from(searchSynonyms);
  return rows.map((r) => r.terms);
}

/** Rebuilds the word list that typo correction looks in, from the published articles. */
export async function refreshSearchWords(db: Executor): Promise<{ before: number; after: number }> {
  return db.transaction(async (tx) => {
    const count = async () =>
      (await tx.execute<{ n: number }>(sql`select count(*)::int as n from search_words`)).rows[0]!.n;
    const before = await count();
    await tx.execute(sql`delete from search_words`);
    // The same words `recordWords` takes from an article as it is published.
    await tx.execute(sql`
      insert into search_words (word)
      select distinct w[1] from articles a,
             regexp_matches(lower(a.title || ' ' || a.summary || ' ' || a.body), '[a-z][a-z0-9]{3,29}', 'g') as w
       where a.status = 'published'
      on conflict do nothing`);
    return { before, after: await count() };
  });
}
