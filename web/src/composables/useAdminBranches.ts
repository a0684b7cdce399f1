import { useQueryClient } from '@tanstack/vue-query';
import type { BranchCreate, BranchUpdate } from '@shared/schemas/admin';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';

/** The branches table and saving a branch. */
export function useAdminBranches() {
  const list = useAdminList('branches', (params, signal) => adminApi.listBranches(params, signal));
  const queryClient = useQueryClient();

  async function save(id: number | null, body: BranchCreate | BranchUpdate) {
    const { branch } =
      id === null
        ? await adminApi.createBranch(body as BranchCreate)
        : await adminApi.updateBranch(id, body as BranchUpdate);
    await queryClient.invalidateQueries({ queryKey: ['admin'] });
    return branch;
  }

  return { ...list, save };
}
