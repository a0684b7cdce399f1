import type { LocationQuery, LocationQueryRaw } from 'vue-router';
import type { Ticket, TicketStatus, Urgency } from '@shared/schemas/tickets';
import type { DeskBoardParams } from '@/api/desk';
import { matchesStatus } from './ticketMerge';

// The schemas' lists, repeated here so the board does not load zod for three arrays.
export const BOARD_STATUSES = [
  'active',
  'new',
  'open',
  'waiting-on-contractor',
  'resolved',
  'closed',
  'all',
] as const;
export const BOARD_URGENCIES = ['emergency', 'job-held', 'question'] as const satisfies readonly Urgency[];
export const BOARD_ASSIGNEES = ['me', 'none'] as const;
export const BOARD_PAGE_SIZE = 25;

export type BoardStatus = (typeof BOARD_STATUSES)[number];

/** What the board shows; '' / null mean "any". Lives in the URL so a reload keeps it. */
export interface BoardFilters {
  status: BoardStatus;
  urgency: Urgency | '';
  branchId: number | null;
  assignee: 'me' | 'none' | '';
  q: string;
  page: number;
}

export const DEFAULT_FILTERS: Readonly<BoardFilters> = Object.freeze({
  status: 'active',
  urgency: '',
  branchId: null,
  assignee: '',
  q: '',
  page: 1,
});

const first = (value: LocationQuery[string] | undefined): string => {
  const v = Array.isArray(value) ? value[0] : value;
  return typeof v === 'string' ? v : '';
};
const oneOf = <T extends string>(list: readonly T[], value: string): T | undefined =>
  (list as readonly string[]).includes(value) ? (value as T) : undefined;
const positiveInt = (value: string): number | null => {
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : null;
};

/** The filters a URL asks for; anything unknown or malformed falls back to the default. */
export function filtersFromQuery(query: LocationQuery): BoardFilters {
  return {
    status: oneOf(BOARD_STATUSES, first(query.status)) ?? DEFAULT_FILTERS.status,
    urgency: oneOf(BOARD_URGENCIES, first(query.urgency)) ?? '',
    branchId: positiveInt(first(query.branch)),
    assignee: oneOf(BOARD_ASSIGNEES, first(query.assignee)) ?? '',
    q: first(query.q).trim().slice(0, 100),
    page: positiveInt(first(query.page)) ?? 1,
  };
}

/** The URL query for the filters, leaving out every default so a plain board has a plain URL. */
export function queryFromFilters(f: BoardFilters): LocationQueryRaw {
  const query: LocationQueryRaw = {};
  if (f.status !== DEFAULT_FILTERS.status) query.status = f.status;
  if (f.urgency) query.urgency = f.urgency;
  if (f.branchId) query.branch = String(f.branchId);
  if (f.assignee) query.assignee = f.assignee;
  if (f.q.trim()) query.q = f.q.trim();
  if (f.page > 1) query.page = String(f.page);
  return query;
}

/** The API query for the filters. */
export function paramsFromFilters(f: BoardFilters, pageSize = BOARD_PAGE_SIZE): DeskBoardParams {
  const params: DeskBoardParams = { page: f.page, pageSize };
  if (f.status !== 'all') params.status = f.status;
  if (f.urgency) params.urgency = f.urgency;
  if (f.branchId) params.branchId = f.branchId;
  if (f.assignee) params.assignee = f.assignee;
  if (f.q.trim()) params.q = f.q.trim();
  return params;
}

/** Whether the filters narrow the board beyond its default (so "nothing here" means "nothing matches"). */
export const isFiltered = (f: BoardFilters): boolean =>
  f.status !== DEFAULT_FILTERS.status || !!f.urgency || !!f.branchId || !!f.assignee || !!f.q.trim();

/** The same test the server's list applies (search: part of subject, number, serial, model or company). */
export function matchesFilters(ticket: Ticket, f: BoardFilters, userId: number | null): boolean {
  if (f.status !== 'all' && !matchesStatus(ticket, f.status as TicketStatus | 'active')) return false;
  if (f.urgency && ticket.urgency !== f.urgency) return false;
  if (f.branchId && ticket.branchId !== f.branchId) return false;
  if (f.assignee === 'none' && ticket.assignee) return false;
  if (f.assignee === 'me' && (userId === null || ticket.assignee?.id !== userId)) return false;
  const q = f.q.trim().toLowerCase();
  if (!q) return true;
  return [
    ticket.subject,
    ticket.number,
    ticket.serial,
    ticket.modelText,
    ticket.equipmentModel?.modelNumber,
    ticket.accountCompany,
  ].some((field) => field?.toLowerCase().includes(q));
}

const URGENCY_RANK: Record<Urgency, number> = { emergency: 0, 'job-held': 1, question: 2 };

/** The server's order: most urgent first, then newest. */
export function boardOrder(a: Ticket, b: Ticket): number {
  return URGENCY_RANK[a.urgency] - URGENCY_RANK[b.urgency] || b.createdAt.localeCompare(a.createdAt);
}

type BoardPage = { items: Ticket[]; total: number };

/**
 * One page of the board after a live change. A ticket that stops matching leaves it; one that
 * starts matching goes where the server would put it, if that is on this page; the page never
 * grows past its size. The total counts it either way.
 */
export function mergeBoardTicket(
  list: BoardPage,
  ticket: Ticket,
  f: BoardFilters,
  userId: number | null,
  pageSize = BOARD_PAGE_SIZE,
): BoardPage {
  const had = list.items.some((t) => t.id === ticket.id);
  const rest = list.items.filter((t) => t.id !== ticket.id);
  if (!matchesFilters(ticket, f, userId)) {
    return had ? { items: rest, total: Math.max(0, list.total - 1) } : list;
  }
  const total = had ? list.total : list.total + 1;
  const at = rest.findIndex((t) => boardOrder(ticket, t) < 0);
  const position = at === -1 ? rest.length : at;
  // New to this page: it belongs on an earlier page, or after the last row of a full page.
  const elsewhere = !had && ((f.page > 1 && position === 0) || position >= pageSize);
  if (elsewhere) return { items: list.items, total };
  const items = [...rest.slice(0, position), ticket, ...rest.slice(position)].slice(0, pageSize);
  return { items, total };
}
