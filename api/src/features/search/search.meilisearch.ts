import {
  Meilisearch,
  type MultiSearchParams,
  type MultiSearchQuery,
  type Settings,
  type Task,
} from 'meilisearch';
import type { ArticleKind, Audience, SearchFacets, SearchQuery } from '../../../../shared/src/index';
import { noFacets, type EngineResult, type SearchEngine, type SearchReader } from './search.engine';
import type { SearchDocument } from './search.repository';

export interface MeiliOptions {
  url: string;
  apiKey?: string;
  index: string;
  /** How long a search may take before PostgreSQL answers instead. */
  searchTimeoutMs?: number;
}

/** The filters a reader can choose; each is also a facet. */
const FACETS = ['kind', 'equipmentType', 'brand', 'fuel'] as const;
type Facet = (typeof FACETS)[number];

/** Index settings: what is searched (in this order of weight), filtered, sorted, and the synonyms. */
export function indexSettings(synonymGroups: string[][]): Settings {
  return {
    searchableAttributes: ['title', 'summary', 'models', 'body'],
    filterableAttributes: ['kind', 'audience', 'status', 'equipmentType', 'brand', 'fuel'],
    sortableAttributes: ['updatedAt'],
    // Ties go to the article changed last, as in the PostgreSQL engine.
    rankingRules: ['words', 'typo', 'proximity', 'attribute', 'sort', 'exactness', 'updatedAt:desc'],
    synonyms: synonymMap(synonymGroups),
    typoTolerance: { enabled: true },
    // Totals count up to 1,000, like the PostgreSQL engine's candidate set.
    pagination: { maxTotalHits: 1000 },
    faceting: { maxValuesPerFacet: 100 },
  };
}

/** Each group → every term maps to all the others (terms in two groups get both). */
export function synonymMap(groups: string[][]): Record<string, string[]> {
  const map = new Map<string, Set<string>>();
  for (const group of groups) {
    const terms = [...new Set(group.map((t) => t.trim().toLowerCase()).filter(Boolean))];
    for (const term of terms) {
      const others = map.get(term) ?? new Set<string>();
      for (const other of terms) if (other !== term) others.add(other);
      map.set(term, others);
    }
  }
  return Object.fromEntries([...map].filter(([, o]) => o.size > 0).map(([t, o]) => [t, [...o].sort()]));
}

/** A value inside a filter expression: double-quoted, with quotes and backslashes escaped. */
const quoted = (value: string) => `"${value.replace(/["\\]/g, '\\$&')}"`;

/** What the reader may find, as filter clauses: contractors only published contractor articles. */
function audienceClauses(reader: SearchReader): string[] {
  return reader.role === 'contractor'
    ? ['status = "published"', 'audience = "contractor"']
    : ['status = "published"'];
}

interface HitDoc {
  id: number;
  slug: string;
  title: string;
  summary: string;
  kind: ArticleKind;
  audience: Audience;
  _formatted?: { body?: string };
  _rankingScore?: number;
}

export class MeiliSearchEngine implements SearchEngine {
  readonly name = 'meilisearch' as const;
  /** For searches: a short timeout, since PostgreSQL can answer instead. */
  private readonly reader: Meilisearch;
  /** For indexing and settings, which may take longer and are retried by the job queue. */
  private readonly writer: Meilisearch;
  readonly indexUid: string;

  constructor(options: MeiliOptions) {
    const base = { host: options.url, apiKey: options.apiKey, clientAgents: ['lightoff'] };
    this.reader = new Meilisearch({ ...base, timeout: options.searchTimeoutMs ?? 1000 });
    this.writer = new Meilisearch({ ...base, timeout: 10_000 });
    this.indexUid = options.index;
  }

