import type { SearchFacets, SearchHit, SearchQuery } from '../../../../shared/src/index';

/** Who is searching: the audience filter happens inside the engine's query, never afterwards. */
export interface SearchReader {
  id: number;
  role: string;
}

export interface EngineResult {
  hits: SearchHit[];
  total: number;
  /** More matched than `total` and the facets count (the PostgreSQL engine ranks a bounded set). */
  totalIsLowerBound?: boolean;
  facets: SearchFacets;
}

export const noFacets = (): SearchFacets => ({ kind: {}, equipmentType: {}, brand: {}, fuel: {} });

/** One interface, two engines: PostgreSQL (embedded, tests) and Meilisearch (production). */
export interface SearchEngine {
  readonly name: 'postgres' | 'meilisearch';
  search(reader: SearchReader, q: SearchQuery): Promise<EngineResult>;
  suggest(
    reader: SearchReader,
    q: string,
    limit: number,
  ): Promise<{ id: number; slug: string; title: string }[]>;
}
