import type { AppContext } from '../../context';
import type { SessionUser, Snippet } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { authorize, can } from '../../lib/policies';
import * as repo from './snippets.repository';

const toSnippet = (user: SessionUser, row: repo.SnippetRow): Snippet => {
  const { createdById: _c, updatedAt, ...r } = row;
  return {
    ...r,
    shared: r.ownerId === null,
    canEdit: can(user, 'snippet.edit', row),
    updatedAt: updatedAt.toISOString(),
  };
};

/** Loads a snippet the user may see and checks they may change it; others' personal ones are 404. */
async function loadEditable(ctx: AppContext, user: SessionUser, id: number) {
  const row = await repo.findVisible(ctx.db, user.id, id);
  if (!row) throw AppError.notFound('Snippet');
  authorize(user, 'snippet.edit', row);
  return row;
}

export async function listSnippets(ctx: AppContext, user: SessionUser) {
  authorize(user, 'snippet.use');
  return (await repo.listVisible(ctx.db, user.id)).map((row) => toSnippet(user, row));
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
  return toSnippet(user, row);
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
  return toSnippet(user, await repo.updateSnippet(ctx.db, row.id, patch));
}

export async function deleteSnippet(ctx: AppContext, user: SessionUser, id: number) {
  authorize(user, 'snippet.use');
  await repo.deleteSnippet(ctx.db, (await loadEditable(ctx, user, id)).id);
}
