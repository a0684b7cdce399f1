import type { Server as HttpServer, IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import type passport from 'passport';
import { Server } from 'socket.io';
import type { ClientToServerEvents, ServerToClientEvents, SocketData } from '../../../shared/src/events';
import type { Realtime, AppContext } from '../context';
import { handleError } from '../lib/errors';
import { can } from '../lib/policies';

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
    void socket.join([`user:${user.id}`, `session:${sessionId}`]);
    socket.on('session:whoami', (ack) => {
      try {
        ack({ ok: true, user: socket.data.user });
      } catch (err) {
        ack({ ok: false, error: handleError(err, ctx.logger).body.error });
      }
    });
  });

  const endRoom = (room: string, reason: Parameters<ServerToClientEvents['session:ended']>[0]['reason']) => {
    io.to(room).emit('session:ended', { reason });
    io.in(room).disconnectSockets(true);
  };

  const realtime: Realtime = {
    toUser: (userId, event, ...args) => {
      io.to(`user:${userId}`).emit(event, ...args);
    },
    endSession: (sessionId, reason) => endRoom(`session:${sessionId}`, reason),
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
