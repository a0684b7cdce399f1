import type { RouteRecordInfo, RouteRecordRaw } from 'vue-router';
import type { Role } from '@shared/schemas/auth';
import { ALL_ROLES, STAFF_ROLES } from '@/api/roles';
import SignInView from '@/views/SignInView.vue';

type NoParams = Record<never, never>;
type Info<Name extends string, Path extends string> = RouteRecordInfo<Name, Path, NoParams, NoParams>;

/** Every named route, so `router.push({ name })` is checked by the compiler. */
export interface RouteNamedMap {
  root: Info<'root', '/'>;
  'sign-in': Info<'sign-in', '/sign-in'>;
  'password-reset-request': Info<'password-reset-request', '/reset'>;
  'password-reset': RouteRecordInfo<'password-reset', '/reset/:token', { token: string }, { token: string }>;
  join: RouteRecordInfo<'join', '/join/:token', { token: string }, { token: string }>;
  unsubscribe: Info<'unsubscribe', '/unsubscribe'>;
  'contractor-home': Info<'contractor-home', '/company'>;
  'staff-home': Info<'staff-home', '/desk'>;
  tickets: Info<'tickets', '/tickets'>;
  'ticket-new': Info<'ticket-new', '/tickets/new'>;
  ticket: RouteRecordInfo<'ticket', '/tickets/:id', { id: string | number }, { id: string }>;
  'desk-board': Info<'desk-board', '/desk/board'>;
  password: Info<'password', '/password'>;
  'admin-users': Info<'admin-users', '/admin/users'>;
  'admin-accounts': Info<'admin-accounts', '/admin/accounts'>;
  'admin-branches': Info<'admin-branches', '/admin/branches'>;
  checks: Info<'checks', '/checks'>;
  equipment: Info<'equipment', '/equipment'>;
  'equipment-spec': RouteRecordInfo<
    'equipment-spec',
    '/equipment/:id/spec',
    { id: string | number },
    { id: string }
  >;
  kb: Info<'kb', '/kb'>;
  'kb-new': Info<'kb-new', '/kb/new'>;
  'kb-missed': Info<'kb-missed', '/kb/missed'>;
  'kb-synonyms': Info<'kb-synonyms', '/kb/synonyms'>;
  'kb-article': RouteRecordInfo<'kb-article', '/kb/:slug', { slug: string }, { slug: string }>;
  'kb-edit': RouteRecordInfo<'kb-edit', '/kb/:slug/edit', { slug: string }, { slug: string }>;
  'not-found': RouteRecordInfo<
    'not-found',
    '/:pathMatch(.*)*',
    { pathMatch: string | string[] },
    { pathMatch: string[] }
  >;
}
export type RouteName = keyof RouteNamedMap;

declare module 'vue-router' {
  interface TypesConfig {
    RouteNamedMap: RouteNamedMap;
  }
  interface RouteMeta {
    /** Who may open the route; none means anyone. */
    roles?: readonly Role[];
    /** Only for people who are not signed in (sign-in itself). */
    guestOnly?: boolean;
    /** Message key of the page title. */
    title?: string;
    /** Narrow, touch-first layout (contractor screens). */
    touch?: boolean;
  }
}

/** Who may edit equipment spec tables (the API's equipment.edit policy). */
const SPEC_EDITOR_ROLES: readonly Role[] = ['specialist', 'admin'];

/** Who reviews knowledge-base articles and reads what searches missed. */
const KB_REVIEWER_ROLES: readonly Role[] = ['specialist', 'admin'];

export type HomeRoute = { name: 'contractor-home' } | { name: 'staff-home' };

export function homeFor(role: Role): HomeRoute {
  return role === 'contractor' ? { name: 'contractor-home' } : { name: 'staff-home' };
}

