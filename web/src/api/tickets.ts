import type {
  Attachment,
  EquipmentModel,
  Message,
  Ticket,
  TicketCreate,
  TicketStatus,
  TicketUpdate,
} from '@shared/schemas/tickets';
import type { WriteUpCreate, WriteUpLink, WriteUpResult } from '@shared/schemas/writeUp';
import { http, type Query, type UploadOptions } from './http';

export interface TicketListParams extends Query {
  status?: TicketStatus | 'active';
  assignee?: 'me' | 'none';
  q?: string;
  page?: number;
  pageSize?: number;
}

/** What the create form sends (the server fills in defaults and checks it). */
export interface TicketDraft {
  subject: string;
  description?: string;
  equipmentModelId?: number;
  modelText?: string;
  serial?: string;
  fuel: TicketCreate['fuel'];
  urgency: TicketCreate['urgency'];
}

export interface MessageDraft {
  body: string;
  clientId: string;
  kind?: 'message' | 'internal-note';
  attachmentIds?: number[];
}

export const ticketsApi = {
  /** GET /api/tickets: the tickets this person may see. */
  list: (params: TicketListParams, signal?: AbortSignal) =>
    http.get<{ items: Ticket[]; total: number }>('/tickets', params, signal),
  get: (id: number, signal?: AbortSignal) =>
    http.get<{ ticket: Ticket }>(`/tickets/${id}`, undefined, signal),
  create: (draft: TicketDraft) => http.post<{ ticket: Ticket }>('/tickets', draft),
  update: (id: number, change: TicketUpdate) => http.patch<{ ticket: Ticket }>(`/tickets/${id}`, change),
  claim: (id: number) => http.post<{ ticket: Ticket }>(`/tickets/${id}/claim`),
  /** POST /api/tickets/:id/attachments: photos and PDFs, sent as multipart field `files`. */
  upload: (id: number, files: readonly File[], options?: UploadOptions) => {
    const form = new FormData();
    for (const file of files) form.append('files', file);
    return http.upload<{ attachments: Attachment[] }>(`/tickets/${id}/attachments`, form, options);
  },
  messages: (id: number, after?: number, signal?: AbortSignal) =>
    http.get<{ items: Message[] }>(`/tickets/${id}/messages`, { after }, signal),
  sendMessage: (id: number, draft: MessageDraft) =>
    http.post<{ message: Message }>(`/tickets/${id}/messages`, draft),
  /** PATCH /api/tickets/:id/messages/:messageId (staff): part of the answer, or not. */
  markMessage: (id: number, messageId: number, partOfAnswer: boolean) =>
    http.patch<{ message: Message }>(`/tickets/${id}/messages/${messageId}`, { partOfAnswer }),
  /** POST /api/tickets/:id/write-up (staff, resolved tickets) → 201, a draft article in review. */
  writeUp: (id: number, input: Partial<WriteUpCreate>) =>
    http.post<WriteUpResult>(`/tickets/${id}/write-up`, input),
  /** GET /api/tickets/:id/write-ups: the articles this ticket became, that this reader may open. */
  writeUps: (id: number, signal?: AbortSignal) =>
    http.get<{ items: WriteUpLink[] }>(`/tickets/${id}/write-ups`, undefined, signal),
};

export const equipmentApi = {
  /** GET /api/equipment: catalogue models matching the search. */
  search: (q: string, signal?: AbortSignal) =>
    http.get<{ items: EquipmentModel[] }>('/equipment', { q }, signal),
};
