import { computed, ref, watch } from 'vue';
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { InvitationStatus } from '@shared/schemas/invitations';
import { invitationsApi } from '@/api/invitations';

export const INVITATION_PAGE_SIZE = 10;

/** The invitations the signed-in admin or account owner may see, by status, a page at a time. */
export function useInvitations() {
  const queryClient = useQueryClient();
  const status = ref<InvitationStatus | ''>('waiting');
  const page = ref(1);
  watch(status, () => {
    page.value = 1;
  });
  const query = useQuery({
    queryKey: computed(() => ['invitations', { status: status.value, page: page.value }] as const),
    queryFn: ({ signal }) =>
      invitationsApi.list(
        {
          page: page.value,
          pageSize: INVITATION_PAGE_SIZE,
          ...(status.value ? { status: status.value } : {}),
        },
        signal,
      ),
    placeholderData: keepPreviousData,
  });
  const revoke = useMutation({
    mutationFn: (id: number) => invitationsApi.revoke(id),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['invitations'] }),
  });
  return {
    status,
    page,
    items: computed(() => query.data.value?.items ?? []),
    total: computed(() => query.data.value?.total ?? 0),
    firstLoad: computed(() => query.isPending.value),
    loading: computed(() => query.isFetching.value),
    error: computed(() => query.error.value),
    retry: () => query.refetch(),
    revoke: (id: number) => revoke.mutateAsync(id),
  };
}
