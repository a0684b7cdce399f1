import type { Server as HttpServer, IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import type passport from 'passport';
import { Server } from 'socket.io';
import type { ClientToServerEvents, ServerToClientEvents, SocketData } from '../../../shared/src/events';
import type { Realtime, AppContext } from '../context';
import { can } from '../lib/policies';
import { rooms } from '../features/tickets/rooms';
import { registerTicketHandlers } from '../features/tickets/tickets.socket';
import { announcePresence } from './presence';

/** Each feature registers its socket handlers here, like routers in app.ts. */
const FEATURE_HANDLERS = [registerTicketHandlers];

export type Io = Server<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;

type EngineMiddleware = (req: IncomingMessage, res: ServerResponse, next: (err?: unknown) => void) => void;

/** Runs only on the handshake request, not on every long-polling request after it. */
const onHandshake =
  (mw: RequestHandler | EngineMiddleware): EngineMiddleware =>
  (req, res, next) => {
    const isHandshake = (req as IncomingMessage & { _query?: { sid?: string } })._query?.sid === undefined;
    if (isHandshake) (mw as EngineMiddleware)(req, res, next);
    else next();
  };

/** socket.io on the same HTTP server, admitted only with a valid session from the same origin. */
export function attachRealtime(
  ctx: AppContext,
  httpServer: HttpServer,
  session: { sessionMiddleware: RequestHandler; passport: passport.PassportStatic },
): { io: Io; realtime: Realtime } {
  const io: Io = new Server(httpServer, {
    serveClient: false,
    // Cross-site pages may not open a socket with our cookie.
    allowRequest: (req, callback) => {
      const origin = req.headers.origin;
      callback(null, !origin || new URL(origin).host === req.headers.host);
    },
  });
  io.engine.use(onHandshake(session.sessionMiddleware));
  io.engine.use(onHandshake(session.passport.initialize() as unknown as EngineMiddleware));
  io.engine.use(onHandshake(session.passport.session() as unknown as EngineMiddleware));

  io.use((socket, next) => {
    const req = socket.request as IncomingMessage & { user?: Express.User; sessionID?: string };
    if (!req.user || !can(req.user, 'realtime.connect')) {
      next(new Error('unauthenticated'));
      return;
    }
    socket.data.user = req.user;
    socket.data.sessionId = req.sessionID ?? '';
    next();
  });

  io.on('connection', (socket) => {
    const { user, sessionId } = socket.data;
    const joined = [rooms.user(user.id), rooms.session(sessionId)];
    if (user.role === 'contractor' && user.accountId) joined.push(rooms.account(user.accountId));
    else joined.push(...user.branchIds.map(rooms.desk));
    void socket.join(joined);
    socket.on('session:whoami', (ack) => {
      if (typeof ack === 'function') ack({ ok: true, user: socket.data.user });
    });
    for (const register of FEATURE_HANDLERS) register(ctx, io, socket);
    void announcePresence(io, user, true);
    socket.on('disconnect', () => void announcePresence(io, user, false));
  });

  const endRoom = (room: string, reason: Parameters<ServerToClientEvents['session:ended']>[0]['reason']) => {
    io.to(room).emit('session:ended', { reason });
    io.in(room).disconnectSockets(true);
  };

  const realtime: Realtime = {
    toUser: (userId, event, ...args) => {
      io.to(`user:${userId}`).emit(event, ...args);
    },
    emit: (targets, event, ...args) => {
      if (targets.length) io.to(targets).emit(event, ...args);
    },
    deliver: (targets, message) =>
      new Promise((resolve) => {
        if (!targets.length) return resolve(0);
        // Every socket in the rooms acks; sockets that miss the 5 s window simply do not count.
        io.to(targets)
          .timeout(5_000)
          .emit('message:new', { message }, (_err: unknown, acks: unknown[] = []) => resolve(acks.length));
      }),
    endSession: (sessionId, reason) => endRoom(`session:${sessionId}`, reason),
    // Asks every instance (through the adapter); an instance that does not answer counts as offline.
    isOnline: async (userId) => {
      try {
        return (await io.in(rooms.user(userId)).fetchSockets()).length > 0;
      } catch {
        return false;
      }
    },
    endUserSessions: (userId, reason, exceptSessionId) => {
      const target = exceptSessionId
        ? io.to(`user:${userId}`).except(`session:${exceptSessionId}`)
        : io.to(`user:${userId}`);
      target.emit('session:ended', { reason });
      (exceptSessionId
        ? io.in(`user:${userId}`).except(`session:${exceptSessionId}`)
        : io.in(`user:${userId}`)
      ).disconnectSockets(true);
    },
  };
  return { io, realtime };
}
