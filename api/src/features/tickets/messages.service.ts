import type { AppContext } from '../../context';
import type { Message, MessageCreate, SessionUser } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize, can } from '../../lib/policies';
import * as messages from './messages.repository';
import * as ticketsRepo from './tickets.repository';
import { rooms } from './rooms';
import { announce, loadScope } from './tickets.service';
import { scheduleRepliesMail } from '../mail/notifications';

/** Which messages the desk marked as the answer is the desk's business: contractors get messages without it. */
export function forContractors(message: Message): Message {
  const { partOfAnswer: _desksOnly, ...rest } = message;
  return rest;
}

export async function listMessages(
  ctx: AppContext,
  user: SessionUser | undefined,
  ticketId: number,
  q: { after?: number; limit: number },
) {
  await loadScope(ctx.db, user, ticketId);
  const staff = can(user, 'note.view');
  const items = await messages.listMessages(ctx.db, ticketId, { ...q, includeNotes: staff });
  return staff ? items : items.map(forContractors);
}

/**
 * Stores a message (once per clientId) and only then tells anyone: the caller acknowledges after
 * this resolves, so an acknowledged message is always in the database.
 */
export async function postMessage(
  ctx: AppContext,
  user: SessionUser,
  ticketId: number,
  input: MessageCreate,
): Promise<Message> {
  const scope = await loadScope(ctx.db, user, ticketId);
  if (input.kind === 'internal-note') authorize(user, 'note.post', scope);
  const isStaff = user.role !== 'contractor';
  const isAnswer = input.kind === 'message';
  let nextStatus: typeof scope.status | undefined;
  if (isAnswer && isStaff && scope.status === 'new') nextStatus = 'open';
  if (isAnswer && !isStaff && scope.status === 'waiting-on-contractor') nextStatus = 'open';
  const stampFirstResponse = isAnswer && isStaff && !scope.firstResponseAt;
  // A desk reply to a contractor who is not connected anywhere reaches them by e-mail, gathered.
  const mailContractor = isStaff && isAnswer && !(await ctx.realtime.isOnline(scope.openedById));

  const result = await ctx.db.transaction(async (tx) => {
    const inserted = await messages.insertMessageOnce(tx, {
      ticketId,
      authorId: user.id,
      kind: input.kind,
      body: input.body,
      clientId: input.clientId,
    });
    if (!inserted.created) return inserted;
    const linked = await messages.linkAttachments(tx, inserted.id, ticketId, user.id, input.attachmentIds);
    if (linked !== new Set(input.attachmentIds).size) {
      throw AppError.validation({
        attachmentIds: 'Some photos were not uploaded to this ticket by you, or are already sent',
      });
    }
    await ticketsRepo.touchAfterMessage(tx, ticketId, {
      status: nextStatus,
      stampFirstResponse: isStaff && isAnswer,
    });
    if (nextStatus) {
      await ticketsRepo.insertEvents(tx, [
        { ticketId, actorId: user.id, field: 'status', fromValue: scope.status, toValue: nextStatus },
      ]);
    }
    if (mailContractor) await scheduleRepliesMail(ctx, tx, ticketId, scope.openedById);
    return inserted;
  });
  if (!result.created) {
    const existing = (await messages.findMessage(ctx.db, result.id))!;
    return isStaff ? existing : forContractors(existing);
  }
  // A new message without files is known in full already; with files, read them back once.
  const message: Message =
    input.attachmentIds.length === 0
      ? {
          id: result.id,
          ticketId,
          clientId: input.clientId,
          kind: input.kind,
          body: input.body,
          author: { id: user.id, name: user.name, role: user.role },
          attachments: [],
          createdAt: result.createdAt!,
          deliveredAt: null,
          readAt: null,
          data: null,
          partOfAnswer: false,
        }
      : (await messages.findMessage(ctx.db, result.id))!;
  // The desk board and ticket lists show status and first response, so they hear of those changes.
  void fanOut(ctx, message, user, Boolean(nextStatus) || stampFirstResponse);
  return isStaff ? message : forContractors(message);
}

/** After the commit: the author's side sees it; the other side acks it, which marks it delivered. */
export async function fanOut(ctx: AppContext, message: Message, author: SessionUser, ticketChanged: boolean) {
  try {
    const ticketId = message.ticketId;
    if (ticketChanged) {
      const ticket = await ticketsRepo.findTicket(ctx.db, ticketId);
      if (ticket) announce(ctx, ticket);
    }
    if (message.kind === 'internal-note') {
      ctx.realtime.emit([rooms.ticketStaff(ticketId)], 'message:new', { message });
      return;
    }
    const authorIsStaff = author.role !== 'contractor';
    const own = authorIsStaff ? rooms.ticketStaff(ticketId) : rooms.ticketContractor(ticketId);
    const other = authorIsStaff ? rooms.ticketContractor(ticketId) : rooms.ticketStaff(ticketId);
    ctx.realtime.emit([own], 'message:new', { message: authorIsStaff ? message : forContractors(message) });
    if ((await ctx.realtime.deliver([other], authorIsStaff ? forContractors(message) : message)) > 0) {
      await messages.markDelivered(ctx.db, message.id);
      ctx.realtime.emit([rooms.ticket(ticketId)], 'message:status', {
        ticketId,
        messageIds: [message.id],
        deliveredAt: new Date().toISOString(),
      });
    }
  } catch (err) {
    ctx.logger.warn({ err, messageId: message.id }, 'message fan-out failed');
  }
}

export async function markRead(ctx: AppContext, user: SessionUser, ticketId: number, messageId: number) {
  await loadScope(ctx.db, user, ticketId);
  const ids = await messages.markRead(ctx.db, ticketId, messageId, user.role !== 'contractor');
  if (ids.length) {
    ctx.realtime.emit([rooms.ticket(ticketId)], 'message:status', {
      ticketId,
      messageIds: ids,
      readAt: new Date().toISOString(),
    });
  }
  return ids;
}
