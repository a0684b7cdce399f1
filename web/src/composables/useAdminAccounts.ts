import { useQueryClient } from '@tanstack/vue-query';
import type { AccountCreate, AccountUpdate } from '@shared/schemas/admin';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';

/** The contractor accounts table and saving an account. */
export function useAdminAccounts() {
  const list = useAdminList('accounts', (params, signal) => adminApi.listAccounts(params, signal));
  const queryClient = useQueryClient();

  async function save(id: number | null, body: AccountCreate | AccountUpdate) {
    const { account } =
      id === null
        ? await adminApi.createAccount(body as AccountCreate)
        : await adminApi.updateAccount(id, body as AccountUpdate);
    await queryClient.invalidateQueries({ queryKey: ['admin'] });
    return account;
  }

  return { ...list, save };
}
