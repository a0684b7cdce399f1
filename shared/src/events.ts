import type { SessionUser } from './schemas/auth';
import type { Message, Ticket } from './schemas/tickets';

/** Acknowledgement every client-to-server event answers with. */
export type Ack<T extends object = object> =
  | ({ ok: true } & T)
  | { ok: false; error: { code: string; message: string; fields?: Record<string, string> } };

export interface PresenceEntry {
  userId: number;
  name: string;
  role: SessionUser['role'];
}

/** Events the server sends. Names are `entity:action`. */
export interface ServerToClientEvents {
  /** Your session ended (signed out elsewhere, deactivated): the client goes to sign-in. */
  'session:ended': (payload: { reason: 'signed-out' | 'deactivated' | 'password-changed' }) => void;
  /** A message in a ticket you joined; the client acks so the sender can see "delivered". */
  'message:new': (payload: { message: Message }, ack?: (res: { ok: true }) => void) => void;
  /** Messages of a ticket were delivered or read by the other side. */
  'message:status': (payload: {
    ticketId: number;
    messageIds: number[];
    deliveredAt?: string;
    readAt?: string;
  }) => void;
  /** Staff only: a message of a ticket you joined was marked (or unmarked) as part of the answer. */
  'message:marked': (payload: { ticketId: number; messageId: number; partOfAnswer: boolean }) => void;
  /** Someone else is typing in a ticket you joined. */
  typing: (payload: { ticketId: number; userId: number; name: string }) => void;
  /** A ticket was opened or changed: status, assignee, branch, urgency, last message. */
  'ticket:updated': (payload: { ticket: Ticket }) => void;
  /** Someone at one of your branch desks came online or went offline (sent to staff). */
  'presence:changed': (payload: { entry: PresenceEntry; online: boolean }) => void;
}

export interface MessageSendPayload {
  ticketId: number;
  clientId: string;
  body: string;
  kind?: 'message' | 'internal-note';
  attachmentIds?: number[];
}

/** Events a client sends; each one is answered through its ack callback. */
export interface ClientToServerEvents {
  'session:whoami': (ack: (res: Ack<{ user: SessionUser }>) => void) => void;
  'ticket:join': (payload: { ticketId: number }, ack: (res: Ack) => void) => void;
  'ticket:leave': (payload: { ticketId: number }, ack?: (res: Ack) => void) => void;
  'message:send': (payload: MessageSendPayload, ack: (res: Ack<{ message: Message }>) => void) => void;
  'message:read': (payload: { ticketId: number; messageId: number }, ack?: (res: Ack) => void) => void;
  /** Staff: mark a message as part of the answer (the same as PATCH /api/tickets/:id/messages/:messageId). */
  'message:mark': (
    payload: { ticketId: number; messageId: number; partOfAnswer: boolean },
    ack?: (res: Ack<{ message: Message }>) => void,
  ) => void;
  typing: (payload: { ticketId: number }) => void;
  'presence:list': (ack: (res: Ack<{ online: PresenceEntry[] }>) => void) => void;
}

export interface SocketData {
  user: SessionUser;
  sessionId: string;
}
