import type { Logger } from 'pino';
import type { Config } from './config';
import type { Db } from './db/client';
import type { ServerToClientEvents } from '../../shared/src/events';

type SessionEndReason = Parameters<ServerToClientEvents['session:ended']>[0]['reason'];

/** What the realtime layer offers the rest of the server; a no-op until sockets are attached. */
export interface Realtime {
  toUser<E extends keyof ServerToClientEvents>(
    userId: number,
    event: E,
    ...args: Parameters<ServerToClientEvents[E]>
  ): void;
  /** Tells the sockets of one session that it ended, then closes them. */
  endSession(sessionId: string, reason: SessionEndReason): void;
  /** The same for every session of a user, except optionally one (the one making the change). */
  endUserSessions(userId: number, reason: SessionEndReason, exceptSessionId?: string): void;
}

export interface AppContext {
  config: Config;
  db: Db;
  logger: Logger;
  realtime: Realtime;
}

export const noRealtime: Realtime = { toUser() {}, endSession() {}, endUserSessions() {} };
