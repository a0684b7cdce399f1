import { computed, ref, toValue, type MaybeRefOrGetter } from 'vue';
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import { equipmentCatalogueApi } from '@/api/equipment';
import { useDebouncedRef } from './useDebouncedRef';

/** The catalogue search: what is typed, debounced, and the models it finds. */
export function useEquipmentSearch(limit = 15, enabled: MaybeRefOrGetter<boolean> = true) {
  const search = ref('');
  const debounced = useDebouncedRef(search, 250);
  const query = useQuery({
    queryKey: computed(() => ['equipment', 'search', debounced.value.trim(), limit]),
    queryFn: ({ signal }) => equipmentCatalogueApi.search(debounced.value.trim(), limit, signal),
    placeholderData: keepPreviousData,
    enabled: computed(() => toValue(enabled)),
  });
  const items = computed(() => query.data.value?.items ?? []);
  return { search, items, query };
}

/** One model with its spec table; idle while no model is chosen. */
export function useEquipmentModel(id: MaybeRefOrGetter<number | null>) {
  return useQuery({
    queryKey: computed(() => ['equipment', 'model', toValue(id)]),
    queryFn: ({ signal }) => equipmentCatalogueApi.get(toValue(id)!, signal),
    enabled: computed(() => toValue(id) !== null),
    select: (data) => data.model,
  });
}

/** Save (or clear, with null) a model's spec table; the cached model is replaced with the answer. */
export function useSaveEquipmentSpec(id: MaybeRefOrGetter<number>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (spec: unknown) => equipmentCatalogueApi.saveSpec(toValue(id), spec),
    onSuccess: (data) => client.setQueryData(['equipment', 'model', toValue(id)], data),
  });
}
