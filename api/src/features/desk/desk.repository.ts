import { and, asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { branches, staffBranches, users } from '../../db/schema/index';
import type { DeskBranch, DeskMember } from '../../../../shared/src/index';

export function listActiveBranches(db: Executor): Promise<DeskBranch[]> {
  return db
    .select({ id: branches.id, code: branches.code, name: branches.name })
    .from(branches)
    .where(eq(branches.active, true))
    .orderBy(asc(branches.name));
}

/** Active staff with their branches; a contractor never appears here. */
export function listDeskMembers(db: Executor): Promise<DeskMember[]> {
  return db
    .select({
      id: users.id,
      name: users.name,
      role: users.role,
      branchIds: sql<
        number[]
      >`coalesce((select array_agg(${staffBranches.branchId} order by ${staffBranches.branchId})
        from ${staffBranches} where ${staffBranches.userId} = ${users.id}), '{}')`,
    })
    .from(users)
    .where(and(eq(users.active, true), sql`${users.role} <> 'contractor'`))
    .orderBy(asc(users.name));
}
