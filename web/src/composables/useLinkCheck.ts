import { ref, shallowRef } from 'vue';
import { ApiError } from '@/api/http';

/** Link states the server names; anything else (no network, 500) is worth a retry. */
const LINK_CODES = new Set(['link_unknown', 'link_used', 'link_expired', 'link_revoked']);

export type LinkState = 'checking' | 'ready' | 'unusable' | 'failed';

/**
 * An e-mailed link's page: ask the server whether the link still works before anyone types.
 * `unusable` carries the server's reason (used, expired, withdrawn, not valid).
 */
export function useLinkCheck<T>(check: () => Promise<T>) {
  const state = ref<LinkState>('checking');
  const data = shallowRef<T | null>(null);
  const problem = ref<string | null>(null);
  const code = ref<string | null>(null);

  /** True when the error means the link itself is no good (then the page says so). */
  function refuse(error: unknown): boolean {
    if (!(error instanceof ApiError) || !LINK_CODES.has(error.code)) return false;
    state.value = 'unusable';
    problem.value = error.message;
    code.value = error.code;
    return true;
  }

  async function load(): Promise<void> {
    state.value = 'checking';
    problem.value = null;
    try {
      data.value = await check();
      state.value = 'ready';
    } catch (error) {
      if (refuse(error)) return;
      state.value = 'failed';
      problem.value = error instanceof Error ? error.message : null;
    }
  }

  return { state, data, problem, code, load, refuse };
}
