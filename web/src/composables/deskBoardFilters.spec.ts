import { describe, expect, it } from 'vitest';
import type { Ticket } from '@shared/schemas/tickets';
import {
  DEFAULT_FILTERS,
  filtersFromQuery,
  isFiltered,
  matchesFilters,
  mergeBoardTicket,
  paramsFromFilters,
  queryFromFilters,
  type BoardFilters,
} from './deskBoardFilters';

// Invented demo data (DESIGN.md scenario); only the fields the board reads matter.
function ticket(id: number, over: Partial<Ticket> = {}): Ticket {
  return {
    id,
    number: `HV-${1000 + id}`,
    accountId: 1,
    accountCompany: 'Keane Heating & Air',
    openedBy: { id: 9, name: 'Rowan Fielding' },
    branchId: 1,
    branchName: 'Eastgate',
    subject: `Ticket ${id}`,
    description: '',
    equipmentModel: null,
    modelText: null,
    serial: null,
    fuel: 'natural-gas',
    urgency: 'question',
    status: 'new',
    assignee: null,
    firstResponseAt: null,
    firstResponseDueAt: '2026-03-04T15:15:00Z',
    resolvedAt: null,
    resolutionSummary: null,
    createdAt: `2026-03-04T15:${String(id).padStart(2, '0')}:00Z`,
    updatedAt: '2026-03-04T15:00:00Z',
    lastMessageAt: null,
    messageCount: 0,
    ...over,
  };
}
const filters = (over: Partial<BoardFilters> = {}): BoardFilters => ({ ...DEFAULT_FILTERS, ...over });
const ME = 42;

describe('board filters in the URL', () => {
  it('When the URL has no query, then the board shows active tickets, page 1, and writes no query back', () => {
    const f = filtersFromQuery({});
    expect(f).toEqual(DEFAULT_FILTERS);
    expect(queryFromFilters(f)).toEqual({});
    expect(isFiltered(f)).toBe(false);
  });

  it('When every filter is set, then the URL round-trips to the same filters', () => {
    const f = filters({
      status: 'resolved',
      urgency: 'emergency',
      branchId: 7,
      assignee: 'me',
      q: 'HV-1042',
      page: 3,
    });
    const query = queryFromFilters(f);
    expect(query).toEqual({
      status: 'resolved',
      urgency: 'emergency',
      branch: '7',
      assignee: 'me',
      q: 'HV-1042',
      page: '3',
    });
    expect(filtersFromQuery(query as Record<string, string>)).toEqual(f);
    expect(isFiltered(f)).toBe(true);
  });

  it('When the URL holds unknown or malformed values, then each falls back to its default', () => {
    expect(
      filtersFromQuery({
        status: 'pending',
        urgency: 'soon',
        branch: '-2',
        assignee: 'bob',
        page: '1.5',
        q: '  ',
      }),
    ).toEqual(DEFAULT_FILTERS);
    // A repeated key takes its first value.
    expect(filtersFromQuery({ urgency: ['job-held', 'emergency'] }).urgency).toBe('job-held');
  });

  it('When "any status" is chosen, then the API gets no status; "active" and the rest are sent as they are', () => {
    expect(paramsFromFilters(filters({ status: 'all' }), 25)).toEqual({ page: 1, pageSize: 25 });
    expect(paramsFromFilters(filters({ assignee: 'none', q: ' lockout ' }), 25)).toEqual({
      page: 1,
      pageSize: 25,
      status: 'active',
      assignee: 'none',
      q: 'lockout',
    });
  });
});

