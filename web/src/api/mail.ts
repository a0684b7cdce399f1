import type {
  MailPreferencesResponse,
  MailPreferencesUpdate,
  UnsubscribeResponse,
} from '@shared/schemas/mail';
import { http } from './http';

export const mailApi = {
  /** GET /api/me/mail-preferences: which optional e-mails I get */
  preferences: (signal?: AbortSignal) =>
    http.get<MailPreferencesResponse>('/me/mail-preferences', undefined, signal),
  /** PATCH /api/me/mail-preferences: turn some on or off; answers with all of them */
  updatePreferences: (patch: MailPreferencesUpdate) =>
    http.patch<MailPreferencesResponse>('/me/mail-preferences', patch),
  /** POST /api/mail/unsubscribe: the signed link from an e-mail, no sign-in needed */
  unsubscribe: (token: string) => http.post<UnsubscribeResponse>('/mail/unsubscribe', { token }),
};
