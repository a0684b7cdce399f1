import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { searchQuerySchema, idParamsSchema } from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { recordOutcome, search, searchesWithoutResults, suggest } from './search.service';

const suggestQuerySchema = z.object({ q: z.string().max(100).default('') });
const outcomeSchema = z.object({
  articleId: z.number().int().positive(),
  deflected: z.boolean().default(false),
});
const missedQuerySchema = z.object({ days: z.coerce.number().int().min(1).max(365).default(30) });

export function searchRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/search — signed in: the knowledge base, typo tolerant, only what the reader may see. */
  router.get('/', validate('query', searchQuerySchema), async (req, res) => {
    res.json(await search(ctx, signedIn(req), parsed(res, 'query', searchQuerySchema)));
  });

  /** GET /api/search/suggest?q= — signed in: titles while typing. */
  router.get('/suggest', validate('query', suggestQuerySchema), async (req, res) => {
    res.json({ items: await suggest(ctx, signedIn(req), parsed(res, 'query', suggestQuerySchema).q) });
  });

  /** POST /api/search/:id/outcome — the searcher: which article they opened, and whether it solved it. */
  router.post(
    '/:id/outcome',
    validate('params', idParamsSchema),
    validate('body', outcomeSchema),
    async (req, res) => {
      await recordOutcome(
        ctx,
        signedIn(req),
        parsed(res, 'params', idParamsSchema).id,
        parsed(res, 'body', outcomeSchema),
      );
      res.status(204).end();
    },
  );

  /** GET /api/search/missed?days= — specialist, admin: what people searched for and did not find. */
  router.get('/missed', validate('query', missedQuerySchema), async (req, res) => {
    res.json({
      items: await searchesWithoutResults(ctx, signedIn(req), parsed(res, 'query', missedQuerySchema).days),
    });
  });

  return router;
}
