import type { AppContext } from '../../context';
import type { InvitationAccept, InvitationLookup, SessionUser } from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { hashLinkToken } from '../../lib/link-tokens';
import { hashPassword } from '../../lib/passwords';
import { assertPasswordRule } from '../../lib/password-rule';
import { isUniqueViolation } from '../../lib/pg-errors';
import { insertUser, setBranches } from '../admin/users.repository';
import { findActiveSessionUser } from '../auth/auth.repository';
import * as repo from './invitations.repository';
import type { InvitationRow } from './invitations.repository';

// The invitee's side: the link is looked up, then used once to create their sign-in.

export const emailTaken = (email: string) =>
  AppError.conflict(
    `Someone already signs in to Lightoff with ${email}. Sign in instead, or use "Forgot your password?".`,
    { email: 'Already has a Lightoff sign-in' },
  );

/** An inviter who lost the right to invite (signed off, no longer owner) takes their open invitations with them. */
function inviterStillMay(row: InvitationRow): boolean {
  if (!row.inviterActive) return false;
  if (row.accountId === null) return row.inviterRole === 'admin';
  return row.inviterIsOwner && row.inviterAccountId === row.accountId && row.accountActive === true;
}

/** The invitation a link names, if it can still be used; otherwise the reason why not. */
async function usableByToken(ctx: AppContext, token: string, now: Date): Promise<InvitationRow> {
  const row = await repo.findInvitationByTokenHash(ctx.db, hashLinkToken(token));
  if (!row) {
    throw new AppError(
      'link_unknown',
      'This invitation link is not valid. Check that the whole link was copied from the e-mail.',
      404,
    );
  }
  if (row.acceptedAt) {
    throw new AppError('link_used', 'This invitation has already been used. Sign in instead.', 410);
  }
  if (row.revokedAt || !inviterStillMay(row)) {
    throw new AppError(
      'link_revoked',
      'This invitation was withdrawn. Ask whoever invited you to send a new one if you still need it.',
      410,
    );
  }
  if (row.expiresAt.getTime() <= now.getTime()) {
    throw new AppError(
      'link_expired',
      'This invitation has expired: invitations are valid for 7 days. Ask whoever invited you for a new one.',
      410,
    );
  }
  return row;
}

/** What the join page shows before anything is typed. */
export async function lookUpInvitation(ctx: AppContext, token: string): Promise<InvitationLookup> {
  const row = await usableByToken(ctx, token, new Date());
  return {
    invitation: {
      email: row.email,
      role: row.role,
      accountCompany: row.accountCompany,
      branchNames: await repo.branchNames(ctx.db, row.branchIds),
      invitedByName: row.invitedByName,
      expiresAt: row.expiresAt.toISOString(),
    },
  };
}

/**
 * Creates the invitee's sign-in and uses up the invitation in one transaction. The invitation row
 * is locked first, so of two acceptances at once the second sees it used.
 */
export async function acceptInvitation(ctx: AppContext, input: InvitationAccept): Promise<SessionUser> {
  const now = new Date();
  const row = await usableByToken(ctx, input.token, now);
  await assertPasswordRule(input.password, 'password', [row.email, input.name, row.accountCompany]);
  const passwordHash = await hashPassword(input.password);
  const userId = await ctx.db
    .transaction(async (tx) => {
      const locked = await repo.lockInvitation(tx, row.id);
      if (locked?.acceptedAt) {
        throw new AppError('link_used', 'This invitation has already been used. Sign in instead.', 410);
      }
      if (!locked || locked.revokedAt) {
        throw new AppError('link_revoked', 'This invitation was withdrawn just now. Ask for a new one.', 410);
      }
      // Checked under the lock, so a second acceptance of the same link hears "used", not "taken".
      if (await repo.emailInUse(tx, row.email)) throw emailTaken(row.email);
      const newId = await insertUser(tx, {
        email: row.email,
        name: input.name,
        role: row.role,
        passwordHash,
        accountId: row.accountId,
        isAccountOwner: false,
      });
      await setBranches(tx, newId, row.branchIds);
      await repo.markAccepted(tx, row.id, newId, now);
      await audit(tx, {
        actorId: newId,
        action: 'invitation.accept',
        targetType: 'invitation',
        targetId: row.id,
        details: { invitedById: row.invitedById },
      });
      return newId;
    })
    .catch((err: unknown) => {
      if (isUniqueViolation(err)) throw emailTaken(row.email);
      throw err;
    });
  const user = await findActiveSessionUser(ctx.db, userId);
  if (!user) throw new AppError('internal', 'The new sign-in could not be read back', 500);
  return user;
}
