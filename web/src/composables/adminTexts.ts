import type { Account, AdminUser, Branch } from '@shared/schemas/admin';

/**
 * How the admin screens speak of one kind of entity: the group of its strings in en.json (each group
 * has the same keys: title, newTitle, editTitle, created, deactivateTitle, …) and the named values
 * those strings take, `{ name }` or `{ company }`.
 */
export interface AdminTexts<Entity> {
  key: 'adminUsers' | 'adminAccounts' | 'adminBranches';
  params: (entity: Entity) => Record<string, string>;
}

export const USER_TEXTS: AdminTexts<AdminUser> = { key: 'adminUsers', params: ({ name }) => ({ name }) };
export const ACCOUNT_TEXTS: AdminTexts<Account> = {
  key: 'adminAccounts',
  params: ({ company }) => ({ company }),
};
export const BRANCH_TEXTS: AdminTexts<Branch> = { key: 'adminBranches', params: ({ name }) => ({ name }) };
