import { Router } from 'express';
import { and, asc, eq, isNull, or } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { replySnippets } from '../../db/schema/index';
import { idParamsSchema, snippetCreateSchema, snippetUpdateSchema } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';

const columns = {
  id: replySnippets.id,
  title: replySnippets.title,
  body: replySnippets.body,
  ownerId: replySnippets.ownerId,
  createdById: replySnippets.createdById,
  updatedAt: replySnippets.updatedAt,
};
type Row = {
  id: number;
  title: string;
  body: string;
  ownerId: number | null;
  createdById: number | null;
  updatedAt: Date;
};
const toSnippet = ({ createdById: _c, updatedAt, ...r }: Row) => ({
  ...r,
  shared: r.ownerId === null,
  updatedAt: updatedAt.toISOString(),
});

export function snippetsRouter(ctx: AppContext): Router {
  const router = Router();
  const mineOrShared = (userId: number) =>
    or(isNull(replySnippets.ownerId), eq(replySnippets.ownerId, userId));

  async function load(userId: number, id: number) {
    const [row] = await ctx.db
      .select(columns)
      .from(replySnippets)
      .where(and(eq(replySnippets.id, id), mineOrShared(userId)));
    if (!row) throw AppError.notFound('Snippet');
    return row;
  }

  /** GET /api/snippets — staff: my snippets and the desk's shared ones. */
  router.get('/', async (req, res) => {
    authorize(req.user, 'snippet.use');
    const rows = await ctx.db
      .select(columns)
      .from(replySnippets)
      .where(mineOrShared(req.user.id))
      .orderBy(asc(replySnippets.title));
    res.json({ items: rows.map(toSnippet) });
  });

  /** POST /api/snippets — staff: a personal snippet, or a shared one. */
  router.post('/', validate('body', snippetCreateSchema), async (req, res) => {
    authorize(req.user, 'snippet.use');
    const input = parsed(res, 'body', snippetCreateSchema);
    const [row] = await ctx.db
      .insert(replySnippets)
      .values({
        title: input.title,
        body: input.body,
        ownerId: input.shared ? null : req.user.id,
        createdById: req.user.id,
      })
      .returning(columns);
    res.status(201).json({ snippet: toSnippet(row!) });
  });

  /** PATCH /api/snippets/:id — its owner; shared ones: their author, specialists and admins. */
  router.patch(
    '/:id',
    validate('params', idParamsSchema),
    validate('body', snippetUpdateSchema),
    async (req, res) => {
      authorize(req.user, 'snippet.use');
      const row = await load(req.user.id, parsed(res, 'params', idParamsSchema).id);
      authorize(req.user, 'snippet.edit', row);
      const { shared, ...rest } = parsed(res, 'body', snippetUpdateSchema);
      const [updated] = await ctx.db
        .update(replySnippets)
        .set({
          ...rest,
          ...(shared !== undefined ? { ownerId: shared ? null : req.user.id } : {}),
          updatedAt: new Date(),
        })
        .where(eq(replySnippets.id, row.id))
        .returning(columns);
      res.json({ snippet: toSnippet(updated!) });
    },
  );

  /** DELETE /api/snippets/:id — as PATCH. */
  router.delete('/:id', validate('params', idParamsSchema), async (req, res) => {
    authorize(req.user, 'snippet.use');
    const row = await load(req.user.id, parsed(res, 'params', idParamsSchema).id);
    authorize(req.user, 'snippet.edit', row);
    await ctx.db.delete(replySnippets).where(eq(replySnippets.id, row.id));
    res.status(204).end();
  });

  return router;
}
