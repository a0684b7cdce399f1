import { describe, expect, it } from 'vitest';
import type { Message, Ticket } from '@shared/schemas/tickets';
import { matchesStatus, mergeMessages, mergeTicket, minutesLeft } from './ticketMerge';
import { toDraft } from './useTicketForm';

// Invented demo data (DESIGN.md scenario style); only the fields the helpers read matter.
function ticket(id: number, status: Ticket['status'] = 'new'): Ticket {
  return {
    id,
    number: `T-${1000 + id}`,
    accountId: 1,
    accountCompany: 'Maple Ridge Comfort',
    openedBy: { id: 9, name: 'Dana Fielding' },
    branchId: 1,
    branchName: 'North Yard',
    subject: `Ticket ${id}`,
    description: '',
    equipmentModel: null,
    modelText: null,
    serial: null,
    fuel: 'natural-gas',
    urgency: 'question',
    status,
    assignee: null,
    firstResponseAt: null,
    firstResponseDueAt: '2026-03-04T15:15:00Z',
    resolvedAt: null,
    resolutionSummary: null,
    createdAt: '2026-03-04T15:00:00Z',
    updatedAt: '2026-03-04T15:00:00Z',
    lastMessageAt: null,
    messageCount: 0,
  };
}

function message(id: number, clientId: string | null = null): Message {
  return {
    id,
    ticketId: 1,
    clientId,
    kind: 'message',
    body: `m${id}`,
    author: null,
    attachments: [],
    createdAt: '2026-03-04T15:00:00Z',
    deliveredAt: null,
    readAt: null,
  };
}

describe('live ticket lists', () => {
  it('When a new ticket arrives, then it goes on top and the total grows', () => {
    const list = { items: [ticket(1)], total: 1 };
    const next = mergeTicket(list, ticket(2), 'active');
    expect(next.items.map((t) => t.id)).toEqual([2, 1]);
    expect(next.total).toBe(2);
  });

  it('When a listed ticket changes, then it is replaced, not doubled, and moves to the top', () => {
    const list = { items: [ticket(1), ticket(2)], total: 2 };
    const changed = { ...ticket(2, 'open'), subject: 'Changed' };
    const next = mergeTicket(list, changed, 'active');
    expect(next.items.map((t) => t.id)).toEqual([2, 1]);
    expect(next.items[0]?.subject).toBe('Changed');
    expect(next.total).toBe(2);
  });

  it('When a ticket is solved, then it leaves the active list, and an unlisted solved one is not added', () => {
    const list = { items: [ticket(1), ticket(2)], total: 2 };
    const next = mergeTicket(list, ticket(1, 'resolved'), 'active');
    expect(next.items.map((t) => t.id)).toEqual([2]);
    expect(next.total).toBe(1);
    expect(mergeTicket(next, ticket(7, 'closed'), 'active')).toEqual(next);
    // Without a filter every ticket is kept.
    expect(mergeTicket(list, ticket(1, 'resolved')).items).toHaveLength(2);
  });

  it('When the filter is "active", then new, open and waiting tickets match and solved ones do not', () => {
    expect(matchesStatus(ticket(1, 'waiting-on-contractor'), 'active')).toBe(true);
    expect(matchesStatus(ticket(1, 'resolved'), 'active')).toBe(false);
    expect(matchesStatus(ticket(1, 'open'), 'new')).toBe(false);
  });
});

describe('conversation merging', () => {
  it('When the same message comes by ack and by broadcast, then it is shown once, oldest first', () => {
    const merged = mergeMessages([message(3, 'abc12345')], [message(1), message(3, 'abc12345'), message(2)]);
    expect(merged.map((m) => m.id)).toEqual([1, 2, 3]);
  });

  it('When a copy without the answer mark arrives for a marked message, then the mark is kept; a new mark wins', () => {
    const marked = { ...message(4), partOfAnswer: true };
    expect(mergeMessages([marked], [message(4)])[0]?.partOfAnswer).toBe(true);
    expect(mergeMessages([marked], [{ ...message(4), partOfAnswer: false }])[0]?.partOfAnswer).toBe(false);
  });
});

describe('first-response clock', () => {
  it('When 10 minutes remain or 5 minutes have passed, then it reads 10 and -5', () => {
    expect(minutesLeft('2026-03-04T15:15:00Z', new Date('2026-03-04T15:05:00Z'))).toBe(10);
    expect(minutesLeft('2026-03-04T15:15:00Z', new Date('2026-03-04T15:20:00Z'))).toBe(-5);
  });
});

describe('new-ticket form values', () => {
  const base = {
    subject: '  Furnace locks out  ',
    model: '' as number | string,
    serial: '',
    fuel: 'propane' as const,
    urgency: 'emergency' as const,
    description: ' Three tries then hard lockout ',
  };

  it('When a catalogue model is picked, then its id is sent and no free text', () => {
    const draft = toDraft({ ...base, model: 42 });
    expect(draft).toEqual({
      subject: 'Furnace locks out',
      description: 'Three tries then hard lockout',
      fuel: 'propane',
      urgency: 'emergency',
      equipmentModelId: 42,
    });
  });

  it('When a model is typed, then it is sent as text with the serial', () => {
    expect(toDraft({ ...base, model: ' XR-90 ', serial: ' 1234 ' })).toMatchObject({
      modelText: 'XR-90',
      serial: '1234',
    });
  });

  it('When the subject, fuel or urgency is missing, then that field is named', () => {
    expect(toDraft({ ...base, subject: '   ' })).toEqual({ missing: 'subject' });
    expect(toDraft({ ...base, fuel: '' })).toEqual({ missing: 'fuel' });
    expect(toDraft({ ...base, urgency: '' })).toEqual({ missing: 'urgency' });
  });
});
