import { computed, ref } from 'vue';
import { useQuery } from '@tanstack/vue-query';
import { searchApi } from '@/api/articles';

/** What people searched the knowledge base for and did not find, over the last few days. */
export function useMissedSearches() {
  const days = ref(30);
  const query = useQuery({
    queryKey: computed(() => ['kb-missed', days.value]),
    queryFn: ({ signal }) => searchApi.missed(days.value, signal),
  });
  return { days, query, items: computed(() => query.data.value?.items ?? []) };
}
