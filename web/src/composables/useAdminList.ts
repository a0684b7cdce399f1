import { computed, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { keepPreviousData, useQuery } from '@tanstack/vue-query';
import type { Page } from '@shared/schemas/common';
import type { ListParams } from '@/api/admin';
import { useDebouncedRef } from './useDebouncedRef';

export const PAGE_SIZES = [10, 20, 50, 100] as const;

/** An admin list as a component reads it: the result of `useAdminList` wrapped in `reactive`. */
export interface AdminListState<T> {
  items: T[];
  total: number;
  loading: boolean;
  firstLoad: boolean;
  error: Error | null;
  filtered: boolean;
  retry: () => unknown;
  clearFilters: () => void;
}

/**
 * One admin table's data: a debounced search, a page, optional filters, and the page of rows.
 * The previous page stays on screen while the next one loads. A caller with filters of its own
 * clears them beside `clearFilters`.
 */
export function useAdminList<T, F extends object = Record<never, never>>(
  key: string,
  fetchPage: (params: ListParams & F, signal: AbortSignal) => Promise<Page<T>>,
  filters: MaybeRefOrGetter<F> = {} as F,
) {
  const search = ref('');
  const q = useDebouncedRef(search, 300);
  const page = ref(1);
  const pageSize = ref<number>(20);

  const params = computed(() => {
    const text = q.value.trim();
    return { page: page.value, pageSize: pageSize.value, ...(text ? { q: text } : {}), ...toValue(filters) };
  });
  // A new search or filter starts again from the first page.
  watch([q, pageSize, () => JSON.stringify(toValue(filters))], () => {
    page.value = 1;
  });

  /** A search or a filter is on, so an empty page means "nothing matches" rather than "nothing yet". */
  const filtered = computed(() => q.value.trim() !== '' || Object.keys(toValue(filters)).length > 0);

  function clearFilters(): void {
    search.value = '';
    q.value = '';
  }

  const query = useQuery({
    queryKey: computed(() => ['admin', key, params.value]),
    queryFn: ({ signal }) => fetchPage(params.value, signal),
    placeholderData: keepPreviousData,
  });

  return {
    search,
    q,
    page,
    pageSize,
    items: computed<T[]>(() => query.data.value?.items ?? []),
    total: computed(() => query.data.value?.total ?? 0),
    loading: computed(() => query.isFetching.value),
    firstLoad: computed(() => query.isPending.value),
    error: computed(() => query.error.value),
    filtered,
    retry: () => query.refetch(),
    clearFilters,
  };
}
