import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { LoginBody, Role, SessionUser } from '@shared/schemas/auth';
import { isStaffRole } from '@/api/roles';
import { authApi } from '@/api/auth';
import { ApiError, resetCsrfToken } from '@/api/http';
import { queryClient } from '@/api/queryClient';
import { useConnectionStore } from './connection';

/** Who is signed in. Global: the shell, the router guards and every view read it. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null);
  const loaded = ref(false);
  let loading: Promise<void> | null = null;
  const connection = useConnectionStore();

  const role = computed<Role | null>(() => user.value?.role ?? null);
  const isSignedIn = computed(() => user.value !== null);
  const isContractor = computed(() => role.value === 'contractor');
  const isStaff = computed(() => role.value !== null && isStaffRole(role.value));
  const isAdmin = computed(() => role.value === 'admin');
  const hasRole = (...roles: readonly Role[]) => role.value !== null && roles.includes(role.value);

  function start(next: SessionUser): void {
    user.value = next;
    loaded.value = true;
    void connection.connect();
  }

  /** Ask the server once who we are; a 401 just means nobody is signed in. */
  function load(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    loading ??= authApi
      .me()
      .then(({ user: me }) => start(me))
      .catch((error: unknown) => {
        if (!(error instanceof ApiError)) throw error;
        user.value = null;
        loaded.value = true;
      })
      .finally(() => {
        loading = null;
      });
    return loading;
  }

  async function signIn(body: LoginBody): Promise<SessionUser> {
    const { user: me } = await authApi.login(body);
    queryClient.clear();
    start(me);
    return me;
  }

  /** Take over a session the server has just started for someone (joining by invitation). */
  function adopt(next: SessionUser): void {
    connection.disconnect();
    queryClient.clear();
    start(next);
  }

  /** Forget everything about the session locally (the server side is already gone or going). */
  function clear(): void {
    connection.disconnect();
    user.value = null;
    loaded.value = true;
    queryClient.clear();
    resetCsrfToken();
  }

  async function signOut(): Promise<void> {
    // Disconnect first so our own "session ended" event does not race the navigation.
    connection.disconnect();
    try {
      await authApi.logout();
    } catch (error) {
      if (!(error instanceof ApiError) || error.status !== 401) throw error;
    } finally {
      clear();
    }
  }

  return {
    user,
    loaded,
    role,
    isSignedIn,
    isContractor,
    isStaff,
    isAdmin,
    hasRole,
    load,
    signIn,
    signOut,
    adopt,
    clear,
  };
});
