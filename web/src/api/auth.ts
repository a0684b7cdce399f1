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
};
