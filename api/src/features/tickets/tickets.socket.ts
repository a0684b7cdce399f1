import type { Socket } from 'socket.io';
import { z } from 'zod';
import type { AppContext } from '../../context';
import type {
  Ack,
  ClientToServerEvents,
  ServerToClientEvents,
  SocketData,
} from '../../../../shared/src/events';
import { messageCreateSchema } from '../../../../shared/src/index';
import { AppError, handleError } from '../../lib/errors';
import { can } from '../../lib/policies';
import type { Io } from '../../realtime/io';
import { deskPresence } from '../../realtime/presence';
import { markPartOfAnswer } from './answer-marks.service';
import { markRead, postMessage } from './messages.service';
import { rooms } from './rooms';
import { loadScope } from './tickets.service';

type AppSocket = Socket<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;

const ticketRef = z.object({ ticketId: z.number().int().positive() });
const readSchema = ticketRef.extend({ messageId: z.number().int().positive() });
const markSchema = readSchema.extend({ partOfAnswer: z.boolean() });
// The same body rules as the REST route, plus which ticket.
const sendSchema = z.intersection(ticketRef, messageCreateSchema);

const SEND_LIMIT = 20;
const SEND_WINDOW_MS = 10_000;
const TYPING_EVERY_MS = 2_000;

/** Wraps a handler: parse, run, ack with the result or with the public error. */
function handler<T, R extends object>(
  ctx: AppContext,
  schema: z.ZodType<T>,
  run: (payload: T) => Promise<R>,
): (payload: unknown, ack?: (res: Ack<R>) => void) => void {
  return (payload, ack) => {
    const reply = typeof ack === 'function' ? ack : () => {};
    // A payload that fails the schema throws a ZodError, which handleError turns into field errors.
    Promise.resolve(payload)
      .then((p) => run(schema.parse(p)))
      .then(
        (result) => reply({ ok: true, ...result } as Ack<R>),
        (err) => reply({ ok: false, error: handleError(err, ctx.logger).body.error }),
      );
  };
}

export function registerTicketHandlers(ctx: AppContext, io: Io, socket: AppSocket) {
  const user = () => socket.data.user;
  // Per-socket send budget: a sliding window of timestamps (this socket's own, not shared state).
  const sent: number[] = [];
  let lastTyping = 0;

  socket.on(
    'ticket:join',
    handler(ctx, ticketRef, async ({ ticketId }) => {
      await loadScope(ctx.db, user(), ticketId);
      const side = can(user(), 'note.view') ? rooms.ticketStaff(ticketId) : rooms.ticketContractor(ticketId);
      await socket.join([rooms.ticket(ticketId), side]);
      return {};
    }),
  );

  socket.on(
    'ticket:leave',
    handler(ctx, ticketRef, async ({ ticketId }) => {
      await socket.leave(rooms.ticket(ticketId));
      await socket.leave(rooms.ticketStaff(ticketId));
      await socket.leave(rooms.ticketContractor(ticketId));
      return {};
    }),
  );

  socket.on(
    'message:send',
    handler(ctx, sendSchema, async (payload) => {
      const now = Date.now();
      while (sent.length && now - sent[0]! > SEND_WINDOW_MS) sent.shift();
      if (sent.length >= SEND_LIMIT) {
        throw new AppError('rate_limited', `Slow down: at most ${SEND_LIMIT} messages in 10 seconds`, 429);
      }
      sent.push(now);
      const { ticketId, ...input } = payload;
      const message = await postMessage(ctx, user(), ticketId, input);
      return { message };
    }),
  );

  socket.on(
    'message:read',
    handler(ctx, readSchema, async ({ ticketId, messageId }) => {
      await markRead(ctx, user(), ticketId, messageId);
      return {};
    }),
  );

  socket.on(
    'message:mark',
    handler(ctx, markSchema, async ({ ticketId, messageId, partOfAnswer }) => {
      const message = await markPartOfAnswer(ctx, user(), ticketId, messageId, partOfAnswer);
      return { message };
    }),
  );

  socket.on('typing', (payload) => {
    const parsed = ticketRef.safeParse(payload);
    const now = Date.now();
    if (!parsed.success || now - lastTyping < TYPING_EVERY_MS) return;
    const { ticketId } = parsed.data;
    // Only a socket that joined the ticket (and so passed its authorization) may say it is typing.
    if (!socket.rooms.has(rooms.ticket(ticketId))) return;
    lastTyping = now;
    socket.to(rooms.ticket(ticketId)).emit('typing', { ticketId, userId: user().id, name: user().name });
  });

  socket.on('presence:list', (ack) => {
    if (typeof ack !== 'function') return;
    if (!can(user(), 'note.view')) {
      ack({ ok: false, error: { code: 'forbidden', message: 'Desk presence is for staff' } });
      return;
    }
    deskPresence(io, user().branchIds).then(
      (online) => ack({ ok: true, online }),
      (err) => ack({ ok: false, error: handleError(err, ctx.logger).body.error }),
    );
  });
}
