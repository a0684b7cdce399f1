import { computed, type MaybeRefOrGetter, toValue } from 'vue';
import { useQuery } from '@tanstack/vue-query';
import { articlesApi } from '@/api/articles';

/** The published article that best fits a topic (by title or summary), if the knowledge base has one. */
export function useRelatedArticle(topic: MaybeRefOrGetter<string | null>) {
  const query = useQuery({
    queryKey: computed(() => ['related-article', toValue(topic)]),
    enabled: computed(() => !!toValue(topic)),
    queryFn: ({ signal }) =>
      articlesApi.list({ q: toValue(topic)!, status: 'published', pageSize: 1 }, signal),
    staleTime: 5 * 60_000,
  });
  return computed(() => query.data.value?.items[0] ?? null);
}
