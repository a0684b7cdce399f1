import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import type {
  SessionUser,
  Ticket,
  TicketCreate,
  TicketListQuery,
  TicketUpdate,
} from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize, can } from '../../lib/policies';
import * as repo from './tickets.repository';
import { equipmentExists } from '../equipment/index';
import { rooms } from './rooms';
import { notifyResolved, notifyTicketReceived } from '../mail/notifications';

const REOPEN_DAYS = 14;

/** Loads a ticket's owner and branch and checks the reader may see it; others get 404. */
export async function loadScope(db: Executor, user: SessionUser | undefined, ticketId: number) {
  const scope = await repo.findTicketScope(db, ticketId);
  authorize(user, 'ticket.view', scope ?? { accountId: -1, branchId: -1 }, 'not-found');
  if (!scope) throw AppError.notFound('Ticket');
  return scope;
}

/** Tells the ticket's room, its branch desk and its account that the ticket changed. */
export function announce(ctx: AppContext, ticket: Ticket) {
  ctx.realtime.emit(
    [rooms.ticket(ticket.id), rooms.desk(ticket.branchId), rooms.account(ticket.accountId)],
    'ticket:updated',
    { ticket },
  );
}

export async function createTicket(ctx: AppContext, user: SessionUser, input: TicketCreate): Promise<Ticket> {
  authorize(user, 'ticket.create', { accountId: user.accountId });
  const accountId = user.accountId!;
  if (input.equipmentModelId && !(await equipmentExists(ctx.db, input.equipmentModelId))) {
    throw AppError.validation({ equipmentModelId: 'This model is not in the catalogue' });
  }
  const branchId = await repo.findHomeBranchId(ctx.db, accountId);
  if (!branchId) throw AppError.notFound('Your account');
  const id = await ctx.db.transaction(async (tx) => {
    const ticketId = await repo.insertTicket(tx, {
      accountId,
      openedById: user.id,
      branchId,
      subject: input.subject,
      description: input.description,
      equipmentModelId: input.equipmentModelId ?? null,
      modelText: input.modelText ?? null,
      serial: input.serial ?? null,
      fuel: input.fuel,
      urgency: input.urgency,
    });
    await repo.insertEvents(tx, [
      { ticketId, actorId: user.id, field: 'status', fromValue: null, toValue: 'new' },
    ]);
    await notifyTicketReceived(ctx, tx, ticketId);
    return ticketId;
  });
  const ticket = (await repo.findTicket(ctx.db, id))!;
  announce(ctx, ticket);
  return ticket;
}

export async function listTickets(ctx: AppContext, user: SessionUser, q: TicketListQuery) {
  const filter: repo.TicketFilter = {
    status: q.status,
    urgency: q.urgency,
    branchId: q.branchId,
    q: q.q,
    assignee: q.assignee === 'me' ? user.id : q.assignee,
  };
  if (user.role === 'contractor') filter.accountId = user.accountId ?? -1;
  else if (user.role !== 'admin') {
    filter.branchIds = user.branchIds;
    filter.orAssigneeId = user.id;
  }
  return repo.listTickets(ctx.db, filter, q);
}

export async function getTicket(ctx: AppContext, user: SessionUser | undefined, id: number): Promise<Ticket> {
  await loadScope(ctx.db, user, id);
  return (await repo.findTicket(ctx.db, id))!;
}

