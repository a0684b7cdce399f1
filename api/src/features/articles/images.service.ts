import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import type { ArticleImage, SessionUser } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { safeName } from '../attachments/attachments.service';
import { processUpload, sniff } from '../attachments/images';
import { storageKey } from '../attachments/storage';
import * as repo from './images.repository';

type Ctx = Pick<AppContext, 'db' | 'storage'>;

export const articleImageUrl = (articleId: number, imageId: number) =>
  `/api/articles/${articleId}/images/${imageId}`;

/**
 * Puts a picture into an article: the bytes go through the same checks and re-encoding as ticket
 * photos (type from the bytes, metadata dropped, size and pixel limits, thumbnail). Photos only:
 * a PDF is refused. Nothing is left behind when anything fails. The caller decides who may do it.
 *
 * With `tx`, the row is written inside the caller's transaction; the files are stored before it,
 * and removed again if the insert fails.
 */
export async function addArticleImage(
  ctx: Ctx,
  input: { articleId: number; uploadedById: number; bytes: Buffer; fileName: string },
  tx?: Executor,
  /** With `tx`: collects the stored files' keys, so the caller can remove them if `tx` rolls back. */
  storedKeys?: string[],
): Promise<ArticleImage> {
  const mime = await sniff(input.bytes);
  if (!mime.startsWith('image/')) {
    throw new AppError('unsupported_media_type', 'Articles take photos only (JPEG, PNG, WebP, HEIC)', 415);
  }
  const processed = await processUpload(input.bytes, mime).catch((err: unknown) => {
    // The bytes said "image" but the decoder could not read them: a broken file, not a wrong type.
    if (err instanceof AppError && err.status === 415)
      throw AppError.validation(
        { file: 'This image is damaged or incomplete; save it again and retry' },
        'The image could not be read',
      );
    throw err;
  });

  const base = storageKey('articles', String(input.articleId), randomUUID());
  const key = `${base}.${processed.extension}`;
  const thumbnailKey = processed.thumbnail ? `${base}.thumb.jpg` : null;
  const stored: string[] = [];
  try {
    await ctx.storage.put(key, processed.body, processed.contentType);
    stored.push(key);
    if (thumbnailKey && processed.thumbnail) {
      await ctx.storage.put(thumbnailKey, processed.thumbnail, 'image/jpeg');
      stored.push(thumbnailKey);
    }
    const row = await repo.insertImage(tx ?? ctx.db, {
      articleId: input.articleId,
      uploadedById: input.uploadedById,
      storageKey: key,
      thumbnailKey,
      fileName: safeName(input.fileName, processed.extension),
      contentType: processed.contentType,
      bytes: processed.body.length,
      width: processed.width,
      height: processed.height,
      sha256: processed.sha256,
    });
    storedKeys?.push(...stored);
    return {
      id: row.id,
      url: articleImageUrl(input.articleId, row.id),
      width: row.width,
      height: row.height,
    };
  } catch (err) {
    await Promise.all(stored.map((k) => ctx.storage.remove(k).catch(() => {})));
    throw err;
  }
}

/** Whether this person may add pictures to the article: whoever may edit it (others: 404 or 403). */
export async function assertMayAddImage(ctx: Ctx, user: SessionUser, articleId: number): Promise<void> {
  const article = await repo.findEditable(ctx.db, user, articleId);
  if (!article) throw AppError.notFound('Article');
  authorize(user, 'article.edit', { authorId: article.authorId });
  if (article.status === 'retired') throw AppError.conflict('A retired article cannot be edited');
}

/** The route's story: check access first, then store the picture. */
export async function uploadArticleImage(
  ctx: Ctx,
  user: SessionUser,
  articleId: number,
  file: { buffer: Buffer; originalname: string } | undefined,
): Promise<ArticleImage> {
  await assertMayAddImage(ctx, user, articleId);
  if (!file) throw AppError.validation({ file: 'Choose a photo to add' }, 'No photo was sent');
  return addArticleImage(ctx, {
    articleId,
    uploadedById: user.id,
    bytes: file.buffer,
    fileName: file.originalname,
  });
}

/** The stored picture for a reader who may see its article; everyone else gets 404. */
export async function readArticleImage(
  ctx: Ctx,
  user: SessionUser,
  articleId: number,
  imageId: number,
  variant: 'full' | 'thumb',
) {
  const row = await repo.findVisibleImage(ctx.db, user, articleId, imageId);
  const key = variant === 'thumb' ? row?.thumbnailKey : row?.storageKey;
  if (!row || !key) throw AppError.notFound('Image');
  return {
    body: await ctx.storage.get(key),
    contentType: variant === 'thumb' ? 'image/jpeg' : row.contentType,
    fileName: row.fileName,
  };
}
