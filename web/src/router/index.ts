import { createRouter, createWebHistory } from 'vue-router';
import { setUnauthenticatedHandler } from '@/api/http';
import { i18n } from '@/i18n';
import { setSessionEndedHandler } from '@/realtime/socket';
import { useSessionStore } from '@/stores/session';
import { homeFor, routes } from './routes';
import { safeRedirect } from './safeRedirect';

export { homeFor } from './routes';
export type { RouteName } from './routes';

export const router = createRouter({
  history: createWebHistory(import.meta.env.BASE_URL),
  routes,
});

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.load();
  const user = session.user;

  if (to.meta.guestOnly && user) return safeRedirect(to.query.redirect) ?? homeFor(user.role);
  if (to.meta.roles) {
    if (!user) return { name: 'sign-in', query: { redirect: to.fullPath } };
    if (!to.meta.roles.includes(user.role)) return homeFor(user.role);
  }
  return true;
});

router.afterEach((to) => {
  const product = i18n.global.t('app.name');
  document.title = to.meta.title ? `${i18n.global.t(to.meta.title)} · ${product}` : product;
});

/** The one way out when the session ends under us: forget it, sign in again, come back here. */
function toSignIn(reason?: string): void {
  useSessionStore().clear();
  const current = router.currentRoute.value;
  if (current.name === 'sign-in') return;
  const query: Record<string, string> = { redirect: current.fullPath };
  if (reason) query.reason = reason;
  void router.push({ name: 'sign-in', query });
}

setUnauthenticatedHandler(() => toSignIn());
setSessionEndedHandler((reason) => toSignIn(reason));
