import { computed, ref } from 'vue';
import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Snippet } from '@shared/schemas/tickets';
import { snippetsApi, type SnippetDraft } from '@/api/snippets';
import { useSessionStore } from '@/stores/session';
import { filterSnippets } from './snippetSearch';

const KEY = ['snippets'] as const;

/** Reply snippets: my own and the shared ones, a search over them, and saving / deleting mine. */
export function useSnippets() {
  const session = useSessionStore();
  const queryClient = useQueryClient();
  const search = ref('');
  const query = useQuery({ queryKey: KEY, queryFn: ({ signal }) => snippetsApi.list(signal) });
  const userId = computed(() => session.user?.id ?? null);

  const refresh = () => queryClient.invalidateQueries({ queryKey: KEY });
  const save = useMutation({
    mutationFn: ({ id, draft }: { id: number | null; draft: SnippetDraft }) =>
      id === null ? snippetsApi.create(draft) : snippetsApi.update(id, draft),
    onSuccess: refresh,
  });
  const remove = useMutation({ mutationFn: (id: number) => snippetsApi.remove(id), onSuccess: refresh });

  /** The server says who may change each snippet. */
  const canEdit = (snippet: Snippet): boolean => snippet.canEdit;

  return {
    search,
    all: computed(() => query.data.value?.items ?? []),
    visible: computed(() => filterSnippets(query.data.value?.items ?? [], search.value, userId.value)),
    loading: computed(() => query.isPending.value),
    error: computed(() => query.error.value),
    retry: () => query.refetch(),
    canEdit,
    save,
    remove,
  };
}
