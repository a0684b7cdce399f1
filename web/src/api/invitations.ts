import type {
  Invitation,
  InvitationAccept,
  InvitationCreate,
  InvitationLookup,
  InvitationStatus,
} from '@shared/schemas/invitations';
import type { MeResponse } from '@shared/schemas/auth';
import type { Page } from '@shared/schemas/common';
import { http } from './http';

/** Invitations: admins invite staff, account owners invite teammates; the invitee joins by link. */
export const invitationsApi = {
  /** GET /api/invitations: admins see all, an owner their account's. */
  list: (params: { page: number; pageSize: number; status?: InvitationStatus }, signal?: AbortSignal) =>
    http.get<Page<Invitation>>('/invitations', { ...params }, signal),
  create: (body: InvitationCreate) => http.post<{ invitation: Invitation }>('/invitations', body),
  revoke: (id: number) => http.post<{ invitation: Invitation }>(`/invitations/${id}/revoke`),
  /** POST /api/invitations/lookup: the token goes in the body, never in a URL. */
  lookup: (token: string) => http.post<InvitationLookup>('/invitations/lookup', { token }),
  /** POST /api/invitations/accept: creates the sign-in and signs in (201). */
  accept: (body: InvitationAccept) => http.post<MeResponse>('/invitations/accept', body),
};
