import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { AppContext } from '../../context';
import {
  articleCreateSchema,
  articleListQuerySchema,
  articleUpdateSchema,
  feedbackSchema,
  idParamsSchema,
  idSchema,
  sendBackSchema,
  slugSchema,
} from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import * as articles from './articles.service';
import { assertMayAddImage, readArticleImage, uploadArticleImage } from './images.service';
import { AppError } from '../../lib/errors';
import { MAX_FILE_BYTES } from '../attachments/images';

const imageParams = idParamsSchema.extend({ imageId: idSchema });

// One photo, held in memory (at most 15 MB) so nothing touches disk before it is checked.
const imageUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_FILE_BYTES, files: 1, fields: 2, parts: 3 },
}).single('file');
const oneImage: RequestHandler = (req, res, next) =>
  imageUpload(req, res, (err: unknown) => {
    const e = err as { name?: string; code?: string } | undefined;
    if (e?.name === 'MulterError' && e.code !== 'LIMIT_FILE_SIZE') {
      next(
        AppError.validation({ file: 'Send one photo, in the `file` field' }, 'The upload could not be read'),
      );
      return;
    }
    next(err);
  });

const slugParams = z.object({ slug: z.string().max(120) });

export function articlesRouter(ctx: AppContext): Router {
  const router = Router();
  const id = (res: { locals: Record<string, unknown> }) => parsed(res, 'params', idParamsSchema).id;
  const byId = validate('params', idParamsSchema);

  /** GET /api/articles — signed in: what the reader may see (contractors: published contractor articles). */
  router.get('/', validate('query', articleListQuerySchema), async (req, res) => {
    res.json(await articles.listArticles(ctx, signedIn(req), parsed(res, 'query', articleListQuerySchema)));
  });

  /** GET /api/articles/:slug — signed in: one article with its sanitized rendering; others 404. */
  router.get('/:slug', validate('params', slugParams), async (req, res) => {
    const { slug } = parsed(res, 'params', slugParams);
    if (!slugSchema.safeParse(slug).success) {
      res.status(404).json({ error: { code: 'not_found', message: 'Article was not found' } });
      return;
    }
    res.json({ article: await articles.getArticleBySlug(ctx, signedIn(req), slug) });
  });

  /** POST /api/articles — tech, specialist, admin: a new draft. */
  router.post('/', validate('body', articleCreateSchema), async (req, res) => {
    res.status(201).json({
      article: await articles.createArticle(ctx, signedIn(req), parsed(res, 'body', articleCreateSchema)),
    });
  });

  /** PATCH /api/articles/:id — its author, specialists, admins: save (a new revision). */
  router.patch('/:id', byId, validate('body', articleUpdateSchema), async (req, res) => {
    res.json({
      article: await articles.updateArticle(
        ctx,
        signedIn(req),
        id(res),
        parsed(res, 'body', articleUpdateSchema),
      ),
    });
  });

  /** POST /api/articles/:id/submit|publish|retire — the review workflow. */
  for (const move of ['submit', 'publish', 'retire'] as const) {
    router.post(`/:id/${move}`, byId, async (req, res) => {
      res.json({ article: await articles.moveArticle(ctx, signedIn(req), id(res), move) });
    });
  }

  /** POST /api/articles/:id/send-back {note} — a reviewer: back to draft with what needs to change. */
  router.post('/:id/send-back', byId, validate('body', sendBackSchema), async (req, res) => {
    res.json({
      article: await articles.moveArticle(
        ctx,
        signedIn(req),
        id(res),
        'send-back',
        parsed(res, 'body', sendBackSchema).note,
      ),
    });
  });

  /** GET /api/articles/:id/revisions — staff who may see it: every saved version. */
  router.get('/:id/revisions', byId, async (req, res) => {
    res.json({ items: await articles.listRevisions(ctx, signedIn(req), id(res)) });
  });

  /** POST /api/articles/:id/feedback {helped, comment?} — readers of a published article, once each (a second vote replaces the first). */
  router.post('/:id/feedback', byId, validate('body', feedbackSchema), async (req, res) => {
    const { helped, comment } = parsed(res, 'body', feedbackSchema);
    res.json({ article: await articles.giveFeedback(ctx, signedIn(req), id(res), helped, comment) });
  });

  /** POST /api/articles/:id/images (multipart `file`) — whoever may edit the article: one photo for its text. */
  router.post(
    '/:id/images',
    byId,
    async (req, res, next) => {
      // Check access before reading a byte of the upload.
      await assertMayAddImage(ctx, signedIn(req), id(res));
      next();
    },
    oneImage,
    async (req, res) => {
      res.status(201).json({ image: await uploadArticleImage(ctx, signedIn(req), id(res), req.file) });
    },
  );

  /** GET /api/articles/:id/images/:imageId[/thumb] — whoever may read the article: the picture itself. */
  for (const variant of ['full', 'thumb'] as const) {
    const path = variant === 'full' ? '/:id/images/:imageId' : '/:id/images/:imageId/thumb';
    router.get(path, validate('params', imageParams), async (req, res) => {
      const { id: articleId, imageId } = parsed(res, 'params', imageParams);
      const file = await readArticleImage(ctx, signedIn(req), articleId, imageId, variant);
      res
        .set({
          'Content-Type': file.contentType,
          'Content-Disposition': `inline; filename="${file.fileName.replace(/[^\x20-\x7e]|"/g, '_')}"`,
          'X-Content-Type-Options': 'nosniff',
          // An image's bytes never change under its id, so a reader's browser may keep it.
          'Cache-Control': 'private, max-age=31536000, immutable',
          'Content-Security-Policy': "default-src 'none'; sandbox",
        })
        .send(file.body);
    });
  }

  return router;
}
