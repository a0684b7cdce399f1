import { computed } from 'vue';
import { useQuery } from '@tanstack/vue-query';
import { adminApi } from '@/api/admin';

/** Every branch, page by page (the API's largest page is 100), for selects and names by id. */
export function useBranchOptions() {
  const query = useQuery({
    queryKey: ['admin', 'branches', 'options'],
    queryFn: async ({ signal }) => {
      const first = await adminApi.listBranches({ page: 1, pageSize: 100 }, signal);
      const items = [...first.items];
      for (let page = 2; items.length < first.total && page <= 50; page++) {
        const next = await adminApi.listBranches({ page, pageSize: 100 }, signal);
        if (next.items.length === 0) break;
        items.push(...next.items);
      }
      return { items, total: first.total };
    },
  });
  const branches = computed(() => query.data.value?.items ?? []);
  const byId = computed(() => new Map(branches.value.map((b) => [b.id, b])));
  return { branches, byId, loading: computed(() => query.isFetching.value) };
}
