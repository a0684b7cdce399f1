import { Router } from 'express';
import type { AppContext } from '../../context';
import { idParamsSchema, snippetCreateSchema, snippetUpdateSchema } from '../../../../shared/src/index';
import { signedIn } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import * as snippets from './snippets.service';

export function snippetsRouter(ctx: AppContext): Router {
  const router = Router();
  const id = (res: { locals: Record<string, unknown> }) => parsed(res, 'params', idParamsSchema).id;

  /** GET /api/snippets — staff: my snippets and the desk's shared ones. */
  router.get('/', async (req, res) => {
    res.json({ items: await snippets.listSnippets(ctx, signedIn(req)) });
  });

  /** POST /api/snippets — staff: a personal snippet, or a shared one. */
  router.post('/', validate('body', snippetCreateSchema), async (req, res) => {
    const snippet = await snippets.createSnippet(
      ctx,
      signedIn(req),
      parsed(res, 'body', snippetCreateSchema),
    );
    res.status(201).json({ snippet });
  });

  /** PATCH /api/snippets/:id — its owner; shared ones: their author, specialists and admins. */
  router.patch(
    '/:id',
    validate('params', idParamsSchema),
    validate('body', snippetUpdateSchema),
    async (req, res) => {
      const snippet = await snippets.updateSnippet(
        ctx,
        signedIn(req),
        id(res),
        parsed(res, 'body', snippetUpdateSchema),
      );
      res.json({ snippet });
    },
  );

  /** DELETE /api/snippets/:id — as PATCH. */
  router.delete('/:id', validate('params', idParamsSchema), async (req, res) => {
    await snippets.deleteSnippet(ctx, signedIn(req), id(res));
    res.status(204).end();
  });

  return router;
}
