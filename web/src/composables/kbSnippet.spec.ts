import { describe, expect, it } from 'vitest';
import { splitSnippet } from './kbSnippet';

describe('splitSnippet', () => {
  it('When a snippet has marked words, then they come back as matches between plain text', () => {
    expect(splitSnippet('Check the ⟦manifold⟧ pressure at the ⟦outlet⟧ tap')).toEqual([
      { text: 'Check the ', match: false },
      { text: 'manifold', match: true },
      { text: ' pressure at the ', match: false },
      { text: 'outlet', match: true },
      { text: ' tap', match: false },
    ]);
  });

  it('When nothing is marked, then the whole snippet is one plain part', () => {
    expect(splitSnippet('Clean the flame sensor')).toEqual([
      { text: 'Clean the flame sensor', match: false },
    ]);
  });

  it('When a snippet starts with a match, then no empty part comes first', () => {
    expect(splitSnippet('⟦igniter⟧ glows')).toEqual([
      { text: 'igniter', match: true },
      { text: ' glows', match: false },
    ]);
  });

  it('When marks sit side by side, then they join into one match', () => {
    expect(splitSnippet('⟦flame⟧⟦sensor⟧')).toEqual([{ text: 'flamesensor', match: true }]);
  });

  it('When a mark is never closed, then it runs to the end; stray closers are dropped', () => {
    expect(splitSnippet('a ⟧b ⟦c d')).toEqual([
      { text: 'a b ', match: false },
      { text: 'c d', match: true },
    ]);
  });

  it('When the snippet holds markup, then it stays text', () => {
    expect(splitSnippet('<b>⟦x⟧</b>')).toEqual([
      { text: '<b>', match: false },
      { text: 'x', match: true },
      { text: '</b>', match: false },
    ]);
  });

  it('When the snippet is empty, then there are no parts', () => {
    expect(splitSnippet('')).toEqual([]);
  });
});
