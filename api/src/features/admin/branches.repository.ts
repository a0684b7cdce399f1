import { asc, count, eq, ilike, or } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { branches } from '../../db/schema/index';
import type { BranchCreate, BranchUpdate, ListQuery } from '../../../../shared/src/index';
import { likePattern, offsetOf } from '../../lib/pagination';

/** A branch as the API shows it, wherever branches are read. */
export const branchColumns = {
  id: branches.id,
  code: branches.code,
  name: branches.name,
  deskEmail: branches.deskEmail,
  active: branches.active,
};

export async function listBranches(db: Executor, q: ListQuery) {
  const where = q.q
    ? or(ilike(branches.name, likePattern(q.q)), ilike(branches.code, likePattern(q.q)))
    : undefined;
  const [items, [total]] = await Promise.all([
    db
      .select(branchColumns)
      .from(branches)
      .where(where)
      .orderBy(asc(branches.name))
      .limit(q.pageSize)
      .offset(offsetOf(q)),
    db.select({ n: count() }).from(branches).where(where),
  ]);
  return { items, total: total?.n ?? 0 };
}

export async function findBranch(db: Executor, id: number) {
  const [row] = await db.select(branchColumns).from(branches).where(eq(branches.id, id));
  return row;
}

export async function insertBranch(db: Executor, input: BranchCreate) {
  const [row] = await db
    .insert(branches)
    .values({ code: input.code, name: input.name, deskEmail: input.deskEmail ?? null })
    .returning(branchColumns);
  return row!;
}

export async function updateBranch(db: Executor, id: number, input: BranchUpdate) {
  const [row] = await db.update(branches).set(input).where(eq(branches.id, id)).returning(branchColumns);
  return row;
}
