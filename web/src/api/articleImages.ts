import type { ArticleImage } from '@shared/schemas/articles';
import { http } from './http';

/** Pictures in an article's text. */
export const articleImagesApi = {
  /** POST /api/articles/:id/images (multipart `file`) → 201; whoever may edit the article. */
  upload: (articleId: number, file: File, onProgress?: (sent: number) => void) => {
    const form = new FormData();
    form.append('file', file, file.name);
    return http.upload<{ image: ArticleImage }>(
      `/articles/${articleId}/images`,
      form,
      onProgress ? { onProgress } : {},
    );
  },
};
