import { computed, ref, watch } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { keepPreviousData, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Ticket } from '@shared/schemas/tickets';
import { deskApi } from '@/api/desk';
import { useSessionStore } from '@/stores/session';
import {
  BOARD_PAGE_SIZE,
  filtersFromQuery,
  isFiltered,
  mergeBoardTicket,
  paramsFromFilters,
  queryFromFilters,
  type BoardFilters,
} from './deskBoardFilters';
import { useDebouncedRef } from './useDebouncedRef';
import { useTicketUpdates } from './useTickets';

type BoardPage = { items: Ticket[]; total: number };

/**
 * The desk board: filters read from and written to the URL, a debounced search box, one page of
 * tickets kept current from 'ticket:updated'.
 */
export function useDeskBoard() {
  const route = useRoute();
  const router = useRouter();
  const session = useSessionStore();
  const queryClient = useQueryClient();

  const filters = computed(() => filtersFromQuery(route.query));
  const search = ref(filters.value.q);
  const debouncedSearch = useDebouncedRef(search, 350);

  /** Change some filters; any change but the page starts again from page 1. */
  function setFilters(change: Partial<BoardFilters>): void {
    const next = { ...filters.value, page: 1, ...change };
    void router.replace({ query: queryFromFilters(next) });
  }
  watch(debouncedSearch, (q) => {
    if (q.trim() !== filters.value.q) setFilters({ q });
  });
  // Back/forward or a link changed the URL's search: the box follows.
  watch(
    () => filters.value.q,
    (q) => {
      if (q !== search.value.trim()) search.value = q;
    },
  );

  const params = computed(() => paramsFromFilters(filters.value));
  const queryKey = computed(() => ['desk-board', params.value] as const);
  const query = useQuery({
    queryKey,
    queryFn: ({ signal }) => deskApi.board(params.value, signal),
    placeholderData: keepPreviousData,
  });

  useTicketUpdates((ticket) => {
    const userId = session.user?.id ?? null;
    queryClient.setQueryData<BoardPage>(queryKey.value, (old) =>
      old ? mergeBoardTicket(old, ticket, filters.value, userId, BOARD_PAGE_SIZE) : old,
    );
    // Other filter combinations are out of date now; they reload when shown again.
    void queryClient.invalidateQueries({
      queryKey: ['desk-board'],
      refetchType: 'none',
      predicate: (q) => JSON.stringify(q.queryKey) !== JSON.stringify(queryKey.value),
    });
    queryClient.setQueryData<{ ticket: Ticket }>(['ticket', ticket.id], (old) => (old ? { ticket } : old));
  });

  function clearFilters(): void {
    search.value = '';
    void router.replace({ query: {} });
  }

  return {
    filters,
    search,
    setFilters,
    clearFilters,
    filtered: computed(() => isFiltered(filters.value)),
    pageSize: BOARD_PAGE_SIZE,
    tickets: computed(() => query.data.value?.items ?? []),
    total: computed(() => query.data.value?.total ?? 0),
    firstLoad: computed(() => query.isPending.value),
    fetching: computed(() => query.isFetching.value),
    error: computed(() => query.error.value),
    retry: () => query.refetch(),
  };
}
