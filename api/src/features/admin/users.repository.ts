import { and, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import { contractorAccounts, staffBranches, users } from '../../db/schema/index';
import type { Role, UserListQuery } from '../../../../shared/src/index';
import { likePattern, offsetOf } from '../../lib/pagination';

const columns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  active: users.active,
  accountId: users.accountId,
  accountCompany: contractorAccounts.company,
  isAccountOwner: users.isAccountOwner,
  branchIds: sql<
    number[]
  >`coalesce((select array_agg(${staffBranches.branchId} order by ${staffBranches.branchId})
    from ${staffBranches} where ${staffBranches.userId} = ${users.id}), '{}')`,
  lastSignInAt: isoTime(users.lastSignInAt) as SQL<string | null>,
  createdAt: isoTime(users.createdAt),
};

const base = (db: Executor) =>
  db.select(columns).from(users).leftJoin(contractorAccounts, eq(contractorAccounts.id, users.accountId));

export async function listUsers(db: Executor, q: UserListQuery) {
  const conditions: SQL[] = [];
  if (q.q) {
    const p = likePattern(q.q);
    conditions.push(or(ilike(users.name, p), ilike(users.email, p), ilike(contractorAccounts.company, p))!);
  }
  if (q.role) conditions.push(eq(users.role, q.role));
  if (q.accountId) conditions.push(eq(users.accountId, q.accountId));
  const where = conditions.length ? and(...conditions) : undefined;
  const [items, [total]] = await Promise.all([
    base(db)
      .where(where)
      .orderBy(desc(users.createdAt), desc(users.id))
      .limit(q.pageSize)
      .offset(offsetOf(q)),
    db
      .select({ n: count() })
      .from(users)
      .leftJoin(contractorAccounts, eq(contractorAccounts.id, users.accountId))
      .where(where),
  ]);
  return { items, total: total?.n ?? 0 };
}

export async function findUser(db: Executor, id: number) {
  const [row] = await base(db).where(eq(users.id, id));
  return row;
}

export interface UserRow {
  email: string;
  name: string;
  role: Role;
  passwordHash: string;
  accountId: number | null;
  isAccountOwner: boolean;
}

export async function insertUser(db: Executor, row: UserRow): Promise<number> {
  const [inserted] = await db.insert(users).values(row).returning({ id: users.id });
  return inserted!.id;
}

export async function updateUserRow(
  db: Executor,
  id: number,
  patch: Partial<Omit<UserRow, 'passwordHash'>> & { active?: boolean },
) {
  if (Object.keys(patch).length === 0) return;
  await db
    .update(users)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(users.id, id));
}

export async function setBranches(db: Executor, userId: number, branchIds: number[]) {
  await db.delete(staffBranches).where(eq(staffBranches.userId, userId));
  if (branchIds.length > 0) {
    await db.insert(staffBranches).values([...new Set(branchIds)].map((branchId) => ({ userId, branchId })));
  }
}