export const routes: RouteRecordRaw[] = [
  // Sign-in sends whoever is already signed in on to their home.
  { path: '/', name: 'root', redirect: { name: 'sign-in' } },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: SignInView,
    meta: { guestOnly: true, title: 'signIn.title', touch: true },
  },
  // Reached from e-mailed links, signed in or not: the link's token is the only key.
  {
    path: '/reset',
    name: 'password-reset-request',
    component: () => import('@/views/PasswordResetRequestView.vue'),
    meta: { title: 'passwordReset.requestTitle', touch: true },
  },
  {
    path: '/reset/:token',
    name: 'password-reset',
    component: () => import('@/views/PasswordResetView.vue'),
    meta: { title: 'passwordReset.title', touch: true },
  },
  {
    path: '/join/:token',
    name: 'join',
    component: () => import('@/views/JoinView.vue'),
    meta: { title: 'join.title', touch: true },
  },
  // The "stop these e-mails" link: works signed in or not, the signed token in the query is the key.
  {
    path: '/unsubscribe',
    name: 'unsubscribe',
    component: () => import('@/views/UnsubscribeView.vue'),
    meta: { title: 'mail.unsubscribe.title', touch: true },
  },
  {
    path: '/company',
    name: 'contractor-home',
    component: () => import('@/views/ContractorHomeView.vue'),
    meta: { roles: ['contractor'], title: 'contractorHome.title', touch: true },
  },
  {
    path: '/desk',
    name: 'staff-home',
    component: () => import('@/views/StaffHomeView.vue'),
    meta: { roles: STAFF_ROLES, title: 'staffHome.title' },
  },
  {
    path: '/tickets',
    name: 'tickets',
    component: () => import('@/views/TicketListView.vue'),
    meta: { roles: ['contractor'], title: 'tickets.list.title', touch: true },
  },
  {
    path: '/tickets/new',
    name: 'ticket-new',
    component: () => import('@/views/TicketNewView.vue'),
    meta: { roles: ['contractor'], title: 'tickets.new.title', touch: true },
  },
  {
    path: '/tickets/:id(\\d+)',
    name: 'ticket',
    component: () => import('@/views/TicketView.vue'),
    meta: { roles: ALL_ROLES, title: 'tickets.view.title', touch: true },
  },
  {
    path: '/desk/board',
    name: 'desk-board',
    component: () => import('@/views/DeskBoardView.vue'),
    meta: { roles: STAFF_ROLES, title: 'tickets.board.title' },
  },
  {
    path: '/password',
    name: 'password',
    component: () => import('@/views/PasswordView.vue'),
    meta: { roles: ALL_ROLES, title: 'password.title', touch: true },
  },
  {
    path: '/admin/users',
    name: 'admin-users',
    component: () => import('@/views/AdminUsersView.vue'),
    meta: { roles: ['admin'], title: 'adminUsers.title' },
  },
  {
    path: '/admin/accounts',
    name: 'admin-accounts',
    component: () => import('@/views/AdminAccountsView.vue'),
    meta: { roles: ['admin'], title: 'adminAccounts.title' },
  },
  {
    path: '/admin/branches',
    name: 'admin-branches',
    component: () => import('@/views/AdminBranchesView.vue'),
    meta: { roles: ['admin'], title: 'adminBranches.title' },
  },
  {
    path: '/checks',
    name: 'checks',
    component: () => import('@/views/ChecksView.vue'),
    meta: { roles: ALL_ROLES, title: 'checks.title', touch: true },
  },
  {
    path: '/equipment',
    name: 'equipment',
    component: () => import('@/views/EquipmentListView.vue'),
    meta: { roles: SPEC_EDITOR_ROLES, title: 'equipment.list.title' },
  },
  {
    path: '/equipment/:id(\\d+)/spec',
    name: 'equipment-spec',
    component: () => import('@/views/EquipmentSpecView.vue'),
    meta: { roles: SPEC_EDITOR_ROLES, title: 'equipment.spec.title' },
  },
  {
    path: '/kb',
    name: 'kb',
    component: () => import('@/views/KnowledgeBaseView.vue'),
    meta: { roles: ALL_ROLES, title: 'kb.title', touch: true },
  },
  {
    path: '/kb/new',
    name: 'kb-new',
    component: () => import('@/views/ArticleEditorView.vue'),
    meta: { roles: STAFF_ROLES, title: 'kb.editor.newTitle' },
  },
  {
    path: '/kb/missed',
    name: 'kb-missed',
    component: () => import('@/views/KbMissedSearchesView.vue'),
    meta: { roles: KB_REVIEWER_ROLES, title: 'kb.missed.title' },
  },
  {
    path: '/kb/synonyms',
    name: 'kb-synonyms',
    component: () => import('@/views/KbSynonymsView.vue'),
    meta: { roles: KB_REVIEWER_ROLES, title: 'kb.synonyms.title' },
  },
  {
    path: '/kb/:slug',
    name: 'kb-article',
    component: () => import('@/views/ArticleView.vue'),
    meta: { roles: ALL_ROLES, title: 'kb.article.title', touch: true },
  },
  {
    path: '/kb/:slug/edit',
    name: 'kb-edit',
    component: () => import('@/views/ArticleEditorView.vue'),
    meta: { roles: STAFF_ROLES, title: 'kb.editor.editTitle' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { title: 'notFound.title' },
  },
];
