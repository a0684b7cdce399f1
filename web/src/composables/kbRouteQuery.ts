import type { LocationQuery } from 'vue-router';
import { ARTICLE_KINDS, type ArticleKind } from '@shared/schemas/articles';
import type { KbFilters } from './useKbSearch';

export interface KbRouteState {
  q: string;
  filters: KbFilters;
}

const FUELS = ['natural-gas', 'propane'] as const;

const first = (value: LocationQuery[string] | undefined): string => {
  const v = Array.isArray(value) ? value[0] : value;
  return typeof v === 'string' ? v.trim().slice(0, 200) : '';
};

/** What the knowledge-base address asks for: `?q=&kind=&equipmentType=&brand=&fuel=`, unknown values dropped. */
export function fromRouteQuery(query: LocationQuery): KbRouteState {
  const kind = first(query.kind);
  const fuel = first(query.fuel);
  return {
    q: first(query.q),
    filters: {
      kind: (ARTICLE_KINDS as readonly string[]).includes(kind) ? (kind as ArticleKind) : '',
      equipmentType: first(query.equipmentType).slice(0, 40),
      brand: first(query.brand).slice(0, 40),
      fuel: (FUELS as readonly string[]).includes(fuel) ? (fuel as KbFilters['fuel']) : '',
    },
  };
}

/** The address for a search: only what is set, in a fixed order, so equal searches share one link. */
export function toRouteQuery(state: KbRouteState): Record<string, string> {
  const out: Record<string, string> = {};
  const q = state.q.trim();
  if (q) out.q = q;
  const { kind, equipmentType, brand, fuel } = state.filters;
  if (kind) out.kind = kind;
  if (equipmentType) out.equipmentType = equipmentType;
  if (brand.trim()) out.brand = brand.trim();
  if (fuel) out.fuel = fuel;
  return out;
}

export const sameQuery = (a: Record<string, string>, b: Record<string, string>) =>
  JSON.stringify(a) === JSON.stringify(b);

/** Whether going from one search to the other changed a filter (a new history entry) or only the words. */
export function filtersChanged(from: KbRouteState, to: KbRouteState): boolean {
  const a = toRouteQuery({ ...from, q: '' });
  const b = toRouteQuery({ ...to, q: '' });
  return !sameQuery(a, b);
}
