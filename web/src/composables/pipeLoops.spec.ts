import { describe, expect, it } from 'vitest';
import { sectionsInLoops } from './pipeLoops';

describe('sectionsInLoops', () => {
  it('When every section leads back to the meter, then none is in a loop', () => {
    const tree = [
      { id: 'A', parentId: null },
      { id: 'B', parentId: 'A' },
      { id: 'C', parentId: 'B' },
      { id: 'D', parentId: 'A' },
    ];
    expect([...sectionsInLoops(tree)]).toEqual([]);
  });

  it('When two sections name each other as parent, then both, and what hangs off them, are flagged', () => {
    const sections = [
      { id: 'A', parentId: null },
      { id: 'B', parentId: 'C' },
      { id: 'C', parentId: 'B' },
      { id: 'D', parentId: 'C' },
    ];
    expect([...sectionsInLoops(sections)].sort()).toEqual(['B', 'C', 'D']);
  });

  it('When a section is its own parent, then it is flagged', () => {
    expect([...sectionsInLoops([{ id: 'A', parentId: 'A' }])]).toEqual(['A']);
  });

  it('When a parent does not exist, then it is not a loop (the schema reports it)', () => {
    expect([...sectionsInLoops([{ id: 'A', parentId: 'Z' }])]).toEqual([]);
  });
});
