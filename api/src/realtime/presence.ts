import type { PresenceEntry } from '../../../shared/src/events';
import type { SessionUser } from '../../../shared/src/schemas/auth';
import { rooms } from '../features/tickets/rooms';
import type { Io } from './io';

/**
 * Who is online at the given branch desks, read from the connected sockets (across instances,
 * through the adapter); nothing is kept in this process's memory.
 */
export async function deskPresence(io: Io, branchIds: number[]): Promise<PresenceEntry[]> {
  if (branchIds.length === 0) return [];
  const sockets = await io.in(branchIds.map(rooms.desk)).fetchSockets();
  const byUser = new Map<number, PresenceEntry>();
  for (const s of sockets) {
    const u = s.data.user;
    if (u) byUser.set(u.id, { userId: u.id, name: u.name, role: u.role });
  }
  return [...byUser.values()].sort((a, b) => a.name.localeCompare(b.name));
}

/**
 * Tells the user's branch desks when their first socket connects or their last one closes. Only
 * the change travels, and only to their own desks: a full list to every staff socket on every
 * connection grows with the square of the desk.
 */
export async function announcePresence(io: Io, user: SessionUser, online: boolean): Promise<void> {
  if (user.role === 'contractor' || user.branchIds.length === 0) return;
  try {
    const stillConnected = (await io.in(rooms.user(user.id)).fetchSockets()).length;
    // Connecting: announce only the first socket; disconnecting: only when none is left.
    if (online ? stillConnected !== 1 : stillConnected !== 0) return;
    io.to(user.branchIds.map(rooms.desk)).emit('presence:changed', {
      entry: { userId: user.id, name: user.name, role: user.role },
      online,
    });
  } catch {
    // Presence is a courtesy; a failed round-trip to another instance must not break a connection.
  }
}
