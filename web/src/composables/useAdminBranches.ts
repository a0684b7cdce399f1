import type { BranchCreate, BranchUpdate } from '@shared/schemas/admin';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';
import { useAdminSave } from './useAdminSave';

/** The branches table and saving a branch. */
export function useAdminBranches() {
  const list = useAdminList('branches', adminApi.listBranches);
  const save = useAdminSave(
    async (body: BranchCreate) => (await adminApi.createBranch(body)).branch,
    async (id, body: BranchUpdate) => (await adminApi.updateBranch(id, body)).branch,
  );
  return { ...list, save };
}
