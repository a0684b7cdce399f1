import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import type { AppContext } from '../../context';
import { idParamsSchema } from '../../../../shared/src/index';
import { parsed, validate } from '../../lib/validate';
import { readAttachment, uploadAttachments } from './attachments.service';
import { MAX_FILE_BYTES, MAX_FILES } from './images';
import { loadScope } from '../tickets/tickets.service';

// Held in memory (at most 10 × 15 MB) so nothing touches disk before it is checked.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_FILE_BYTES, files: MAX_FILES, fields: 5, parts: MAX_FILES + 5 },
});

export function ticketAttachmentsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  /** POST /api/tickets/:id/attachments — whoever may see the ticket: up to 10 photos or PDFs. */
  router.post(
    '/',
    validate('params', idParamsSchema),
    async (req, res, next) => {
      // Check access before reading a byte of the upload.
      await loadScope(ctx.db, req.user, parsed(res, 'params', idParamsSchema).id);
      next();
    },
    upload.array('files', MAX_FILES),
    async (req, res) => {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      const attachments = await uploadAttachments(
        ctx,
        req.user!,
        parsed(res, 'params', idParamsSchema).id,
        files,
      );
      res.status(201).json({ attachments });
    },
  );
  return router;
}

export function attachmentsRouter(ctx: AppContext): Router {
  const router = Router();
  const send = (variant: 'full' | 'thumb') => async (req: Request, res: Response) => {
    const file = await readAttachment(ctx, req.user, parsed(res, 'params', idParamsSchema).id, variant);
    const disposition = file.contentType === 'application/pdf' ? 'attachment' : 'inline';
    res
      .set({
        'Content-Type': file.contentType,
        'Content-Disposition': `${disposition}; filename="${file.fileName.replace(/[^\x20-\x7e]|"/g, '_')}"; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
        'X-Content-Type-Options': 'nosniff',
        'Cache-Control': 'private, max-age=3600',
        'Content-Security-Policy': "default-src 'none'; sandbox",
      })
      .send(file.body);
  };
  /** GET /api/attachments/:id — whoever may see its ticket (and its message). */
  router.get('/:id', validate('params', idParamsSchema), send('full'));
  /** GET /api/attachments/:id/thumb — the same, 320 px. */
  router.get('/:id/thumb', validate('params', idParamsSchema), send('thumb'));
  return router;
}
