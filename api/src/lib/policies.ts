import type { Role, SessionUser } from '../../../shared/src/schemas/auth';
import { AppError } from './errors';

/**
 * Every authorization decision of the product, in one place. Routes and socket handlers ask
 * `can(user, action, resource)`; nothing else decides who may do what.
 */
export type Action =
  | 'admin.users.manage'
  | 'admin.accounts.manage'
  | 'admin.branches.manage'
  | 'invitation.staff'
  | 'invitation.teammate'
  | 'invitation.list'
  | 'invitation.revoke'
  | 'home.view'
  | 'password.change'
  | 'mail.preferences'
  | 'account.view'
  | 'branch.view'
  | 'realtime.connect'
  | 'equipment.search'
  | 'ticket.create'
  | 'ticket.view'
  | 'ticket.manage'
  | 'ticket.resolve-own'
  | 'note.view'
  | 'note.post'
  | 'message.mark'
  | 'ticket.write-up'
  | 'snippet.use'
  | 'snippet.edit'
  | 'desk.view'
  | 'check.run'
  | 'equipment.edit'
  | 'article.write'
  | 'article.edit'
  | 'article.publish'
  | 'article.retire'
  | 'search.insights'
  | 'search.synonyms';

export interface Resource {
  authorId?: number | null;
  accountId?: number | null;
  branchId?: number | null;
  assigneeId?: number | null;
  ownerId?: number | null;
  createdById?: number | null;
}

type Rule = (user: SessionUser, resource: Resource) => boolean;

const isStaff = (u: SessionUser) => u.role !== 'contractor';
const anyone: Rule = () => true;
const staffOnly: Rule = (u) => isStaff(u);
/** Staff see the tickets of their branches and the ones assigned to them; admins see all. */
const staffSeesTicket: Rule = (u, r) =>
  u.role === 'admin' ||
  (isStaff(u) && ((r.branchId != null && u.branchIds.includes(r.branchId)) || r.assigneeId === u.id));
const adminOnly: Rule = (u) => u.role === 'admin';
const isOwnerOf = (u: SessionUser, accountId: number | null | undefined) =>
  u.role === 'contractor' && u.isAccountOwner && u.accountId != null && u.accountId === accountId;

const RULES: Record<Action, Rule> = {
  'admin.users.manage': adminOnly,
  'admin.accounts.manage': adminOnly,
  'admin.branches.manage': adminOnly,
  // Admins invite staff; an account owner invites teammates into their own account only.
  'invitation.staff': adminOnly,
  'invitation.teammate': (u, r) => isOwnerOf(u, r.accountId),
  // Admins see and revoke every invitation; an owner those into their own account.
  'invitation.list': (u) => u.role === 'admin' || (u.role === 'contractor' && u.isAccountOwner),
  'invitation.revoke': (u, r) => u.role === 'admin' || isOwnerOf(u, r.accountId),
  'home.view': anyone,
  'password.change': anyone,
  // Everyone chooses which optional e-mails they get, for themselves only.
  'mail.preferences': anyone,
  'realtime.connect': anyone,
  'equipment.search': anyone,
  // Contractors open tickets for their own account only.
  'ticket.create': (u, r) => u.role === 'contractor' && u.accountId != null && u.accountId === r.accountId,
  'ticket.view': (u, r) => (u.role === 'contractor' ? u.accountId === r.accountId : staffSeesTicket(u, r)),
  'ticket.manage': staffSeesTicket,
  // A contractor may mark their own account's ticket solved, or reopen it (within 14 days: the service).
  'ticket.resolve-own': (u, r) => u.role === 'contractor' && u.accountId === r.accountId,
  // Internal notes never reach contractors.
  'note.view': staffOnly,
  'note.post': staffOnly,
  // Which messages answered a ticket is the desk's call, on tickets they work; contractors never see it.
  'message.mark': staffSeesTicket,
  // Writing a ticket up as a draft article: staff who may work the ticket (and so write articles).
  'ticket.write-up': staffSeesTicket,
  'snippet.use': staffOnly,
  'desk.view': staffOnly,
  // The checks are arithmetic anyone signed in may run; nothing of another account is read.
  'check.run': anyone,
  // Specialists keep the catalogue and its spec tables; admins may too.
  'equipment.edit': (u) => u.role === 'specialist' || u.role === 'admin',
  // Personal snippets: their owner. Shared ones: whoever made them, specialists and admins.
  'snippet.edit': (u, r) =>
    isStaff(u) &&
    (r.ownerId != null
      ? r.ownerId === u.id
      : r.createdById === u.id || u.role === 'specialist' || u.role === 'admin'),
  // Techs write drafts; specialists and admins too.
  'article.write': staffOnly,
  // An article is changed by its author or by a specialist or admin.
  'article.edit': (u, r) =>
    isStaff(u) && (r.authorId === u.id || u.role === 'specialist' || u.role === 'admin'),
  // Publishing needs a specialist or admin other than the author; an admin may publish their own.
  'article.publish': (u, r) => u.role === 'admin' || (u.role === 'specialist' && r.authorId !== u.id),
  'article.retire': (u) => u.role === 'specialist' || u.role === 'admin',
  'search.insights': (u) => u.role === 'specialist' || u.role === 'admin',
  // The synonym groups change what everyone's searches find.
  'search.synonyms': (u) => u.role === 'specialist' || u.role === 'admin',
  // A contractor sees their own account only; staff see every account (they serve them all).
  'account.view': (u, r) => (u.role === 'contractor' ? u.accountId === r.accountId : isStaff(u)),
  // Admins see every branch; other staff their own; contractors none directly.
  'branch.view': (u, r) =>
    u.role === 'admin' || (isStaff(u) && r.branchId != null && u.branchIds.includes(r.branchId)),
};

export function can(user: SessionUser | undefined | null, action: Action, resource: Resource = {}): boolean {
  if (!user) return false;
  return RULES[action](user, resource);
}

/**
 * Throws the answer a refusal deserves. Reads of another account's records answer 404 so their
 * existence never leaks; actions a role may never take answer 403.
 */
export function authorize(
  user: SessionUser | undefined | null,
  action: Action,
  resource: Resource = {},
  refusal: 'forbidden' | 'not-found' = 'forbidden',
): asserts user is SessionUser {
  if (!user) throw AppError.unauthenticated();
  if (can(user, action, resource)) return;
  throw refusal === 'not-found' ? AppError.notFound() : AppError.forbidden();
}

export const ROLE_LABEL: Record<Role, string> = {
  contractor: 'Contractor',
  tech: 'Desk tech',
  specialist: 'Product specialist',
  admin: 'Admin',
};

/** The signed-in user of a request, or the 401 that every route gives to anonymous callers. */
export function signedIn(req: { user?: SessionUser }): SessionUser {
  if (!req.user) throw AppError.unauthenticated();
  return req.user;
}