/** Staff change anything; a contractor may only mark their ticket resolved, or reopen it within 14 days. */
export async function updateTicket(
  ctx: AppContext,
  user: SessionUser,
  id: number,
  input: TicketUpdate,
): Promise<Ticket> {
  const scope = await loadScope(ctx.db, user, id);
  const current = (await repo.findTicket(ctx.db, id))!;
  if (user.role === 'contractor') checkContractorChange(user, scope, input);
  else authorize(user, 'ticket.manage', scope);

  if (input.assigneeId && !(await repo.isStaffMember(ctx.db, input.assigneeId))) {
    throw AppError.validation({ assigneeId: 'Pick someone on the desk' });
  }
  if (input.branchId && !(await repo.branchExists(ctx.db, input.branchId))) {
    throw AppError.validation({ branchId: 'This branch does not exist' });
  }
  const resolving = input.status === 'resolved' && current.status !== 'resolved';
  if (resolving && user.role !== 'contractor' && !input.resolutionSummary && !current.resolutionSummary) {
    throw AppError.validation({ resolutionSummary: 'Say how it was solved before resolving' });
  }
  const patch: Parameters<typeof repo.updateTicketRow>[2] = {};
  const events: Parameters<typeof repo.insertEvents>[1] = [];
  const change = (field: 'status' | 'assigneeId' | 'branchId' | 'urgency', from: unknown, to: unknown) => {
    if (to === undefined || to === from) return;
    (patch as Record<string, unknown>)[field] = to;
    events.push({
      ticketId: id,
      actorId: user.id,
      field,
      fromValue: from == null ? null : String(from),
      toValue: to == null ? null : String(to),
    });
  };
  change('status', current.status, input.status);
  change('assigneeId', current.assignee?.id ?? null, input.assigneeId);
  change('branchId', current.branchId, input.branchId);
  change('urgency', current.urgency, input.urgency);
  if (input.resolutionSummary !== undefined) patch.resolutionSummary = input.resolutionSummary;
  if (resolving) patch.resolvedAt = new Date();
  if (
    input.status &&
    input.status !== 'resolved' &&
    input.status !== 'closed' &&
    current.status === 'resolved'
  ) {
    patch.resolvedAt = null;
  }
  if (Object.keys(patch).length === 0) return current;
  await ctx.db.transaction(async (tx) => {
    await repo.updateTicketRow(tx, id, patch);
    await repo.insertEvents(tx, events);
    // The contractor who marks their own ticket solved needs no e-mail about it.
    if (resolving && user.role !== 'contractor') await notifyResolved(ctx, tx, id);
  });
  const ticket = (await repo.findTicket(ctx.db, id))!;
  announce(ctx, ticket);
  if (input.branchId && input.branchId !== current.branchId) {
    ctx.realtime.emit([rooms.desk(current.branchId)], 'ticket:updated', { ticket });
  }
  return ticket;
}

function checkContractorChange(user: SessionUser, scope: repo.TicketScope, input: TicketUpdate) {
  authorize(user, 'ticket.resolve-own', scope, 'not-found');
  const keys = Object.keys(input).filter((k) => k !== 'resolutionSummary');
  if (keys.length !== 1 || keys[0] !== 'status' || !input.status) {
    throw AppError.forbidden('You can mark your ticket solved or reopen it; the desk changes the rest');
  }
  if (input.status === 'resolved') {
    if (scope.status === 'closed') throw AppError.conflict('This ticket is closed');
    return;
  }
  if (input.status === 'open' && (scope.status === 'resolved' || scope.status === 'closed')) {
    const since = scope.resolvedAt ? Date.now() - scope.resolvedAt.getTime() : 0;
    if (since > REOPEN_DAYS * 24 * 3600 * 1000) {
      throw AppError.conflict(
        `A ticket can be reopened within ${REOPEN_DAYS} days of being resolved; please open a new one`,
      );
    }
    return;
  }
  throw AppError.forbidden('You can mark your ticket solved or reopen it; the desk changes the rest');
}

/** Staff take the ticket: assigned to them, and a new ticket becomes open. */
export async function claimTicket(ctx: AppContext, user: SessionUser, id: number): Promise<Ticket> {
  const scope = await loadScope(ctx.db, user, id);
  authorize(user, 'ticket.manage', scope);
  return updateTicket(ctx, user, id, {
    assigneeId: user.id,
    ...(scope.status === 'new' ? { status: 'open' as const } : {}),
  });
}

export const canSeeNotes = (user: SessionUser) => can(user, 'note.view');
