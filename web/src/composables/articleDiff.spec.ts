import { describe, expect, it } from 'vitest';
import { sideBySide } from './articleDiff';

describe('sideBySide', () => {
  it('When nothing changed, then every line is the same on both sides', () => {
    expect(sideBySide('a\nb\n', 'a\nb\n')).toEqual([
      { before: 'a', after: 'a', change: 'same' },
      { before: 'b', after: 'b', change: 'same' },
    ]);
  });

  it('When a line is rewritten, then old and new sit on one row as changed', () => {
    expect(sideBySide('Check the rod\nRefit\n', 'Clean the rod\nRefit\n')).toEqual([
      { before: 'Check the rod', after: 'Clean the rod', change: 'changed' },
      { before: 'Refit', after: 'Refit', change: 'same' },
    ]);
  });

  it('When lines are only added or only removed, then the other side is empty', () => {
    expect(sideBySide('a\n', 'a\nb\n')).toEqual([
      { before: 'a', after: 'a', change: 'same' },
      { before: null, after: 'b', change: 'added' },
    ]);
    expect(sideBySide('a\nb\n', 'b\n')).toEqual([
      { before: 'a', after: null, change: 'removed' },
      { before: 'b', after: 'b', change: 'same' },
    ]);
  });

  it('When two lines become one, then the extra old line shows as removed', () => {
    expect(sideBySide('x\ny\n', 'z\n')).toEqual([
      { before: 'x', after: 'z', change: 'changed' },
      { before: 'y', after: null, change: 'removed' },
    ]);
  });
});
