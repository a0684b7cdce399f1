import type { Snippet } from '@shared/schemas/tickets';
import { http } from './http';

export interface SnippetDraft {
  title: string;
  body: string;
  shared: boolean;
}

/** Reply snippets (staff): my own and the desk's shared ones. */
export const snippetsApi = {
  /** GET /api/snippets */
  list: (signal?: AbortSignal) => http.get<{ items: Snippet[] }>('/snippets', undefined, signal),
  /** POST /api/snippets → 201 */
  create: (draft: SnippetDraft) => http.post<{ snippet: Snippet }>('/snippets', draft),
  /** PATCH /api/snippets/:id */
  update: (id: number, change: Partial<SnippetDraft>) =>
    http.patch<{ snippet: Snippet }>(`/snippets/${id}`, change),
  /** DELETE /api/snippets/:id → 204 */
  remove: (id: number) => http.delete<void>(`/snippets/${id}`),
};