  async search(reader: SearchReader, q: SearchQuery): Promise<EngineResult> {
    if (!q.q.trim()) return { hits: [], total: 0, facets: noFacets() };
    const chosen: Partial<Record<Facet, string>> = {
      kind: q.kind,
      equipmentType: q.equipmentType,
      brand: q.brand,
      fuel: q.fuel,
    };
    const filterWithout = (left?: Facet) =>
      [
        ...audienceClauses(reader),
        ...FACETS.filter((f) => f !== left && chosen[f]).map((f) => `${f} = ${quoted(chosen[f]!)}`),
      ].join(' AND ');
    const set = FACETS.filter((f) => chosen[f]);
    // The hits with every filter; each chosen filter's facet is counted again without that filter,
    // so its other values keep their counts. All in one multi-search request.
    const queries: MultiSearchQuery[] = [
      {
        indexUid: this.indexUid,
        q: q.q,
        filter: filterWithout(),
        facets: FACETS.filter((f) => !chosen[f]),
        limit: q.limit,
        offset: q.offset,
        attributesToRetrieve: ['id', 'slug', 'title', 'summary', 'kind', 'audience'],
        attributesToHighlight: ['body'],
        attributesToCrop: ['body'],
        cropLength: 28,
        cropMarker: '…',
        highlightPreTag: '⟦',
        highlightPostTag: '⟧',
        showRankingScore: true,
      },
      ...set.map((f) => ({
        indexUid: this.indexUid,
        q: q.q,
        filter: filterWithout(f),
        facets: [f],
        limit: 0,
      })),
    ];
    const { results } = await this.reader.multiSearch<MultiSearchParams, HitDoc>({ queries });
    const [main, ...others] = results;
    if (!main) throw new Error('Meilisearch answered a search without results');
    const facets: SearchFacets = noFacets();
    for (const result of [main, ...others])
      for (const [facet, counts] of Object.entries(result.facetDistribution ?? {}))
        if ((FACETS as readonly string[]).includes(facet)) facets[facet as Facet] = { ...counts };
    return {
      hits: main.hits.map((h) => ({
        id: h.id,
        slug: h.slug,
        title: h.title,
        summary: h.summary,
        kind: h.kind,
        audience: h.audience,
        snippet: h._formatted?.body ?? '',
        score: Math.round((h._rankingScore ?? 0) * 10_000) / 10_000,
      })),
      total: main.estimatedTotalHits ?? main.totalHits ?? main.hits.length,
      facets,
    };
  }

  async suggest(reader: SearchReader, text: string, limit: number) {
    const result = await this.reader.index<HitDoc>(this.indexUid).search(text, {
      attributesToSearchOn: ['title'],
      attributesToRetrieve: ['id', 'slug', 'title'],
      filter: audienceClauses(reader).join(' AND '),
      limit,
    });
    return result.hits.map((h) => ({ id: h.id, slug: h.slug, title: h.title }));
  }

  /** Whether Meilisearch answers its health check within the search timeout. */
  async healthy(): Promise<boolean> {
    try {
      return (await this.reader.health()).status === 'available';
    } catch {
      return false;
    }
  }

  /** Applies the index settings (creating the index if needed) and waits until they are in force. */
  async applySettings(synonymGroups: string[][]): Promise<void> {
    succeeded(
      await this.writer.index(this.indexUid).updateSettings(indexSettings(synonymGroups)).waitTask(WAIT),
    );
  }

  async upsert(docs: SearchDocument[]): Promise<void> {
    if (docs.length === 0) return;
    succeeded(await this.writer.index(this.indexUid).addDocuments(docs, { primaryKey: 'id' }).waitTask(WAIT));
  }

  async remove(ids: number[]): Promise<void> {
    if (ids.length === 0) return;
    succeeded(await this.writer.index(this.indexUid).deleteDocuments(ids).waitTask(WAIT));
  }

  async documentCount(): Promise<number> {
    return (await this.writer.index(this.indexUid).getStats()).numberOfDocuments;
  }

  /** The ids the index holds, a page at a time (the reindex finds what to delete). */
  async *indexedIds(pageSize = 1000): AsyncGenerator<number[]> {
    for (let offset = 0; ; offset += pageSize) {
      const page = await this.writer
        .index<{ id: number }>(this.indexUid)
        .getDocuments({ fields: ['id'], limit: pageSize, offset });
      if (page.results.length === 0) return;
      yield page.results.map((d) => Number(d.id));
      if (page.results.length < pageSize) return;
    }
  }
}

const WAIT = { timeout: 60_000, interval: 100 };

/** A task that Meilisearch took but could not do is an error (the job queue retries it). */
function succeeded(task: Task): void {
  if (task.status !== 'succeeded')
    throw new Error(
      `Meilisearch task ${task.uid} (${task.type}) ${task.status}: ${task.error?.message ?? ''}`,
    );
}
