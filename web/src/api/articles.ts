import type {
  Article,
  ArticleCreate,
  ArticleKind,
  ArticleStatus,
  ArticleSummary,
  ArticleUpdate,
  Audience,
  SearchResponse,
} from '@shared/schemas/articles';
import { http, type Query } from './http';

export interface ArticleListParams extends Query {
  q?: string;
  kind?: ArticleKind;
  status?: ArticleStatus;
  audience?: Audience;
  equipmentModelId?: number;
  page?: number;
  pageSize?: number;
}

export interface SearchParams extends Query {
  q?: string;
  kind?: ArticleKind;
  equipmentType?: string;
  brand?: string;
  fuel?: 'natural-gas' | 'propane';
  limit?: number;
  offset?: number;
  context?: 'kb' | 'new-ticket' | 'desk';
}

export interface ArticleRevision {
  id: number;
  title: string;
  summary: string;
  body: string;
  note: string | null;
  author: { id: number; name: string } | null;
  createdAt: string;
}

export interface MissedSearch {
  text: string;
  times: number;
  last: string;
}

type One = { article: Article };

/** Knowledge-base articles: reading, writing and the review steps. */
export const articlesApi = {
  /** GET /api/articles: what this reader may see. */
  list: (params: ArticleListParams, signal?: AbortSignal) =>
    http.get<{ items: ArticleSummary[]; total: number }>('/articles', params, signal),
  /** GET /api/articles/:slug → 404 when the reader may not see it. */
  get: (slug: string, signal?: AbortSignal) => http.get<One>(`/articles/${slug}`, undefined, signal),
  /** POST /api/articles → 201, a draft (staff). */
  create: (draft: ArticleCreate) => http.post<One>('/articles', draft),
  /** PATCH /api/articles/:id: a new revision. */
  update: (id: number, change: ArticleUpdate) => http.patch<One>(`/articles/${id}`, change),
  submit: (id: number) => http.post<One>(`/articles/${id}/submit`),
  publish: (id: number) => http.post<One>(`/articles/${id}/publish`),
  retire: (id: number) => http.post<One>(`/articles/${id}/retire`),
  sendBack: (id: number, note: string) => http.post<One>(`/articles/${id}/send-back`, { note }),
  revisions: (id: number, signal?: AbortSignal) =>
    http.get<{ items: ArticleRevision[] }>(`/articles/${id}/revisions`, undefined, signal),
  feedback: (id: number, helped: boolean, comment?: string) =>
    http.post<unknown>(`/articles/${id}/feedback`, comment ? { helped, comment } : { helped }),
};

/** Search over the knowledge base, and what came of a search. */
export const searchApi = {
  /** GET /api/search */
  search: (params: SearchParams, signal?: AbortSignal) => http.get<SearchResponse>('/search', params, signal),
  /** GET /api/search/suggest */
  suggest: (q: string, signal?: AbortSignal) =>
    http.get<{ items: { id: number; slug: string; title: string }[] }>('/search/suggest', { q }, signal),
  /** POST /api/search/:queryId/outcome → 204 */
  outcome: (queryId: number, articleId: number, deflected: boolean) =>
    http.post<void>(`/search/${queryId}/outcome`, { articleId, deflected }),
  /** GET /api/search/missed (specialist/admin) */
  missed: (days: number, signal?: AbortSignal) =>
    http.get<{ items: MissedSearch[] }>('/search/missed', { days }, signal),
};
