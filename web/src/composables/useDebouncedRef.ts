import { onScopeDispose, ref, watch, type Ref } from 'vue';

// A few lines of our own rather than a utility library for one function.
/** A copy of `source` that follows it once it has been still for `delay` ms. */
export function useDebouncedRef<T>(source: Ref<T>, delay = 300): Ref<T> {
  const debounced = ref(source.value) as Ref<T>;
  let timer: ReturnType<typeof setTimeout> | undefined;
  watch(source, (value) => {
    clearTimeout(timer);
    timer = setTimeout(() => {
      debounced.value = value;
    }, delay);
  });
  onScopeDispose(() => clearTimeout(timer));
  return debounced;
}
