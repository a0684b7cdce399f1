import { computed, ref } from 'vue';
import { keepPreviousData, useQuery } from '@tanstack/vue-query';
import { adminApi } from '@/api/admin';

export interface AccountOption {
  id: number;
  company: string;
  accountNumber?: string;
}

/** Contractor accounts found by company or number, for the user form's account select. */
export function useAccountOptions() {
  const q = ref('');
  const query = useQuery({
    queryKey: computed(() => ['admin', 'accounts', 'options', q.value]),
    queryFn: ({ signal }) =>
      adminApi.listAccounts({ page: 1, pageSize: 20, ...(q.value ? { q: q.value } : {}) }, signal),
    placeholderData: keepPreviousData,
  });
  const options = computed<AccountOption[]>(() =>
    (query.data.value?.items ?? []).map(({ id, company, accountNumber }) => ({ id, company, accountNumber })),
  );
  return {
    options,
    loading: computed(() => query.isFetching.value),
    search: (text: string) => {
      q.value = text.trim();
    },
  };
}
