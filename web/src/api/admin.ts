import type {
  Account,
  AccountCreate,
  AccountUpdate,
  AdminUser,
  Branch,
  BranchCreate,
  BranchUpdate,
  UserCreate,
  UserUpdate,
} from '@shared/schemas/admin';
import type { Role } from '@shared/schemas/auth';
import type { Page } from '@shared/schemas/common';
import { http } from './http';

export interface ListParams {
  page: number;
  pageSize: number;
  q?: string;
}
export interface UserListParams extends ListParams {
  role?: Role;
}

/** Admin only: staff and contractor users, contractor accounts, branches. */
export const adminApi = {
  listUsers: (params: UserListParams, signal?: AbortSignal) =>
    http.get<Page<AdminUser>>('/admin/users', { ...params }, signal),
  createUser: (body: UserCreate) => http.post<{ user: AdminUser }>('/admin/users', body),
  updateUser: (id: number, body: UserUpdate) => http.patch<{ user: AdminUser }>(`/admin/users/${id}`, body),

  listAccounts: (params: ListParams, signal?: AbortSignal) =>
    http.get<Page<Account>>('/admin/accounts', { ...params }, signal),
  createAccount: (body: AccountCreate) => http.post<{ account: Account }>('/admin/accounts', body),
  updateAccount: (id: number, body: AccountUpdate) =>
    http.patch<{ account: Account }>(`/admin/accounts/${id}`, body),

  listBranches: (params: ListParams, signal?: AbortSignal) =>
    http.get<Page<Branch>>('/admin/branches', { ...params }, signal),
  createBranch: (body: BranchCreate) => http.post<{ branch: Branch }>('/admin/branches', body),
  updateBranch: (id: number, body: BranchUpdate) =>
    http.patch<{ branch: Branch }>(`/admin/branches/${id}`, body),
};
