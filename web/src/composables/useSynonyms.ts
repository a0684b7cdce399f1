import { computed } from 'vue';
import { useQuery, useQueryClient } from '@tanstack/vue-query';
import { synonymsApi } from '@/api/synonyms';

/** The groups of words search treats as one: list, add, change, remove. Search results refresh after each. */
export function useSynonyms() {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: ['kb-synonyms'],
    queryFn: ({ signal }) => synonymsApi.list(signal),
  });
  const items = computed(() => query.data.value?.synonyms ?? []);

  async function changed(): Promise<void> {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: ['kb-synonyms'] }),
      queryClient.invalidateQueries({ queryKey: ['kb-search'] }),
    ]);
  }

  return {
    query,
    items,
    create: async (terms: string[]) => {
      await synonymsApi.create(terms);
      await changed();
    },
    update: async (id: number, terms: string[]) => {
      await synonymsApi.update(id, terms);
      await changed();
    },
    remove: async (id: number) => {
      await synonymsApi.remove(id);
      await changed();
    },
  };
}
