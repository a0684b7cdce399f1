import type { PresenceEntry } from '../../../shared/src/events';
import type { Io } from './io';

/** Who on the desk is online, read from the connected sockets (across instances, through the adapter). */
export async function deskPresence(io: Io): Promise<PresenceEntry[]> {
  const sockets = await io.in('staff').fetchSockets();
  const byUser = new Map<number, PresenceEntry>();
  for (const s of sockets) {
    const u = s.data.user;
    if (u) byUser.set(u.id, { userId: u.id, name: u.name, role: u.role });
  }
  return [...byUser.values()].sort((a, b) => a.name.localeCompare(b.name));
}

export async function announcePresence(io: Io): Promise<void> {
  try {
    io.to('staff').emit('presence:desk', { online: await deskPresence(io) });
  } catch {
    // Presence is a courtesy; a failed round-trip to another instance must not break a connection.
  }
}
