import type { AppContext } from '../../context';
import type { PasswordResetCheck, PasswordResetConfirm } from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { hashLinkToken, newLinkToken } from '../../lib/link-tokens';
import { hashPassword } from '../../lib/passwords';
import { assertPasswordRule } from '../../lib/password-rule';
import { PgRateLimitStore } from '../../lib/rate-limit-store';
import { queueMail } from '../mail/index';
import { deleteSessionsOf, updatePasswordHash } from './auth.repository';
import { passwordResetMail } from './password-reset.mail';
import * as repo from './password-reset.repository';

export const RESET_VALID_MS = 30 * 60 * 1000;
export const RESET_QUEUE = 'auth.password-reset';

/** Whatever the e-mail, the request only stores a job, so known and unknown addresses take the same time. */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  await ctx.jobs.send(RESET_QUEUE, { email }, { retryLimit: 3 });
}

/** The job behind a request: a link for an active sign-in, nothing at all for any other e-mail. */
export async function issuePasswordReset(ctx: AppContext, email: string): Promise<void> {
  const user = await repo.findActiveUserByEmail(ctx.db, email);
  if (!user) return;
  const now = new Date();
  const { token, hash } = newLinkToken();
  await ctx.db.transaction(async (tx) => {
    await repo.insertReset(tx, {
      userId: user.id,
      tokenHash: hash,
      expiresAt: new Date(now.getTime() + RESET_VALID_MS),
      createdAt: now,
    });
    await queueMail(ctx, passwordResetMail(ctx.config, { to: user.email, name: user.name, token }), tx);
  });
}

export async function registerPasswordResetWorker(ctx: AppContext): Promise<void> {
  await ctx.jobs.work<{ email: string }>(RESET_QUEUE, (data) => issuePasswordReset(ctx, data.email));
}

const used = () =>
  new AppError(
    'link_used',
    'This reset link has already been used. Each link works once: ask for a new one if you need it.',
    410,
  );

/** The reset a link names if it can still be used (times compared in application time). */
async function usableReset(ctx: AppContext, token: string, now: Date) {
  const row = await repo.findResetByTokenHash(ctx.db, hashLinkToken(token));
  if (!row || !row.userActive) {
    throw new AppError(
      'link_unknown',
      'This reset link is not valid. Check that the whole link was copied from the e-mail, or ask for a new one.',
      404,
    );
  }
  if (row.usedAt) throw used();
  if (row.expiresAt.getTime() <= now.getTime()) {
    throw new AppError(
      'link_expired',
      'This reset link has expired: links are valid for 30 minutes. Ask for a new one.',
      410,
    );
  }
  return row;
}

/** The reset page's first look: the link is usable, and for which sign-in. */
export async function checkPasswordReset(ctx: AppContext, token: string): Promise<PasswordResetCheck> {
  const row = await usableReset(ctx, token, new Date());
  return { email: row.email, expiresAt: row.expiresAt.toISOString() };
}

/**
 * Sets the new password, uses up every outstanding reset link of the user and ends all their
 * sessions (sockets included): whoever knew the old password is out.
 */
export async function confirmPasswordReset(ctx: AppContext, input: PasswordResetConfirm): Promise<void> {
  const now = new Date();
  const row = await usableReset(ctx, input.token, now);
  await assertPasswordRule(input.password, 'password', [row.email, row.name]);
  const passwordHash = await hashPassword(input.password);
  await ctx.db.transaction(async (tx) => {
    const locked = await repo.lockReset(tx, row.id);
    if (!locked || locked.usedAt) throw used();
    await updatePasswordHash(tx, row.userId, passwordHash);
    await repo.useUpResetsOf(tx, row.userId, now);
    await deleteSessionsOf(tx, row.userId);
    await audit(tx, {
      actorId: row.userId,
      action: 'auth.password-reset',
      targetType: 'user',
      targetId: row.userId,
    });
  });
  ctx.realtime.endUserSessions(row.userId, 'password-changed');
  // Failed sign-ins before the reset must not keep the person out with their new password.
  await new PgRateLimitStore(ctx.db, 'login-email:').resetKey(row.email.trim().toLowerCase());
}
