import type { Message, Ticket, TicketStatus } from '@shared/schemas/tickets';

export const ACTIVE_STATUSES: readonly TicketStatus[] = ['new', 'open', 'waiting-on-contractor'];

/** Whether a ticket belongs in a list filtered by status ('active' = not yet resolved). */
export function matchesStatus(ticket: Ticket, status: TicketStatus | 'active' | undefined): boolean {
  if (!status) return true;
  if (status === 'active') return ACTIVE_STATUSES.includes(ticket.status);
  return ticket.status === status;
}

/**
 * A list after a live change: the ticket replaces its old copy, is added on top when new,
 * or is dropped when it no longer matches the filter. Newest-changed first.
 */
export function mergeTicket(
  list: { items: Ticket[]; total: number },
  ticket: Ticket,
  status?: TicketStatus | 'active',
): { items: Ticket[]; total: number } {
  const had = list.items.some((t) => t.id === ticket.id);
  const rest = list.items.filter((t) => t.id !== ticket.id);
  if (!matchesStatus(ticket, status)) {
    return { items: rest, total: had ? Math.max(0, list.total - 1) : list.total };
  }
  return { items: [ticket, ...rest], total: had ? list.total : list.total + 1 };
}

/** Messages after one arrives: one copy per id (ack and broadcast both bring it), oldest first. */
export function mergeMessages(list: readonly Message[], incoming: readonly Message[]): Message[] {
  const byId = new Map<number, Message>();
  for (const m of [...list, ...incoming]) {
    // A copy that does not say whether it is part of the answer keeps what was known.
    const known = byId.get(m.id)?.partOfAnswer;
    byId.set(m.id, m.partOfAnswer === undefined && known !== undefined ? { ...m, partOfAnswer: known } : m);
  }
  return [...byId.values()].sort((a, b) => a.id - b.id);
}

/** Minutes left until the first answer is due (negative when late). */
export function minutesLeft(dueAt: string, now: Date): number {
  return Math.round((new Date(dueAt).getTime() - now.getTime()) / 60_000);
}
