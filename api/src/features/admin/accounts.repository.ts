import { asc, count, eq, ilike, or, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { branches, contractorAccounts, users } from '../../db/schema/index';
import type { AccountCreate, AccountUpdate, ListQuery } from '../../../../shared/src/index';
import { likePattern, offsetOf } from '../../lib/pagination';

const columns = {
  id: contractorAccounts.id,
  company: contractorAccounts.company,
  accountNumber: contractorAccounts.accountNumber,
  homeBranchId: contractorAccounts.homeBranchId,
  homeBranchName: branches.name,
  active: contractorAccounts.active,
  userCount: sql<number>`(select count(*)::int from ${users} where ${users.accountId} = ${contractorAccounts.id})`,
};

const base = (db: Executor) =>
  db
    .select(columns)
    .from(contractorAccounts)
    .innerJoin(branches, eq(branches.id, contractorAccounts.homeBranchId));

export async function listAccounts(db: Executor, q: ListQuery) {
  const where = q.q
    ? or(
        ilike(contractorAccounts.company, likePattern(q.q)),
        ilike(contractorAccounts.accountNumber, likePattern(q.q)),
      )
    : undefined;
  const [items, [total]] = await Promise.all([
    base(db).where(where).orderBy(asc(contractorAccounts.company)).limit(q.pageSize).offset(offsetOf(q)),
    db.select({ n: count() }).from(contractorAccounts).where(where),
  ]);
  return { items, total: total?.n ?? 0 };
}

export async function findAccount(db: Executor, id: number) {
  const [row] = await base(db).where(eq(contractorAccounts.id, id));
  return row;
}

export async function insertAccount(db: Executor, input: AccountCreate) {
  const [row] = await db.insert(contractorAccounts).values(input).returning({ id: contractorAccounts.id });
  return row!.id;
}

export async function updateAccount(db: Executor, id: number, input: AccountUpdate) {
  const [row] = await db
    .update(contractorAccounts)
    .set(input)
    .where(eq(contractorAccounts.id, id))
    .returning({ id: contractorAccounts.id });
  return row?.id;
}
