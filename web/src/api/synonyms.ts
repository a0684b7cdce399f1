import type { SearchSynonym, SynonymList } from '@shared/schemas/search';
import { http } from './http';

type One = { synonym: SearchSynonym };

/** Groups of words search treats as the same (specialists and admins). */
export const synonymsApi = {
  /** GET /api/search/synonyms */
  list: (signal?: AbortSignal) => http.get<SynonymList>('/search/synonyms', undefined, signal),
  /** POST /api/search/synonyms {terms} → 201 */
  create: (terms: string[]) => http.post<One>('/search/synonyms', { terms }),
  /** PATCH /api/search/synonyms/:id {terms} */
  update: (id: number, terms: string[]) => http.patch<One>(`/search/synonyms/${id}`, { terms }),
  /** DELETE /api/search/synonyms/:id → 204 */
  remove: (id: number) => http.delete<void>(`/search/synonyms/${id}`),
};
