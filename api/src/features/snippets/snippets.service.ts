import type { AppContext } from '../../context';
import type { SessionUser, Snippet } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import * as repo from './snippets.repository';

const toSnippet = ({ createdById: _c, updatedAt, ...r }: repo.SnippetRow): Snippet => ({
  ...r,
  shared: r.ownerId === null,
  updatedAt: updatedAt.toISOString(),
});

/** Loads a snippet the user may see and checks they may change it; others' personal ones are 404. */
async function loadEditable(ctx: AppContext, user: SessionUser, id: number) {
  const row = await repo.findVisible(ctx.db, user.id, id);
  if (!row) throw AppError.notFound('Snippet');
  authorize(user, 'snippet.edit', row);
  return row;
}

export async function listSnippets(ctx: AppContext, user: SessionUser) {
  authorize(user, 'snippet.use');
  return (await repo.listVisible(ctx.db, user.id)).map(toSnippet);
}

export async function createSnippet(
  ctx: AppContext,
  user: SessionUser,
  input: { title: string; body: string; shared: boolean },
) {
  authorize(user, 'snippet.use');
  const row = await repo.insertSnippet(ctx.db, {
    title: input.title,
    body: input.body,
    ownerId: input.shared ? null : user.id,
    createdById: user.id,
  });
  return toSnippet(row);
}

export async function updateSnippet(
  ctx: AppContext,
  user: SessionUser,
  id: number,
  input: { title?: string; body?: string; shared?: boolean },
) {
  authorize(user, 'snippet.use');
  const row = await loadEditable(ctx, user, id);
  const { shared, ...rest } = input;
  const patch = { ...rest, ...(shared !== undefined ? { ownerId: shared ? null : user.id } : {}) };
  return toSnippet(await repo.updateSnippet(ctx.db, row.id, patch));
}

export async function deleteSnippet(ctx: AppContext, user: SessionUser, id: number) {
  authorize(user, 'snippet.use');
  await repo.deleteSnippet(ctx.db, (await loadEditable(ctx, user, id)).id);
}
