import { describe, expect, it } from 'vitest';
import { hasSearch, toSearchParams, type KbFilters } from './useKbSearch';

const none: KbFilters = { kind: '', equipmentType: '', brand: '', fuel: '' };

describe('toSearchParams', () => {
  it('When only words are typed, then blank filters are left out and the words trimmed', () => {
    expect(toSearchParams('  flame sensor ', none, 'kb')).toEqual({
      q: 'flame sensor',
      context: 'kb',
      limit: 20,
    });
  });

  it('When filters are chosen, then each goes in the request', () => {
    const params = toSearchParams(
      '',
      { kind: 'bulletin', equipmentType: 'furnace', brand: ' Corvane ', fuel: 'propane' },
      'kb',
    );
    expect(params).toEqual({
      q: '',
      context: 'kb',
      limit: 20,
      kind: 'bulletin',
      equipmentType: 'furnace',
      brand: 'Corvane',
      fuel: 'propane',
    });
  });
});

describe('hasSearch', () => {
  it('When nothing is typed or chosen, then there is no search (recent articles show instead)', () => {
    expect(hasSearch(toSearchParams('   ', none, 'kb'))).toBe(false);
  });

  it('When only a filter is chosen, then it is a search', () => {
    expect(hasSearch(toSearchParams('', { ...none, fuel: 'natural-gas' }, 'kb'))).toBe(true);
  });
});