describe('which tickets match the board', () => {
  it('When filtered by urgency, branch and assignee, then only tickets with all three match', () => {
    const f = filters({ urgency: 'emergency', branchId: 1, assignee: 'me' });
    expect(
      matchesFilters(ticket(1, { urgency: 'emergency', assignee: { id: ME, name: 'Sam' } }), f, ME),
    ).toBe(true);
    expect(matchesFilters(ticket(1, { urgency: 'job-held', assignee: { id: ME, name: 'Sam' } }), f, ME)).toBe(
      false,
    );
    expect(matchesFilters(ticket(1, { urgency: 'emergency', branchId: 2 }), f, ME)).toBe(false);
    expect(matchesFilters(ticket(1, { urgency: 'emergency' }), f, ME)).toBe(false);
    expect(matchesFilters(ticket(1), filters({ assignee: 'none' }), ME)).toBe(true);
  });

  it('When searching, then part of the number, serial, model or company matches, in any case', () => {
    const t = ticket(3, {
      serial: 'SN-77812',
      equipmentModel: { id: 1, brand: 'Corvane', modelNumber: 'CV-T96', family: 'T96', type: 'furnace' },
    });
    for (const q of ['hv-1003', '77812', 'cv-t9', 'keane'])
      expect(matchesFilters(t, filters({ q }), ME)).toBe(true);
    expect(matchesFilters(t, filters({ q: 'brightline' }), ME)).toBe(false);
  });
});

describe('the board kept live', () => {
  it('When a ticket starts matching, then it appears where the server would sort it and the total grows', () => {
    const list = { items: [ticket(5, { urgency: 'emergency' }), ticket(4)], total: 2 };
    const next = mergeBoardTicket(list, ticket(6, { urgency: 'job-held' }), filters(), ME, 25);
    expect(next.items.map((t) => t.id)).toEqual([5, 6, 4]);
    expect(next.total).toBe(3);
  });

  it('When a listed ticket stops matching (solved, or moved to another branch), then it leaves and the total drops', () => {
    const list = { items: [ticket(1), ticket(2)], total: 2 };
    expect(
      mergeBoardTicket(list, ticket(1, { status: 'resolved' }), filters(), ME).items.map((t) => t.id),
    ).toEqual([2]);
    const moved = mergeBoardTicket(list, ticket(2, { branchId: 9 }), filters({ branchId: 1 }), ME);
    expect(moved).toEqual({ items: [ticket(1)], total: 1 });
  });

  it('When a ticket that never matched changes, then the list is left exactly as it was', () => {
    const list = { items: [ticket(1)], total: 1 };
    expect(
      mergeBoardTicket(list, ticket(8, { urgency: 'question' }), filters({ urgency: 'emergency' }), ME),
    ).toBe(list);
  });

  it('When a listed ticket changes, then it is replaced in place, not doubled', () => {
    const list = { items: [ticket(2), ticket(1)], total: 2 };
    const next = mergeBoardTicket(list, ticket(1, { subject: 'Changed', status: 'open' }), filters(), ME);
    expect(next.items.map((t) => [t.id, t.subject])).toEqual([
      [2, 'Ticket 2'],
      [1, 'Changed'],
    ]);
    expect(next.total).toBe(2);
  });

  it('When the page is full, then a newcomer pushes the last row off; one sorting after the page only counts', () => {
    const list = { items: [ticket(3), ticket(2)], total: 5 };
    const first = mergeBoardTicket(list, ticket(9, { urgency: 'emergency' }), filters(), ME, 2);
    expect(first.items.map((t) => t.id)).toEqual([9, 3]);
    expect(first.total).toBe(6);
    const after = mergeBoardTicket(list, ticket(1), filters(), ME, 2);
    expect(after.items).toBe(list.items);
    expect(after.total).toBe(6);
  });

  it('When on page 2 a newcomer sorts before every row, then it belongs to an earlier page and only the total grows', () => {
    const list = { items: [ticket(3), ticket(2)], total: 30 };
    const next = mergeBoardTicket(list, ticket(9, { urgency: 'emergency' }), filters({ page: 2 }), ME, 25);
    expect(next.items.map((t) => t.id)).toEqual([3, 2]);
    expect(next.total).toBe(31);
  });
});
