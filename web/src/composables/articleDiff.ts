import { diffLines } from 'diff';

/** One row of a side-by-side comparison: the old line, the new line, and what happened. */
export interface DiffRow {
  before: string | null;
  after: string | null;
  change: 'same' | 'removed' | 'added' | 'changed';
}

const lines = (value: string) => value.replace(/\n$/, '').split('\n');

/**
 * Side-by-side rows for two texts: removals and additions that follow each other pair up as
 * changed lines; the rest stand alone on their own side.
 */
export function sideBySide(before: string, after: string): DiffRow[] {
  const rows: DiffRow[] = [];
  let removed: string[] = [];
  const flush = (added: string[]) => {
    const n = Math.max(removed.length, added.length);
    for (let i = 0; i < n; i++) {
      const b = removed[i] ?? null;
      const a = added[i] ?? null;
      rows.push({ before: b, after: a, change: b === null ? 'added' : a === null ? 'removed' : 'changed' });
    }
    removed = [];
  };
  for (const part of diffLines(before, after)) {
    if (part.removed) {
      flush([]);
      removed = lines(part.value);
    } else if (part.added) {
      flush(lines(part.value));
    } else {
      flush([]);
      for (const line of lines(part.value)) rows.push({ before: line, after: line, change: 'same' });
    }
  }
  flush([]);
  return rows;
}
