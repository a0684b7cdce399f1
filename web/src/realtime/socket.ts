// The single socket.io client. It shares the session cookie with the HTTP API, so it only
// connects after sign-in (the connection store drives it) and disconnects at sign-out.
// socket.io-client is loaded on first use: the sign-in page does not need it.
import type { Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/events';

export type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
export type SessionEndedReason = Parameters<ServerToClientEvents['session:ended']>[0]['reason'];

let client: Promise<AppSocket> | null = null;
let onSessionEnded: ((reason: SessionEndedReason) => void) | null = null;

/** Who to call when the server ends this session (set once by the router). */
export function setSessionEndedHandler(handler: ((reason: SessionEndedReason) => void) | null): void {
  onSessionEnded = handler;
}

export function getSocket(): Promise<AppSocket> {
  client ??= import('socket.io-client').then(({ io }) => {
    const socket: AppSocket = io({ path: '/socket.io', autoConnect: false, withCredentials: true });
    socket.on('session:ended', ({ reason }) => onSessionEnded?.(reason));
    return socket;
  });
  return client;
}

/** The client if it was ever loaded, without loading it. */
export function loadedSocket(): Promise<AppSocket> | null {
  return client;
}
