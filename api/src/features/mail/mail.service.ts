import type { AppContext } from '../../context';
import type { SessionUser } from '../../../../shared/src/schemas/auth';
import type { MailKind, MailPreferences, MailPreferencesUpdate } from '../../../../shared/src/schemas/mail';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { authorize } from '../../lib/policies';
import * as repo from './mail.repository';
import { readUnsubscribeToken } from './mail.tokens';

const toPreferences = (r: repo.Recipient): MailPreferences => ({
  ticketReceived: r.ticketReceived,
  replies: r.replies,
  resolved: r.resolved,
});

export async function getPreferences(ctx: AppContext, user: SessionUser): Promise<MailPreferences> {
  authorize(user, 'mail.preferences');
  const me = await repo.findRecipient(ctx.db, user.id);
  if (!me) throw AppError.unauthenticated();
  return toPreferences(me);
}

export async function updatePreferences(
  ctx: AppContext,
  user: SessionUser,
  patch: MailPreferencesUpdate,
): Promise<MailPreferences> {
  authorize(user, 'mail.preferences');
  await ctx.db.transaction(async (tx) => {
    await repo.updatePreferences(tx, user.id, patch);
    await audit(tx, {
      actorId: user.id,
      action: 'mail.preferences',
      targetType: 'user',
      targetId: user.id,
      details: patch,
    });
  });
  return getPreferences(ctx, user);
}

/**
 * The link in an optional e-mail, without signing in: the signed token names the user and the
 * kind of e-mail to turn off. Turning off twice is fine (the same answer).
 */
export async function unsubscribe(ctx: AppContext, token: string): Promise<{ kind: MailKind }> {
  const named = readUnsubscribeToken(ctx.config, token);
  if (!named) {
    throw new AppError(
      'validation_failed',
      'This link to stop e-mails is not valid: it was changed or cut short. Open it again from the e-mail, or turn e-mails off on your profile.',
      400,
      { token: 'Not a valid link' },
    );
  }
  await ctx.db.transaction(async (tx) => {
    if (!(await repo.updatePreferences(tx, named.userId, { [named.kind]: false }))) {
      throw AppError.notFound('The account of this link');
    }
    await audit(tx, {
      actorId: null,
      action: 'mail.unsubscribe',
      targetType: 'user',
      targetId: named.userId,
      details: { kind: named.kind },
    });
  });
  return { kind: named.kind };
}
