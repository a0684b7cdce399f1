import { computed, ref } from 'vue';
import { useI18n } from 'vue-i18n';
import { articleImagesApi } from '@/api/articleImages';
import { ApiError } from '@/api/http';

export interface InsertedImage {
  url: string;
  alt: string;
}

/** The alt text of a photo from its file name: no extension, nothing Markdown would read as syntax. */
export function altFromFileName(name: string): string {
  return (
    name
      .replace(/\.[^.]*$/, '')
      .replace(/[[\]()<>*_`\\!#|]+/g, ' ')
      .replace(/\s+/g, ' ')
      .trim()
      .slice(0, 80) || 'photo'
  );
}

/**
 * Photos for an article's text: each goes to the article's image route and comes back as an address
 * the renderer accepts. A photo needs a saved article to belong to, so a new article is saved as a
 * draft first (`ensureSaved`); when that cannot happen yet, the writer is told why.
 */
export function useArticleImageUpload(options: {
  articleId: () => number | null;
  ensureSaved: () => Promise<number | null>;
}) {
  const { t } = useI18n();
  const uploading = ref(false);
  const progress = ref(0);
  const error = ref<string | null>(null);
  const needsDraft = computed(() => options.articleId() === null);

  async function upload(files: File[]): Promise<InsertedImage[]> {
    error.value = null;
    const photos = files.filter((f) => f.type.startsWith('image/'));
    if (photos.length === 0) {
      if (files.length > 0) error.value = t('kb.editor.photo.onlyPhotos');
      return [];
    }
    uploading.value = true;
    progress.value = 0;
    // Photos that made it are inserted even when a later one fails.
    const done: InsertedImage[] = [];
    try {
      const id = options.articleId() ?? (await options.ensureSaved());
      if (id === null) {
        error.value = t('kb.editor.photo.saveFirst');
        return [];
      }
      for (const [i, file] of photos.entries()) {
        const { image } = await articleImagesApi.upload(id, file, (sent) => {
          progress.value = Math.round(((i + sent) / photos.length) * 100);
        });
        done.push({ url: image.url, alt: altFromFileName(file.name) });
      }
      return done;
    } catch (err) {
      error.value =
        err instanceof ApiError
          ? t('kb.editor.photo.failed', { reason: err.message })
          : t('kb.editor.photo.failed', { reason: t('errors.unknown') });
      return done;
    } finally {
      uploading.value = false;
    }
  }

  return { upload, uploading, progress, error, needsDraft };
}
