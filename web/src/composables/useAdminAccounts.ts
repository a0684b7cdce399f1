import type { AccountCreate, AccountUpdate } from '@shared/schemas/admin';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';
import { useAdminSave } from './useAdminSave';

/** The contractor accounts table and saving an account. */
export function useAdminAccounts() {
  const list = useAdminList('accounts', adminApi.listAccounts);
  const save = useAdminSave(
    async (body: AccountCreate) => (await adminApi.createAccount(body)).account,
    async (id, body: AccountUpdate) => (await adminApi.updateAccount(id, body)).account,
  );
  return { ...list, save };
}
