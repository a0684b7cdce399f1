import type { SessionUser } from './schemas/auth';

/** Acknowledgement every client-to-server event answers with. */
export type Ack<T = Record<string, never>> =
  ({ ok: true } & T) | { ok: false; error: { code: string; message: string } };

/** Events the server sends. Names are `entity:action`. */
export interface ServerToClientEvents {
  /** Your session ended (signed out elsewhere, deactivated): the client goes to sign-in. */
  'session:ended': (payload: { reason: 'signed-out' | 'deactivated' | 'password-changed' }) => void;
}

/** Events a client sends; each one is answered through its ack callback. */
export interface ClientToServerEvents {
  'session:whoami': (ack: (res: Ack<{ user: SessionUser }>) => void) => void;
}

export interface SocketData {
  user: SessionUser;
  sessionId: string;
}
