import { and, count, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../../db/client';
import { branches, contractorAccounts, invitations, users } from '../../db/schema/index';
import type { Role } from '../../../../shared/src/index';

const inviter = alias(users, 'inviter');

/** An invitation row with what the lists and the join page show beside it. */
const columns = {
  id: invitations.id,
  email: invitations.email,
  role: invitations.role,
  accountId: invitations.accountId,
  accountCompany: contractorAccounts.company,
  accountActive: contractorAccounts.active,
  branchIds: invitations.branchIds,
  invitedById: invitations.invitedById,
  invitedByName: inviter.name,
  inviterRole: inviter.role,
  inviterActive: inviter.active,
  inviterIsOwner: inviter.isAccountOwner,
  inviterAccountId: inviter.accountId,
  expiresAt: invitations.expiresAt,
  createdAt: invitations.createdAt,
  acceptedAt: invitations.acceptedAt,
  revokedAt: invitations.revokedAt,
};
export interface InvitationRow {
  id: number;
  email: string;
  role: Role;
  accountId: number | null;
  accountCompany: string | null;
  accountActive: boolean | null;
  branchIds: number[];
  invitedById: number;
  invitedByName: string;
  inviterRole: Role;
  inviterActive: boolean;
  inviterIsOwner: boolean;
  inviterAccountId: number | null;
  expiresAt: Date;
  createdAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
}

const base = (db: Executor) =>
  db
    .select(columns)
    .from(invitations)
    .innerJoin(inviter, eq(inviter.id, invitations.invitedById))
    .leftJoin(contractorAccounts, eq(contractorAccounts.id, invitations.accountId));

/** Invitations, newest first: every one (accountId undefined) or one account's. */
export async function listInvitations(
  db: Executor,
  q: { accountId?: number; page: number; pageSize: number; where?: SQL },
) {
  const conditions = [
    q.accountId !== undefined ? eq(invitations.accountId, q.accountId) : undefined,
    q.where,
  ];
  const where = and(...conditions.filter((c): c is SQL => c !== undefined));
  const [items, [total]] = await Promise.all([
    base(db)
      .where(where)
      .orderBy(desc(invitations.createdAt), desc(invitations.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db.select({ n: count() }).from(invitations).where(where),
  ]);
  return { items: items satisfies InvitationRow[], total: total?.n ?? 0 };
}

/** The SQL condition for one status at the given moment (computed from application time). */
export function statusCondition(status: 'waiting' | 'joined' | 'expired' | 'revoked', now: Date): SQL {
  switch (status) {
    case 'joined':
      return sql`${invitations.acceptedAt} is not null`;
    case 'revoked':
      return sql`${invitations.acceptedAt} is null and ${invitations.revokedAt} is not null`;
    case 'expired':
      return sql`${invitations.acceptedAt} is null and ${invitations.revokedAt} is null and ${invitations.expiresAt} <= ${now}`;
    case 'waiting':
      return sql`${invitations.acceptedAt} is null and ${invitations.revokedAt} is null and ${invitations.expiresAt} > ${now}`;
  }
}

export async function findInvitation(db: Executor, id: number): Promise<InvitationRow | undefined> {
  const [row] = await base(db).where(eq(invitations.id, id));
  return row;
}

export async function findInvitationByTokenHash(
  db: Executor,
  tokenHash: string,
): Promise<InvitationRow | undefined> {
  const [row] = await base(db).where(eq(invitations.tokenHash, tokenHash));
  return row;
}

/** Locks the invitation row until the transaction ends, so two acceptances cannot both win. */
export async function lockInvitation(tx: Executor, id: number) {
  const [row] = await tx
    .select({ acceptedAt: invitations.acceptedAt, revokedAt: invitations.revokedAt })
    .from(invitations)
    .where(eq(invitations.id, id))
    .for('update');
  return row;
}

export interface NewInvitation {
  email: string;
  role: Role;
  accountId: number | null;
  branchIds: number[];
  invitedById: number;
  tokenHash: string;
  expiresAt: Date;
  createdAt: Date;
}

export async function insertInvitation(db: Executor, row: NewInvitation): Promise<number> {
  const [inserted] = await db.insert(invitations).values(row).returning({ id: invitations.id });
  return inserted!.id;
}

/** Revokes the still-open invitations of this e-mail into the same place (a resend replaces them). */
export async function revokeOpenFor(
  db: Executor,
  where: { email: string; accountId: number | null },
  now: Date,
): Promise<void> {
  await db
    .update(invitations)
    .set({ revokedAt: now })
    .where(
      and(
        sql`lower(${invitations.email}) = lower(${where.email})`,
        where.accountId === null ? isNull(invitations.accountId) : eq(invitations.accountId, where.accountId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    );
}

export async function markRevoked(db: Executor, id: number, now: Date): Promise<void> {
  await db.update(invitations).set({ revokedAt: now }).where(eq(invitations.id, id));
}

export async function markAccepted(db: Executor, id: number, userId: number, now: Date): Promise<void> {
  await db.update(invitations).set({ acceptedAt: now, acceptedUserId: userId }).where(eq(invitations.id, id));
}

export async function emailInUse(db: Executor, email: string): Promise<boolean> {
  const [row] = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`);
  return row !== undefined;
}

export async function branchNames(db: Executor, ids: number[]): Promise<string[]> {
  if (ids.length === 0) return [];
  const rows = await db
    .select({ name: branches.name })
    .from(branches)
    .where(inArray(branches.id, ids))
    .orderBy(branches.name);
  return rows.map((r) => r.name);
}

/** The ids among these that are branches still open. */
export async function activeBranchIds(db: Executor, ids: number[]): Promise<number[]> {
  if (ids.length === 0) return [];
  const rows = await db
    .select({ id: branches.id })
    .from(branches)
    .where(and(inArray(branches.id, ids), eq(branches.active, true)));
  return rows.map((r) => r.id);
}

export async function findAccountForInvite(db: Executor, id: number) {
  const [row] = await db
    .select({
      id: contractorAccounts.id,
      company: contractorAccounts.company,
      active: contractorAccounts.active,
    })
    .from(contractorAccounts)
    .where(eq(contractorAccounts.id, id));
  return row;
}
