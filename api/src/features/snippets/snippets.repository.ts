import { and, asc, eq, isNull, or } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { replySnippets } from '../../db/schema/index';

const columns = {
  id: replySnippets.id,
  title: replySnippets.title,
  body: replySnippets.body,
  ownerId: replySnippets.ownerId,
  createdById: replySnippets.createdById,
  updatedAt: replySnippets.updatedAt,
};
export type SnippetRow = {
  id: number;
  title: string;
  body: string;
  ownerId: number | null;
  createdById: number | null;
  updatedAt: Date;
};

/** A person's own snippets and the desk's shared ones (owner null). */
const mineOrShared = (userId: number) => or(isNull(replySnippets.ownerId), eq(replySnippets.ownerId, userId));

export function listVisible(db: Executor, userId: number): Promise<SnippetRow[]> {
  return db.select(columns).from(replySnippets).where(mineOrShared(userId)).orderBy(asc(replySnippets.title));
}

export async function findVisible(db: Executor, userId: number, id: number): Promise<SnippetRow | undefined> {
  const [row] = await db
    .select(columns)
    .from(replySnippets)
    .where(and(eq(replySnippets.id, id), mineOrShared(userId)));
  return row;
}

export async function insertSnippet(
  db: Executor,
  values: { title: string; body: string; ownerId: number | null; createdById: number },
) {
  const [row] = await db.insert(replySnippets).values(values).returning(columns);
  return row!;
}

export async function updateSnippet(
  db: Executor,
  id: number,
  patch: { title?: string; body?: string; ownerId?: number | null },
) {
  const [row] = await db
    .update(replySnippets)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(replySnippets.id, id))
    .returning(columns);
  return row!;
}

export async function deleteSnippet(db: Executor, id: number) {
  await db.delete(replySnippets).where(eq(replySnippets.id, id));
}
