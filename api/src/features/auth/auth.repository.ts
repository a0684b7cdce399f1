import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { staffBranches, users } from '../../db/schema/index';
import type { SessionUser } from '../../../../shared/src/schemas/auth';

export interface UserCredentials {
  id: number;
  passwordHash: string;
  active: boolean;
}

export async function findCredentialsByEmail(
  db: Executor,
  email: string,
): Promise<UserCredentials | undefined> {
  const [row] = await db
    .select({ id: users.id, passwordHash: users.passwordHash, active: users.active })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`);
  return row;
}

export async function findPasswordHash(db: Executor, userId: number): Promise<string | undefined> {
  const [row] = await db.select({ h: users.passwordHash }).from(users).where(eq(users.id, userId));
  return row?.h;
}

/** The signed-in person as the rest of the product sees them; undefined when gone or inactive. */
export async function findActiveSessionUser(db: Executor, id: number): Promise<SessionUser | undefined> {
  const [row] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      accountId: users.accountId,
      isAccountOwner: users.isAccountOwner,
      branchIds: sql<number[]>`coalesce(
        (select array_agg(${staffBranches.branchId} order by ${staffBranches.branchId})
           from ${staffBranches} where ${staffBranches.userId} = ${users.id}), '{}')`,
    })
    .from(users)
    .where(and(eq(users.id, id), eq(users.active, true)));
  return row;
}

export async function recordSignIn(db: Executor, userId: number): Promise<void> {
  await db.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, userId));
}

export async function updatePasswordHash(db: Executor, userId: number, passwordHash: string): Promise<void> {
  await db.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, userId));
}

/** Ends every stored session of a user, except optionally the one making the request. */
export async function deleteSessionsOf(db: Executor, userId: number, exceptSid?: string): Promise<void> {
  await db.execute(sql`
    delete from "session"
    where (sess #>> '{passport,user}') = ${String(userId)}
    ${exceptSid ? sql`and sid <> ${exceptSid}` : sql``}`);
}
