import type { Logger } from 'pino';
import type { Config } from './config';
import type { Db } from './db/client';
import type { FileStorage } from './features/attachments/storage';
import type { Jobs } from './lib/jobs';
import type { ServerToClientEvents } from '../../shared/src/events';
import type { Message } from '../../shared/src/schemas/tickets';

type SessionEndReason = Parameters<ServerToClientEvents['session:ended']>[0]['reason'];

/** What the realtime layer offers the rest of the server; a no-op until sockets are attached. */
export interface Realtime {
  toUser<E extends keyof ServerToClientEvents>(
    userId: number,
    event: E,
    ...args: Parameters<ServerToClientEvents[E]>
  ): void;
  /** Sends an event to every socket in the given rooms. */
  emit<E extends keyof ServerToClientEvents>(
    rooms: string[],
    event: E,
    ...args: Parameters<ServerToClientEvents[E]>
  ): void;
  /** Sends a new message to the given rooms; resolves with how many sockets acknowledged it. */
  deliver(rooms: string[], message: Message): Promise<number>;
  /** Tells the sockets of one session that it ended, then closes them. */
  endSession(sessionId: string, reason: SessionEndReason): void;
  /** The same for every session of a user, except optionally one (the one making the change). */
  endUserSessions(userId: number, reason: SessionEndReason, exceptSessionId?: string): void;
  /** Whether the user has a connected socket on any instance (they will see new messages live). */
  isOnline(userId: number): Promise<boolean>;
}

export interface AppContext {
  config: Config;
  db: Db;
  logger: Logger;
  realtime: Realtime;
  storage: FileStorage;
  /** Background jobs kept in PostgreSQL (search sync, e-mail). */
  jobs: Jobs;
}

export const noRealtime: Realtime = {
  toUser() {},
  emit() {},
  deliver: async () => 0,
  endSession() {},
  endUserSessions() {},
  isOnline: async () => false,
};
