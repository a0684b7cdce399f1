import { describe, expect, it } from 'vitest';
import { loginBodySchema, passwordChangeBodySchema } from './auth';
import { accountCreateSchema, branchCreateSchema, userCreateSchema, userUpdateSchema } from './admin';
import { listQuerySchema } from './common';

const fieldsOf = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('sign-in body', () => {
  it('When the e-mail has capitals and spaces, then it is trimmed and lower-cased', () => {
    expect(loginBodySchema.parse({ email: '  Owner@Keane.Example ', password: 'x' }).email).toBe(
      'owner@keane.example',
    );
  });
  it('When fields are missing, then each reads "Required"', () => {
    expect(fieldsOf(loginBodySchema.safeParse({}))).toEqual({ email: 'Required', password: 'Required' });
  });
});

describe('password change', () => {
  it('When the new password is under 10 or over 64 characters, then it is refused on `next`', () => {
    expect(fieldsOf(passwordChangeBodySchema.safeParse({ current: 'a', next: 'short' }))).toEqual({
      next: 'Use at least 10 characters',
    });
    expect(passwordChangeBodySchema.safeParse({ current: 'a', next: 'x'.repeat(64) }).success).toBe(true);
    expect(passwordChangeBodySchema.safeParse({ current: 'a', next: 'x'.repeat(65) }).success).toBe(false);
  });
  it('When the new password equals the current one, then it is refused on `next`', () => {
    expect(
      fieldsOf(passwordChangeBodySchema.safeParse({ current: 'same-password-1', next: 'same-password-1' })),
    ).toHaveProperty('next');
  });
});

describe('admin bodies', () => {
  const base = { email: 'a@b.example', name: 'A', password: 'long-enough-1' };
  it('When a contractor has no account, then `accountId` is named', () => {
    expect(fieldsOf(userCreateSchema.safeParse({ ...base, role: 'contractor' }))).toEqual({
      accountId: 'A contractor needs an account',
    });
  });
  it('When staff have no branch, then `branchIds` is named', () => {
    expect(fieldsOf(userCreateSchema.safeParse({ ...base, role: 'specialist' }))).toEqual({
      branchIds: 'Staff need at least one branch',
    });
  });
  it('When the role is not one of ours, then `role` is named', () => {
    expect(Object.keys(fieldsOf(userCreateSchema.safeParse({ ...base, role: 'owner' })))).toEqual(['role']);
  });
  it('When an update is empty, then it is refused', () => {
    expect(userUpdateSchema.safeParse({}).success).toBe(false);
  });
  it('When a branch code or account number is typed in lower case, then it is stored upper case', () => {
    expect(branchCreateSchema.parse({ code: 'egt', name: 'Eastgate' }).code).toBe('EGT');
    expect(
      accountCreateSchema.parse({ company: 'X', accountNumber: 'hv-1', homeBranchId: 1 }).accountNumber,
    ).toBe('HV-1');
    expect(fieldsOf(branchCreateSchema.safeParse({ code: 'e1', name: 'E' }))).toEqual({
      code: 'Letters only',
    });
  });
  it('When list paging is absent or out of range, then defaults apply or it is refused', () => {
    expect(listQuerySchema.parse({})).toEqual({ page: 1, pageSize: 20 });
    expect(listQuerySchema.safeParse({ pageSize: '500' }).success).toBe(false);
  });
});
