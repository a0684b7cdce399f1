import type { PresenceEntry } from '@shared/events';

/** Who is online after a change: one entry per person, sorted by name; going offline removes them. */
export function mergePresence(
  list: readonly PresenceEntry[],
  entry: PresenceEntry,
  online: boolean,
): PresenceEntry[] {
  const rest = list.filter((p) => p.userId !== entry.userId);
  if (!online) return rest;
  return [...rest, entry].sort((a, b) => a.name.localeCompare(b.name));
}
