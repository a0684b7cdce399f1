import { describe, expect, it } from 'vitest';
import { filtersChanged, fromRouteQuery, toRouteQuery } from './kbRouteQuery';

const blank = { kind: '', equipmentType: '', brand: '', fuel: '' } as const;

describe('the knowledge-base address', () => {
  it('When a shared link has words and every filter, then the page starts with all of them', () => {
    expect(
      fromRouteQuery({
        q: ' flame sensor ',
        kind: 'procedure',
        equipmentType: 'furnace',
        brand: 'Corvane',
        fuel: 'propane',
      }),
    ).toEqual({
      q: 'flame sensor',
      filters: { kind: 'procedure', equipmentType: 'furnace', brand: 'Corvane', fuel: 'propane' },
    });
  });

  it('When the address holds a kind or fuel we do not have, or repeats a key, then the unknown is dropped and the first kept', () => {
    expect(fromRouteQuery({ q: ['one', 'two'], kind: 'recipe', fuel: 'coal' })).toEqual({
      q: 'one',
      filters: blank,
    });
  });

  it('When only some things are set, then only those go in the address, in a fixed order', () => {
    const query = toRouteQuery({ q: '  ', filters: { ...blank, fuel: 'natural-gas', kind: 'bulletin' } });
    expect(query).toEqual({ kind: 'bulletin', fuel: 'natural-gas' });
    expect(Object.keys(query)).toEqual(['kind', 'fuel']);
  });

  it('When an address is read and written back, then it is the same address', () => {
    const query = { q: 'no heat', kind: 'troubleshooting', brand: 'Halden' };
    expect(toRouteQuery(fromRouteQuery(query))).toEqual(query);
  });

  it('When only the words change, then no filter changed; a new fuel is a change', () => {
    const a = { q: 'pilot', filters: { ...blank } };
    expect(filtersChanged(a, { ...a, q: 'pilot light' })).toBe(false);
    expect(filtersChanged(a, { q: 'pilot', filters: { ...blank, fuel: 'propane' } })).toBe(true);
  });
});
