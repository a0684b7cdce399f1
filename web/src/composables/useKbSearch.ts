import { computed, reactive, ref, toValue, type MaybeRefOrGetter } from 'vue';
import { keepPreviousData, useQuery } from '@tanstack/vue-query';
import type { ArticleKind } from '@shared/schemas/articles';
import { articlesApi, searchApi, type SearchParams } from '@/api/articles';
import { useDebouncedRef } from './useDebouncedRef';

export interface KbFilters {
  kind: ArticleKind | '';
  equipmentType: string;
  brand: string;
  fuel: 'natural-gas' | 'propane' | '';
}

/** The request for a typed search and filters: blank filters left out, wording trimmed. */
export function toSearchParams(
  q: string,
  filters: KbFilters,
  context: SearchParams['context'],
): SearchParams {
  const params: SearchParams = { q: q.trim(), context, limit: 20 };
  if (filters.kind) params.kind = filters.kind;
  if (filters.equipmentType) params.equipmentType = filters.equipmentType;
  if (filters.brand.trim()) params.brand = filters.brand.trim();
  if (filters.fuel) params.fuel = filters.fuel;
  return params;
}

/** Whether there is anything to search for: some words, or a filter chosen. */
export function hasSearch(params: SearchParams): boolean {
  return Boolean(params.q || params.kind || params.equipmentType || params.brand || params.fuel);
}

/** The knowledge-base home: debounced search with filters, and what changed lately when idle. */
export function useKbSearch(
  options: { reviewer: boolean; initial?: { q: string; filters: KbFilters } } = { reviewer: false },
) {
  const text = ref(options.initial?.q ?? '');
  const filters = reactive<KbFilters>({
    kind: '',
    equipmentType: '',
    brand: '',
    fuel: '',
    ...options.initial?.filters,
  });
  const debounced = useDebouncedRef(text, 300);
  const params = computed(() => toSearchParams(debounced.value, filters, 'kb'));
  const active = computed(() => hasSearch(params.value));

  const results = useQuery({
    queryKey: computed(() => ['kb-search', params.value]),
    queryFn: ({ signal }) => searchApi.search(params.value, signal),
    enabled: active,
    placeholderData: keepPreviousData,
  });
  const recent = useQuery({
    queryKey: ['kb-recent'],
    queryFn: ({ signal }) => articlesApi.list({ pageSize: 10, status: 'published' }, signal),
    enabled: computed(() => !active.value),
  });

  const reviewing = useQuery({
    queryKey: ['kb-in-review'],
    queryFn: ({ signal }) => articlesApi.list({ pageSize: 20, status: 'in-review' }, signal),
    enabled: options.reviewer,
  });

  return { text, debounced, filters, active, results, recent, reviewing };
}

/** Search for articles from elsewhere (new ticket, desk): wording from a getter, debounced. */
export function useArticleSuggestions(
  source: MaybeRefOrGetter<string>,
  context: 'new-ticket' | 'desk',
  options: { min?: number; limit?: number } = {},
) {
  const wording = computed(() => toValue(source).trim());
  const debounced = useDebouncedRef(wording, 300);
  const min = options.min ?? 3;
  const enabled = computed(() => debounced.value.length >= min);
  const query = useQuery({
    queryKey: computed(() => ['kb-suggest', context, debounced.value]),
    queryFn: ({ signal }) =>
      searchApi.search({ q: debounced.value, context, limit: options.limit ?? 3 }, signal),
    enabled,
    placeholderData: keepPreviousData,
  });
  const hits = computed(() => (enabled.value ? (query.data.value?.hits ?? []) : []));
  const queryId = computed(() => query.data.value?.queryId ?? null);
  /** Record that an article from these hits answered the question (a ticket not needed). */
  async function solved(articleId: number): Promise<void> {
    if (queryId.value !== null) await searchApi.outcome(queryId.value, articleId, true);
  }
  return {
    hits,
    queryId,
    loading: computed(() => enabled.value && query.isFetching.value),
    query,
    solved,
  };
}
