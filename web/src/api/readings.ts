import type { Reading, ReadingCreate } from '@shared/schemas/readings';
import { http } from './http';

export const readingsApi = {
  /** GET /api/tickets/:id/readings: this ticket's readings, with their check results. */
  list: (ticketId: number, signal?: AbortSignal) =>
    http.get<{ items: Reading[] }>(`/tickets/${ticketId}/readings`, undefined, signal),
  /** POST /api/tickets/:id/readings: runs the check, stores it and posts its card into the chat. */
  create: (ticketId: number, reading: ReadingCreate) =>
    http.post<{ reading: Reading }>(`/tickets/${ticketId}/readings`, reading),
};
