import type { DeskBranch, DeskMember } from '@shared/schemas/desk';
import type { Ticket, TicketStatus, Urgency } from '@shared/schemas/tickets';
import { http } from './http';

/** The desk board's query: every filter the ticket list takes. */
export interface DeskBoardParams {
  status?: TicketStatus | 'active';
  urgency?: Urgency;
  branchId?: number;
  assignee?: 'me' | 'none';
  q?: string;
  page: number;
  pageSize: number;
}

export const deskApi = {
  /** GET /api/desk/branches — staff: branches a ticket can be transferred to. */
  branches: (signal?: AbortSignal) => http.get<{ items: DeskBranch[] }>('/desk/branches', undefined, signal),
  /** GET /api/desk/members — staff: the people on the desk, to assign a ticket to. */
  members: (signal?: AbortSignal) => http.get<{ items: DeskMember[] }>('/desk/members', undefined, signal),
  /** GET /api/tickets with the board's filters. */
  board: (params: DeskBoardParams, signal?: AbortSignal) =>
    http.get<{ items: Ticket[]; total: number }>('/tickets', { ...params }, signal),
};
