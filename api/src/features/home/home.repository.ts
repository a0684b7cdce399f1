import { asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { branches, contractorAccounts, users } from '../../db/schema/index';
import { branchColumns } from '../admin/branches.repository';

export async function findAccountHome(db: Executor, accountId: number) {
  const [row] = await db
    .select({
      id: contractorAccounts.id,
      company: contractorAccounts.company,
      accountNumber: contractorAccounts.accountNumber,
      homeBranch: branchColumns,
    })
    .from(contractorAccounts)
    .innerJoin(branches, eq(branches.id, contractorAccounts.homeBranchId))
    .where(eq(contractorAccounts.id, accountId));
  if (!row) return undefined;
  const teammates = await db
    .select({ id: users.id, name: users.name, isAccountOwner: users.isAccountOwner })
    .from(users)
    .where(eq(users.accountId, accountId))
    .orderBy(asc(users.name));
  return { ...row, teammates };
}

export async function findBranches(db: Executor, ids: number[] | 'all') {
  const query = db.select(branchColumns).from(branches);
  return (ids === 'all' ? query : query.where(inArray(branches.id, ids.length ? ids : [-1]))).orderBy(
    asc(branches.name),
  );
}
