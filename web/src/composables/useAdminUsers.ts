import { computed, ref } from 'vue';
import type { UserCreate, UserUpdate } from '@shared/schemas/admin';
import type { Role } from '@shared/schemas/auth';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';
import { useAdminSave } from './useAdminSave';

/** The users table (search, role filter, pages) and saving a user. */
export function useAdminUsers() {
  const role = ref<Role | ''>('');
  const filters = computed(() => (role.value ? { role: role.value } : {}));
  const list = useAdminList('users', adminApi.listUsers, filters);
  const save = useAdminSave(
    async (body: UserCreate) => (await adminApi.createUser(body)).user,
    async (id, body: UserUpdate) => (await adminApi.updateUser(id, body)).user,
  );

  function clearFilters(): void {
    list.clearFilters();
    role.value = '';
  }

  return { ...list, role, clearFilters, save };
}
