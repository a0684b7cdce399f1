import type { LoginBody, MeResponse, PasswordChangeBody } from '@shared/schemas/auth';
import { http } from './http';

export const authApi = {
  /** GET /api/auth/me: the signed-in person, or a 401. */
  me: () => http.get<MeResponse>('/auth/me'),
  /** POST /api/auth/login */
  login: (body: LoginBody) => http.post<MeResponse>('/auth/login', body),
  /** POST /api/auth/logout (204) */
  logout: () => http.post<void>('/auth/logout'),
  /** POST /api/auth/password (204) */
  changePassword: (body: PasswordChangeBody) => http.post<void>('/auth/password', body),
  /** POST /api/auth/password-reset (202, the same answer for any e-mail) */
  requestReset: (email: string) => http.post<{ message: string }>('/auth/password-reset', { email }),
  /** POST /api/auth/password-reset/check: is the link still usable, and for which sign-in */
  checkReset: (token: string) =>
    http.post<{ email: string; expiresAt: string }>('/auth/password-reset/check', { token }),
  /** POST /api/auth/password-reset/confirm (204) */
  confirmReset: (token: string, password: string) =>
    http.post<void>('/auth/password-reset/confirm', { token, password }),
};
