import type { AppContext } from '../../context';
import type {
  Invitation,
  InvitationCreate,
  InvitationListQuery,
  InvitationStatus,
  Page,
  SessionUser,
} from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { newLinkToken } from '../../lib/link-tokens';
import { authorize } from '../../lib/policies';
import { queueMail } from '../mail/index';
import { emailTaken } from './invitations.accept';
import { invitationMail } from './invitations.mail';
import * as repo from './invitations.repository';
import type { InvitationRow } from './invitations.repository';

export const INVITATION_VALID_MS = 7 * 24 * 60 * 60 * 1000;

/** Where an invitation stands at `now` (application time, so tests can move the clock). */
export function statusOf(row: InvitationRow, now: Date): InvitationStatus {
  if (row.acceptedAt) return 'joined';
  if (row.revokedAt) return 'revoked';
  return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'waiting';
}

function toApi(row: InvitationRow, now: Date): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    accountId: row.accountId,
    accountCompany: row.accountCompany,
    branchIds: row.branchIds,
    invitedBy: { id: row.invitedById, name: row.invitedByName },
    status: statusOf(row, now),
    expiresAt: row.expiresAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
  };
}

/** Where the invitation leads: staff with branches (admins only) or a teammate in the owner's account. */
async function placeFor(ctx: AppContext, actor: SessionUser, input: InvitationCreate) {
  if (input.role !== undefined || input.branchIds !== undefined) {
    authorize(actor, 'invitation.staff');
    const fields: Record<string, string> = {};
    if (!input.role) fields.role = 'Choose the role they will have';
    const branchIds = [...new Set(input.branchIds ?? [])];
    if (branchIds.length === 0) fields.branchIds = 'Choose at least one branch';
    else if ((await repo.activeBranchIds(ctx.db, branchIds)).length !== branchIds.length)
      fields.branchIds = 'Choose open branches only';
    if (input.accountId !== undefined) fields.accountId = 'Staff are not part of a contractor account';
    if (Object.keys(fields).length > 0) throw AppError.validation(fields);
    const branchNames = await repo.branchNames(ctx.db, branchIds);
    return { role: input.role!, accountId: null, branchIds, company: null, branchNames };
  }
  if (actor.role === 'admin') {
    throw AppError.validation({
      role: 'Choose the role they will have: contractors are invited by their account owner',
    });
  }
  if (actor.role !== 'contractor') authorize(actor, 'invitation.staff');
  const accountId = input.accountId ?? actor.accountId;
  // Another account answers 404 (its existence never leaks); a teammate who is not the owner, 403.
  authorize(actor, 'account.view', { accountId }, 'not-found');
  authorize(actor, 'invitation.teammate', { accountId });
  const account = await repo.findAccountForInvite(ctx.db, accountId!);
  if (!account) throw AppError.notFound('Account');
  if (!account.active) throw AppError.conflict('This account is closed: ask your branch to reopen it first');
  return {
    role: 'contractor' as const,
    accountId: account.id,
    branchIds: [],
    company: account.company,
    branchNames: [],
  };
}

/** Invites someone by e-mail; a new invitation to the same e-mail and place replaces the open one. */
export async function createInvitation(
  ctx: AppContext,
  actor: SessionUser,
  input: InvitationCreate,
): Promise<Invitation> {
  const place = await placeFor(ctx, actor, input);
  if (await repo.emailInUse(ctx.db, input.email)) throw emailTaken(input.email);
  const now = new Date();
  const expiresAt = new Date(now.getTime() + INVITATION_VALID_MS);
  const { token, hash } = newLinkToken();
  const id = await ctx.db.transaction(async (tx) => {
    await repo.revokeOpenFor(tx, { email: input.email, accountId: place.accountId }, now);
    const newId = await repo.insertInvitation(tx, {
      email: input.email,
      role: place.role,
      accountId: place.accountId,
      branchIds: place.branchIds,
      invitedById: actor.id,
      tokenHash: hash,
      expiresAt,
      createdAt: now,
    });
    await audit(tx, {
      actorId: actor.id,
      action: 'invitation.create',
      targetType: 'invitation',
      targetId: newId,
      details: { role: place.role, accountId: place.accountId, branchIds: place.branchIds },
    });
    await queueMail(
      ctx,
      invitationMail(ctx.config, {
        to: input.email,
        token,
        role: place.role,
        invitedByName: actor.name,
        company: place.company,
        branchNames: place.branchNames,
        expiresAt,
      }),
      tx,
    );
    return newId;
  });
  return toApi((await repo.findInvitation(ctx.db, id))!, now);
}

/** Admins see every invitation; an account owner those into their own account. */
export async function listInvitations(
  ctx: AppContext,
  actor: SessionUser,
  q: InvitationListQuery,
): Promise<Page<Invitation>> {
  authorize(actor, 'invitation.list');
  const now = new Date();
  const page = await repo.listInvitations(ctx.db, {
    ...(actor.role === 'admin' ? {} : { accountId: actor.accountId! }),
    page: q.page,
    pageSize: q.pageSize,
    ...(q.status ? { where: repo.statusCondition(q.status, now) } : {}),
  });
  return { items: page.items.map((row) => toApi(row, now)), total: page.total };
}

/** Withdraws an invitation so its link stops working; one already used cannot be withdrawn. */
export async function revokeInvitation(ctx: AppContext, actor: SessionUser, id: number): Promise<Invitation> {
  authorize(actor, 'invitation.list');
  const row = await repo.findInvitation(ctx.db, id);
  if (!row) throw AppError.notFound('Invitation');
  authorize(actor, 'invitation.revoke', { accountId: row.accountId }, 'not-found');
  if (row.acceptedAt) throw AppError.conflict(`${row.email} has already joined: the invitation was used`);
  const now = new Date();
  if (!row.revokedAt) {
    await ctx.db.transaction(async (tx) => {
      await repo.markRevoked(tx, id, now);
      await audit(tx, {
        actorId: actor.id,
        action: 'invitation.revoke',
        targetType: 'invitation',
        targetId: id,
      });
    });
  }
  return toApi((await repo.findInvitation(ctx.db, id))!, now);
}
