import type { AppContext } from '../../context';
import type { Message, SessionUser } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import * as messages from './messages.repository';
import { rooms } from './rooms';
import { loadScope } from './tickets.service';

/**
 * The desk marks which messages answered the ticket, for the write-up. The other staff on the
 * ticket see it change live; contractors are never told (the event goes to the staff room only).
 */
export async function markPartOfAnswer(
  ctx: AppContext,
  user: SessionUser,
  ticketId: number,
  messageId: number,
  partOfAnswer: boolean,
): Promise<Message> {
  const scope = await loadScope(ctx.db, user, ticketId);
  authorize(user, 'message.mark', scope);
  const message = await messages.findMessage(ctx.db, messageId);
  if (!message || message.ticketId !== ticketId) throw AppError.notFound('Message');
  if (message.kind === 'event') {
    throw AppError.validation({
      messageId: 'Readings and status changes go into the write-up on their own; mark a message or a note',
    });
  }
  await messages.setPartOfAnswer(ctx.db, ticketId, messageId, partOfAnswer);
  ctx.realtime.emit([rooms.ticketStaff(ticketId)], 'message:marked', { ticketId, messageId, partOfAnswer });
  return { ...message, partOfAnswer };
}
