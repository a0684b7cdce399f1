import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../../shared/src/schemas/auth';
import { authorize, can, type Action } from './policies';

const user = (role: SessionUser['role'], extra: Partial<SessionUser> = {}): SessionUser => ({
  id: 1,
  email: `${role}@test.example`,
  name: role,
  role,
  accountId: role === 'contractor' ? 10 : null,
  branchIds: role === 'contractor' ? [] : [1],
  isAccountOwner: false,
  ...extra,
});

const contractor = user('contractor');
const tech = user('tech');
const specialist = user('specialist');
const admin = user('admin');

describe('policy matrix', () => {
  const matrix: [Action, Record<string, boolean>][] = [
    ['admin.users.manage', { contractor: false, tech: false, specialist: false, admin: true }],
    ['admin.accounts.manage', { contractor: false, tech: false, specialist: false, admin: true }],
    ['admin.branches.manage', { contractor: false, tech: false, specialist: false, admin: true }],
    ['home.view', { contractor: true, tech: true, specialist: true, admin: true }],
    ['password.change', { contractor: true, tech: true, specialist: true, admin: true }],
    ['mail.preferences', { contractor: true, tech: true, specialist: true, admin: true }],
    ['realtime.connect', { contractor: true, tech: true, specialist: true, admin: true }],
    ['equipment.edit', { contractor: false, tech: false, specialist: true, admin: true }],
    ['check.run', { contractor: true, tech: true, specialist: true, admin: true }],
    ['desk.view', { contractor: false, tech: true, specialist: true, admin: true }],
    ['snippet.use', { contractor: false, tech: true, specialist: true, admin: true }],
    ['note.view', { contractor: false, tech: true, specialist: true, admin: true }],
    ['search.synonyms', { contractor: false, tech: false, specialist: true, admin: true }],
  ];
  for (const [action, expected] of matrix) {
    it(`When each role asks for ${action}, then only the expected roles may`, () => {
      const actual = Object.fromEntries(
        [contractor, tech, specialist, admin].map((u) => [u.role, can(u, action)]),
      );
      expect(actual).toEqual(expected);
    });
  }

  it('When an article is published, then a specialist other than the author or any admin may, its author-specialist may not', () => {
    const author = { ...specialist, id: 7 };
    expect(can(specialist, 'article.publish', { authorId: 7 })).toBe(true);
    expect(can(author, 'article.publish', { authorId: 7 })).toBe(false);
    expect(can({ ...admin, id: 7 }, 'article.publish', { authorId: 7 })).toBe(true);
    expect(can(tech, 'article.publish', { authorId: 99 })).toBe(false);
    expect(can(tech, 'article.edit', { authorId: tech.id })).toBe(true);
    expect(can(tech, 'article.edit', { authorId: 99 })).toBe(false);
    expect(can(contractor, 'article.write')).toBe(false);
  });

  it('When a message is marked or a ticket written up, then only staff who may work the ticket may', () => {
    for (const action of ['message.mark', 'ticket.write-up'] as const) {
      expect(can(contractor, action, { accountId: 10, branchId: 1 })).toBe(false);
      expect(can(tech, action, { branchId: 1 })).toBe(true);
      expect(can(tech, action, { branchId: 2 })).toBe(false);
      expect(can(tech, action, { branchId: 2, assigneeId: tech.id })).toBe(true);
      expect(can(specialist, action, { branchId: 1 })).toBe(true);
      expect(can(admin, action, { branchId: 99 })).toBe(true);
    }
  });

  it('When someone invites, then admins invite staff and an account owner only into their own account', () => {
    const owner = user('contractor', { isAccountOwner: true });
    expect([contractor, owner, tech, specialist, admin].map((u) => can(u, 'invitation.staff'))).toEqual([
      false,
      false,
      false,
      false,
      true,
    ]);
    expect(can(owner, 'invitation.teammate', { accountId: 10 })).toBe(true);
    expect(can(owner, 'invitation.teammate', { accountId: 11 })).toBe(false);
    expect(can(contractor, 'invitation.teammate', { accountId: 10 })).toBe(false);
    expect(can(admin, 'invitation.teammate', { accountId: 10 })).toBe(false);
    expect([contractor, owner, tech, specialist, admin].map((u) => can(u, 'invitation.list'))).toEqual([
      false,
      true,
      false,
      false,
      true,
    ]);
    expect(can(owner, 'invitation.revoke', { accountId: 10 })).toBe(true);
    expect(can(owner, 'invitation.revoke', { accountId: 11 })).toBe(false);
    expect(can(owner, 'invitation.revoke', { accountId: null })).toBe(false);
    expect(can(tech, 'invitation.revoke', { accountId: null })).toBe(false);
    expect(can(admin, 'invitation.revoke', { accountId: 11 })).toBe(true);
  });

  it('When nobody is signed in, then nothing is allowed', () => {
    expect(can(undefined, 'home.view')).toBe(false);
    expect(() => authorize(null, 'home.view')).toThrowError(expect.objectContaining({ status: 401 }));
  });

  it('When a contractor asks for an account, then only their own is allowed and another answers 404', () => {
    expect(can(contractor, 'account.view', { accountId: 10 })).toBe(true);
    expect(can(contractor, 'account.view', { accountId: 11 })).toBe(false);
    expect(() => authorize(contractor, 'account.view', { accountId: 11 }, 'not-found')).toThrowError(
      expect.objectContaining({ status: 404, code: 'not_found' }),
    );
    expect(can(tech, 'account.view', { accountId: 11 })).toBe(true);
  });

  it('When staff ask for a branch, then techs get their own, admins every one, contractors none', () => {
    expect(can(tech, 'branch.view', { branchId: 1 })).toBe(true);
    expect(can(tech, 'branch.view', { branchId: 2 })).toBe(false);
    expect(can(admin, 'branch.view', { branchId: 2 })).toBe(true);
    expect(can(contractor, 'branch.view', { branchId: 1 })).toBe(false);
  });

  it('When a role may never take an action, then the refusal is 403', () => {
    expect(() => authorize(tech, 'admin.users.manage')).toThrowError(
      expect.objectContaining({ status: 403 }),
    );
  });
});
