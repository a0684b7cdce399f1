import { onScopeDispose, ref } from 'vue';

/** The current time, refreshed every `interval` ms, so relative times stay true. */
export function useNow(interval = 30_000) {
  const now = ref(new Date());
  const timer = setInterval(() => {
    now.value = new Date();
  }, interval);
  onScopeDispose(() => clearInterval(timer));
  return now;
}
