import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import type {
  AccountCreate,
  AccountUpdate,
  BranchCreate,
  BranchUpdate,
  SessionUser,
  UserCreate,
  UserUpdate,
} from '../../../../shared/src/index';
import { audit } from '../../lib/audit';
import { AppError } from '../../lib/errors';
import { isForeignKeyViolation, isUniqueViolation } from '../../lib/pg-errors';
import { hashPassword } from '../../lib/passwords';
import { assertPasswordRule } from '../../lib/password-rule';
import { deleteSessionsOf } from '../auth/auth.repository';
import { notifyEmailChanged } from '../mail/notifications';
import * as accounts from './accounts.repository';
import * as branches from './branches.repository';
import * as users from './users.repository';

/** Maps the database's refusals to answers naming the field at fault. */
function explain(err: unknown, uniqueField: string, fkField: string): never {
  if (isUniqueViolation(err))
    throw AppError.conflict(`This ${uniqueField} is already in use`, { [uniqueField]: 'Already in use' });
  if (isForeignKeyViolation(err)) throw AppError.validation({ [fkField]: 'Does not exist' });
  throw err;
}

// Branches ---------------------------------------------------------------------
export async function createBranch(ctx: AppContext, actor: SessionUser, input: BranchCreate) {
  return ctx.db
    .transaction(async (tx) => {
      const branch = await branches.insertBranch(tx, input);
      await audit(tx, {
        actorId: actor.id,
        action: 'branch.create',
        targetType: 'branch',
        targetId: branch.id,
      });
      return branch;
    })
    .catch((err) => explain(err, 'code', 'id'));
}

export async function updateBranch(ctx: AppContext, actor: SessionUser, id: number, input: BranchUpdate) {
  return ctx.db
    .transaction(async (tx) => {
      const branch = await branches.updateBranch(tx, id, input);
      if (!branch) throw AppError.notFound('Branch');
      await audit(tx, {
        actorId: actor.id,
        action: 'branch.update',
        targetType: 'branch',
        targetId: id,
        details: input,
      });
      return branch;
    })
    .catch((err) => explain(err, 'code', 'id'));
}

// Contractor accounts -----------------------------------------------------------
export async function createAccount(ctx: AppContext, actor: SessionUser, input: AccountCreate) {
  const id = await ctx.db
    .transaction(async (tx) => {
      const newId = await accounts.insertAccount(tx, input);
      await audit(tx, {
        actorId: actor.id,
        action: 'account.create',
        targetType: 'account',
        targetId: newId,
      });
      return newId;
    })
    .catch((err) => explain(err, 'accountNumber', 'homeBranchId'));
  return (await accounts.findAccount(ctx.db, id))!;
}

export async function updateAccount(ctx: AppContext, actor: SessionUser, id: number, input: AccountUpdate) {
  await ctx.db
    .transaction(async (tx) => {
      if (!(await accounts.updateAccount(tx, id, input))) throw AppError.notFound('Account');
      await audit(tx, {
        actorId: actor.id,
        action: 'account.update',
        targetType: 'account',
        targetId: id,
        details: input,
      });
    })
    .catch((err) => explain(err, 'accountNumber', 'homeBranchId'));
  return (await accounts.findAccount(ctx.db, id))!;
}

// Users --------------------------------------------------------------------------
/** A contractor has an account and no branches; staff have branches and no account. */
function roleLinks(
  role: UserCreate['role'],
  input: Pick<UserUpdate, 'accountId' | 'branchIds' | 'isAccountOwner'>,
) {
  return role === 'contractor'
    ? {
        accountId: input.accountId ?? null,
        branchIds: [] as number[],
        isAccountOwner: input.isAccountOwner ?? false,
      }
    : { accountId: null, branchIds: input.branchIds ?? [], isAccountOwner: false };
}

export async function createUser(ctx: AppContext, actor: SessionUser, input: UserCreate) {
  const links = roleLinks(input.role, input);
  await assertPasswordRule(input.password, 'password', [input.email, input.name]);
  const passwordHash = await hashPassword(input.password);
  const id = await ctx.db
    .transaction(async (tx) => {
      const newId = await users.insertUser(tx, {
        email: input.email,
        name: input.name,
        role: input.role,
        passwordHash,
        accountId: links.accountId,
        isAccountOwner: links.isAccountOwner,
      });
      await users.setBranches(tx, newId, links.branchIds);
      await audit(tx, {
        actorId: actor.id,
        action: 'user.create',
        targetType: 'user',
        targetId: newId,
        details: { role: input.role },
      });
      return newId;
    })
    .catch((err) => explain(err, 'email', input.role === 'contractor' ? 'accountId' : 'branchIds'));
  return (await users.findUser(ctx.db, id))!;
}

export async function updateUser(ctx: AppContext, actor: SessionUser, id: number, input: UserUpdate) {
  const current = await users.findUser(ctx.db, id);
  if (!current) throw AppError.notFound('User');
  if (id === actor.id && (input.active === false || (input.role && input.role !== 'admin'))) {
    throw AppError.validation({
      [input.active === false ? 'active' : 'role']: 'You cannot lock yourself out',
    });
  }
  const role = input.role ?? current.role;
  const links = roleLinks(role, {
    accountId: input.accountId !== undefined ? input.accountId : current.accountId,
    branchIds: input.branchIds ?? current.branchIds,
    isAccountOwner: input.isAccountOwner ?? current.isAccountOwner,
  });
  if (role === 'contractor' && !links.accountId)
    throw AppError.validation({ accountId: 'A contractor needs an account' });
  if (role !== 'contractor' && links.branchIds.length === 0)
    throw AppError.validation({ branchIds: 'Staff need at least one branch' });
  const deactivated = input.active === false && current.active;
  await ctx.db
    .transaction(async (tx: Executor) => {
      await users.updateUserRow(tx, id, {
        ...(input.email !== undefined && { email: input.email }),
        ...(input.name !== undefined && { name: input.name }),
        ...(input.active !== undefined && { active: input.active }),
        role,
        accountId: links.accountId,
        isAccountOwner: links.isAccountOwner,
      });
      await users.setBranches(tx, id, links.branchIds);
      if (deactivated) await deleteSessionsOf(tx, id);
      if (input.email !== undefined && input.email.toLowerCase() !== current.email.toLowerCase()) {
        const name = input.name ?? current.name;
        await notifyEmailChanged(ctx, tx, { name, oldEmail: current.email, newEmail: input.email });
      }
      await audit(tx, {
        actorId: actor.id,
        action: deactivated ? 'user.deactivate' : 'user.update',
        targetType: 'user',
        targetId: id,
        details: { ...input },
      });
    })
    .catch((err) => explain(err, 'email', role === 'contractor' ? 'accountId' : 'branchIds'));
  if (deactivated) ctx.realtime.endUserSessions(id, 'deactivated');
  return (await users.findUser(ctx.db, id))!;
}

export const listUsers = users.listUsers;
export const listAccounts = accounts.listAccounts;
export const listBranches = branches.listBranches;
