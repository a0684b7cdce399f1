import { computed, ref, toValue, type MaybeRefOrGetter } from 'vue';
import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import { articlesApi } from '@/api/articles';

/** One article by its slug, and the reader's "did it help" answer. */
export function useArticle(slug: MaybeRefOrGetter<string>) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: computed(() => ['article', toValue(slug)]),
    queryFn: ({ signal }) => articlesApi.get(toValue(slug), signal),
    enabled: computed(() => toValue(slug) !== ''),
    retry: (count, error) => (error as { status?: number }).status !== 404 && count < 2,
  });
  const article = computed(() => query.data.value?.article ?? null);
  const answered = ref<boolean | null>(null);
  const feedback = useMutation({
    mutationFn: (helped: boolean) => {
      const current = article.value;
      if (!current) throw new Error('No article');
      return articlesApi.feedback(current.id, helped);
    },
    onSuccess: (_data, helped) => {
      answered.value = helped;
      void queryClient.invalidateQueries({ queryKey: ['article', toValue(slug)] });
    },
  });
  const notFound = computed(() => (query.error.value as { status?: number } | null)?.status === 404);
  return { query, article, notFound, answered, feedback };
}
