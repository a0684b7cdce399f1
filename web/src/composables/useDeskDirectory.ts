import { computed } from 'vue';
import { useQuery } from '@tanstack/vue-query';
import { deskApi } from '@/api/desk';

/** The people and the branches rarely change during a shift. */
const STALE_MS = 5 * 60_000;

/** The desk's branches (to transfer a ticket to) and members (to assign it to). Staff only. */
export function useDeskDirectory() {
  const branches = useQuery({
    queryKey: ['desk', 'branches'],
    queryFn: ({ signal }) => deskApi.branches(signal),
    staleTime: STALE_MS,
  });
  const members = useQuery({
    queryKey: ['desk', 'members'],
    queryFn: ({ signal }) => deskApi.members(signal),
    staleTime: STALE_MS,
  });
  return {
    branches: computed(() => branches.data.value?.items ?? []),
    members: computed(() => members.data.value?.items ?? []),
    loading: computed(() => branches.isPending.value || members.isPending.value),
    error: computed(() => branches.error.value ?? members.error.value),
    retry: () => Promise.all([branches.refetch(), members.refetch()]),
  };
}
