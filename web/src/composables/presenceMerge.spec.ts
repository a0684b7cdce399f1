import { describe, expect, it } from 'vitest';
import type { PresenceEntry } from '@shared/events';
import { mergePresence } from './presenceMerge';

// Invented names (DESIGN.md scenario style).
const ana: PresenceEntry = { userId: 1, name: 'Ana Whitlow', role: 'tech' };
const cole: PresenceEntry = { userId: 2, name: 'Cole Brandt', role: 'specialist' };
const bea: PresenceEntry = { userId: 3, name: 'Bea Morrow', role: 'tech' };

describe('who is on the desk', () => {
  it('When someone comes online, then they join the list in name order', () => {
    expect(mergePresence([ana, cole], bea, true).map((p) => p.name)).toEqual([
      'Ana Whitlow',
      'Bea Morrow',
      'Cole Brandt',
    ]);
  });

  it('When someone already listed is announced again (a second tab), then they are listed once', () => {
    expect(mergePresence([ana, cole], { ...ana }, true)).toEqual([ana, cole]);
  });

  it('When someone goes offline, then they leave; someone unknown going offline changes nothing', () => {
    expect(mergePresence([ana, cole], ana, false)).toEqual([cole]);
    expect(mergePresence([cole], bea, false)).toEqual([cole]);
  });
});
