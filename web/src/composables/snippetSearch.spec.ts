import { describe, expect, it } from 'vitest';
import type { Snippet } from '@shared/schemas/tickets';
import { appendSnippet, filterSnippets } from './snippetSearch';

const snippet = (id: number, title: string, body: string, ownerId: number | null): Snippet => ({
  id,
  title,
  body,
  shared: ownerId === null,
  ownerId,
  canEdit: ownerId === 7,
  updatedAt: '2026-03-04T15:00:00Z',
});
const ME = 7;
const list = [
  snippet(1, 'Flame sensor', 'Clean the flame rod with fine steel wool, then retry.', null),
  snippet(2, 'Ask for the rating plate', 'Send a photo of the rating plate, please.', ME),
  snippet(3, 'Pressure switch', 'Check the inducer hose for water or a crack.', null),
];

describe('finding a reply snippet', () => {
  it('When nothing is typed, then my snippets come first, then the shared ones by title', () => {
    expect(filterSnippets(list, '', ME).map((s) => s.id)).toEqual([2, 1, 3]);
  });

  it('When words are typed, then snippets holding every word, in title or text, in any case, remain', () => {
    expect(filterSnippets(list, 'PLATE photo', ME).map((s) => s.id)).toEqual([2]);
    expect(filterSnippets(list, 'inducer', ME).map((s) => s.id)).toEqual([3]);
    expect(filterSnippets(list, 'inducer plate', ME)).toEqual([]);
  });
});

describe('inserting a snippet into a message', () => {
  it('When the message is empty, then it becomes the snippet; when something is typed, the snippet follows it', () => {
    expect(appendSnippet('', 'Check the flame rod.')).toBe('Check the flame rod.');
    expect(appendSnippet('Hi Rowan,  \n', 'Check the flame rod.')).toBe('Hi Rowan,\n\nCheck the flame rod.');
  });
});
