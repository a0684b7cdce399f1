import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { searchQuerySchema, idParamsSchema, synonymInputSchema } from '../../../../shared/src/index';
import { authorize, signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { recordOutcome, search, searchesWithoutResults, suggest } from './search.service';
import { createSynonym, deleteSynonym, listSynonyms, updateSynonym } from './search.synonyms';

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

  // Synonym groups: refused before the body is read, for the roles that may not keep them.
  router.use('/synonyms', (req, _res, next) => {
    authorize(signedIn(req), 'search.synonyms');
    next();
  });

  /** GET /api/search/synonyms — specialist, admin: the synonym groups. */
  router.get('/synonyms', async (req, res) => {
    res.json({ synonyms: await listSynonyms(ctx, signedIn(req)) });
  });

  /** POST /api/search/synonyms — specialist, admin: a new group; searches use it at once. */
  router.post('/synonyms', validate('body', synonymInputSchema), async (req, res) => {
    res
      .status(201)
      .json({ synonym: await createSynonym(ctx, signedIn(req), parsed(res, 'body', synonymInputSchema)) });
  });

  /** PATCH /api/search/synonyms/:id — specialist, admin: replace a group's terms. */
  router.patch(
    '/synonyms/:id',
    validate('params', idParamsSchema),
    validate('body', synonymInputSchema),
    async (req, res) => {
      const id = parsed(res, 'params', idParamsSchema).id;
      res.json({
        synonym: await updateSynonym(ctx, signedIn(req), id, parsed(res, 'body', synonymInputSchema)),
      });
    },
  );

  /** DELETE /api/search/synonyms/:id — specialist, admin: remove a group. */
  router.delete('/synonyms/:id', validate('params', idParamsSchema), async (req, res) => {
    await deleteSynonym(ctx, signedIn(req), parsed(res, 'params', idParamsSchema).id);
    res.status(204).end();
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
