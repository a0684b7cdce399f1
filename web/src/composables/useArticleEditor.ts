import { computed, reactive, ref, watch } from 'vue';
import { useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Article, ArticleCreate, ArticleKind, Audience } from '@shared/schemas/articles';
import type { EquipmentModel } from '@shared/schemas/tickets';
import { articlesApi, type ArticleRevision } from '@/api/articles';
import { useSessionStore } from '@/stores/session';
import { useFormErrors } from './useFormErrors';

export const ARTICLE_FIELDS = ['title', 'summary', 'body', 'kind', 'audience', 'equipmentModelIds'];

export interface ArticleFormValues {
  title: string;
  summary: string;
  body: string;
  kind: ArticleKind;
  audience: Audience;
  equipmentModelIds: number[];
}

type LinkedModel = Pick<EquipmentModel, 'id' | 'brand' | 'modelNumber'>;

/** The form's values for an article (or a blank draft). */
export function toFormValues(article: Article | null): ArticleFormValues {
  return {
    title: article?.title ?? '',
    summary: article?.summary ?? '',
    body: article?.body ?? '',
    kind: article?.kind ?? 'troubleshooting',
    audience: article?.audience ?? 'contractor',
    equipmentModelIds: article?.models.map((m) => m.id) ?? [],
  };
}

/** What the review buttons may do for this person on this article (mirrors the API's policy). */
export function reviewActions(article: Article | null, user: { id: number; role: string } | null) {
  const reviewer = user?.role === 'specialist' || user?.role === 'admin';
  const mayPublish =
    user?.role === 'admin' || (user?.role === 'specialist' && article?.author.id !== user.id);
  const status = article?.status;
  return {
    submit: status === 'draft',
    publish: Boolean(mayPublish && (status === 'in-review' || status === 'draft')),
    sendBack: Boolean(mayPublish && status === 'in-review'),
    retire: Boolean(reviewer && status !== undefined && status !== 'retired'),
  };
}

/** The article editor: load, edit, save a revision, move through review, history and restore. */
export function useArticleEditor(slug: string | null) {
  const session = useSessionStore();
  const queryClient = useQueryClient();
  const values = reactive<ArticleFormValues>(toFormValues(null));
  const errors = useFormErrors(ARTICLE_FIELDS);
  const article = ref<Article | null>(null);
  const linked = ref<LinkedModel[]>([]);
  const busy = ref<string | null>(null);
  const dirty = ref(false);

  const load = useQuery({
    queryKey: ['article', slug ?? ''],
    queryFn: ({ signal }) => articlesApi.get(slug ?? '', signal),
    enabled: slug !== null,
  });
  watch(
    () => load.data.value?.article,
    (loaded) => {
      if (!loaded || (article.value && dirty.value)) return;
      adopt(loaded);
    },
    { immediate: true },
  );
  watch(values, () => (dirty.value = true), { deep: true });

  const revisions = useQuery({
    queryKey: computed(() => ['article-revisions', article.value?.id ?? 0]),
    queryFn: ({ signal }) => articlesApi.revisions(article.value?.id ?? 0, signal),
    enabled: computed(() => article.value !== null),
  });

  function adopt(next: Article): void {
    article.value = next;
    linked.value = next.models;
    Object.assign(values, toFormValues(next));
    queueMicrotask(() => (dirty.value = false));
    queryClient.setQueryData(['article', next.slug], { article: next });
    void queryClient.invalidateQueries({ queryKey: ['article-revisions', next.id] });
    void queryClient.invalidateQueries({ queryKey: ['kb-recent'] });
  }

  async function run(name: string, action: () => Promise<{ article: Article }>): Promise<Article | null> {
    errors.clear();
    busy.value = name;
    try {
      const { article: next } = await action();
      adopt(next);
      return next;
    } catch (error) {
      errors.fromError(error);
      return null;
    } finally {
      busy.value = null;
    }
  }

  const body = (): ArticleCreate => ({ ...values, equipmentModelIds: [...values.equipmentModelIds] });
  const save = (note?: string) => {
    const current = article.value;
    return run('save', () =>
      current
        ? articlesApi.update(current.id, note ? { ...body(), note } : body())
        : articlesApi.create(body()),
    );
  };
  /** Saves unsaved changes first, so what is reviewed is what is on screen. */
  const step = (name: 'submit' | 'publish' | 'retire') => async () => {
    if (!article.value || dirty.value) {
      if (!(await save())) return null;
    }
    const id = article.value?.id ?? 0;
    return run(name, () => articlesApi[name](id));
  };
  const sendBack = (note: string) =>
    run('sendBack', () => articlesApi.sendBack(article.value?.id ?? 0, note));
  const restore = (revision: ArticleRevision, note: string) =>
    run('restore', () =>
      articlesApi.update(article.value?.id ?? 0, {
        title: revision.title,
        summary: revision.summary,
        body: revision.body,
        note,
      }),
    );

  return {
    values,
    errors,
    article,
    linked,
    busy,
    dirty,
    load,
    revisions,
    actions: computed(() => reviewActions(article.value, session.user)),
    save,
    submit: step('submit'),
    publish: step('publish'),
    retire: step('retire'),
    sendBack,
    restore,
  };
}
