import { computed } from 'vue';
import { useQuery } from '@tanstack/vue-query';
import { adminApi } from '@/api/admin';

/** Every branch (the API's largest page), for selects and for showing branch names by id. */
export function useBranchOptions() {
  const query = useQuery({
    queryKey: ['admin', 'branches', 'options'],
    queryFn: ({ signal }) => adminApi.listBranches({ page: 1, pageSize: 100 }, signal),
  });
  const branches = computed(() => query.data.value?.items ?? []);
  const byId = computed(() => new Map(branches.value.map((b) => [b.id, b])));
  return { branches, byId, loading: computed(() => query.isFetching.value) };
}
