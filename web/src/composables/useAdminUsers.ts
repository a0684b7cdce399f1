import { computed, ref } from 'vue';
import { useQueryClient } from '@tanstack/vue-query';
import type { UserCreate, UserUpdate } from '@shared/schemas/admin';
import type { Role } from '@shared/schemas/auth';
import { adminApi } from '@/api/admin';
import { useAdminList } from './useAdminList';

/** The users table (search, role filter, pages) and saving a user. */
export function useAdminUsers() {
  const role = ref<Role | ''>('');
  const filters = computed(() => (role.value ? { role: role.value } : {}));
  const list = useAdminList('users', (params, signal) => adminApi.listUsers(params, signal), filters);
  const queryClient = useQueryClient();

  async function save(id: number | null, body: UserCreate | UserUpdate) {
    const { user } =
      id === null
        ? await adminApi.createUser(body as UserCreate)
        : await adminApi.updateUser(id, body as UserUpdate);
    await queryClient.invalidateQueries({ queryKey: ['admin'] });
    return user;
  }

  return { ...list, role, save };
}
