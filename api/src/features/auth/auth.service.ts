import type { Db } from '../../db/client';
import type { SessionUser } from '../../../../shared/src/schemas/auth';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { hashPassword, verifyPassword } from '../../lib/passwords';
import { assertPasswordRule } from '../../lib/password-rule';
import * as repo from './auth.repository';

/** A wrong password and an unknown e-mail get the same answer, in the same time. */
export async function checkCredentials(db: Db, email: string, password: string): Promise<SessionUser> {
  const creds = await repo.findCredentialsByEmail(db, email);
  const ok = await verifyPassword(creds?.passwordHash ?? null, password);
  const user = ok && creds?.active ? await repo.findActiveSessionUser(db, creds.id) : undefined;
  if (!user) {
    throw new AppError('invalid_credentials', 'That e-mail and password do not match an active account', 401);
  }
  return user;
}

export async function recordSignIn(db: Db, user: SessionUser): Promise<void> {
  await repo.recordSignIn(db, user.id);
  await audit(db, { actorId: user.id, action: 'auth.sign-in', targetType: 'user', targetId: user.id });
}

/** Changes the password and ends the user's other sessions; this one stays signed in. */
export async function changePassword(
  db: Db,
  user: SessionUser,
  input: { current: string; next: string },
  currentSid: string,
): Promise<void> {
  const stored = await repo.findPasswordHash(db, user.id);
  if (!stored || !(await verifyPassword(stored, input.current))) {
    throw AppError.validation({ current: 'This is not your current password' });
  }
  await assertPasswordRule(input.next, 'next', [user.email, user.name]);
  const nextHash = await hashPassword(input.next);
  await db.transaction(async (tx) => {
    await repo.updatePasswordHash(tx, user.id, nextHash);
    await repo.deleteSessionsOf(tx, user.id, currentSid);
    await audit(tx, {
      actorId: user.id,
      action: 'auth.password-changed',
      targetType: 'user',
      targetId: user.id,
    });
  });
}

export const loadSessionUser = repo.findActiveSessionUser;
