import { watch, type Ref } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { filtersChanged, fromRouteQuery, sameQuery, toRouteQuery } from './kbRouteQuery';
import type { KbFilters } from './useKbSearch';

/**
 * Keeps the knowledge-base search in the address bar, so a search can be shared as a link and
 * back/forward step through searches. A changed filter is a new history entry; more words typed
 * replace the current one. The address is written only once the typing has settled.
 */
export function useKbRouteSync(state: { text: Ref<string>; debounced: Ref<string>; filters: KbFilters }) {
  const route = useRoute();
  const router = useRouter();

  // Back, forward or a followed link: the address wins.
  watch(
    () => route.query,
    (query) => {
      if (route.name !== 'kb') return;
      const next = fromRouteQuery(query);
      if (state.text.value.trim() !== next.q) state.text.value = next.q;
      for (const key of Object.keys(next.filters) as (keyof KbFilters)[]) {
        if (state.filters[key] !== next.filters[key])
          Object.assign(state.filters, { [key]: next.filters[key] });
      }
    },
  );

  // The page changed: write it into the address.
  watch([state.debounced, () => ({ ...state.filters })], () => {
    if (route.name !== 'kb' || state.text.value !== state.debounced.value) return;
    const current = fromRouteQuery(route.query);
    const next = { q: state.debounced.value, filters: { ...state.filters } };
    const query = toRouteQuery(next);
    if (sameQuery(query, toRouteQuery(current))) return;
    if (filtersChanged(current, next)) void router.push({ name: 'kb', query });
    else void router.replace({ name: 'kb', query });
  });
}
