import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { passwordResets, users } from '../../db/schema/index';

/** The active sign-in an e-mail belongs to, if any. */
export async function findActiveUserByEmail(db: Executor, email: string) {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(sql`lower(${users.email}) = lower(${email})`, eq(users.active, true)));
  return row;
}

export async function insertReset(
  db: Executor,
  row: { userId: number; tokenHash: string; expiresAt: Date; createdAt: Date },
): Promise<void> {
  await db.insert(passwordResets).values(row);
}

/** A reset link by its token's hash, with the person it resets. */
export async function findResetByTokenHash(db: Executor, tokenHash: string) {
  const [row] = await db
    .select({
      id: passwordResets.id,
      userId: passwordResets.userId,
      expiresAt: passwordResets.expiresAt,
      usedAt: passwordResets.usedAt,
      email: users.email,
      name: users.name,
      userActive: users.active,
    })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash));
  return row;
}

/** Locks the reset row until the transaction ends, so the link cannot be used twice at once. */
export async function lockReset(tx: Executor, id: number) {
  const [row] = await tx
    .select({ usedAt: passwordResets.usedAt })
    .from(passwordResets)
    .where(eq(passwordResets.id, id))
    .for('update');
  return row;
}

/** Uses up every outstanding reset link of the user (the one just used among them). */
export async function useUpResetsOf(tx: Executor, userId: number, now: Date): Promise<void> {
  await tx
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}
