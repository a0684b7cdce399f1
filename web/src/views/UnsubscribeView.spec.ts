// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { resetCsrfToken } from '@/api/http';
import { i18n } from '@/i18n';
import UnsubscribeView from './UnsubscribeView.vue';

const reply = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

async function mountAt(path: string, answer: () => Response) {
  const calls: { url: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      if (url === '/api/auth/csrf') return reply(200, { token: 't' });
      calls.push({ url, body: init?.body ? JSON.parse(String(init.body)) : undefined });
      return answer();
    }),
  );
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/unsubscribe', name: 'unsubscribe', component: UnsubscribeView },
      { path: '/sign-in', name: 'sign-in', component: { template: '<p>sign in</p>' } },
    ],
  });
  await router.push(path);
  const wrapper = mount(UnsubscribeView, { global: { plugins: [pinia, router, i18n] } });
  await flushPromises();
  return { wrapper, calls };
}

describe('UnsubscribeView', () => {
  beforeEach(() => resetCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('When the link is opened, then it names the e-mail and changes nothing until the button is pressed', async () => {
    const { wrapper, calls } = await mountAt('/unsubscribe?token=12.replies.abc', () =>
      reply(200, { kind: 'replies' }),
    );
    expect(wrapper.text()).toContain('Stop the e-mails we send you with desk replies you missed?');
    expect(calls).toEqual([]);
    await wrapper.find('[data-testid="unsubscribe-confirm"]').trigger('click');
    await flushPromises();
    expect(calls).toEqual([{ url: '/api/mail/unsubscribe', body: { token: '12.replies.abc' } }]);
    expect(wrapper.text()).toContain('Done: no more e-mails with desk replies you missed.');
  });

  it('When the server refuses a changed link, then its reason shows and there is no button to press', async () => {
    const { wrapper } = await mountAt('/unsubscribe?token=12.replies.forged', () =>
      reply(400, {
        error: { code: 'validation_failed', message: 'This link to stop e-mails is not valid', fields: {} },
      }),
    );
    await wrapper.find('[data-testid="unsubscribe-confirm"]').trigger('click');
    await flushPromises();
    expect(wrapper.text()).toContain('This link to stop e-mails is not valid');
    expect(wrapper.find('[data-testid="unsubscribe-confirm"]').exists()).toBe(false);
  });

  it('When the page is opened without a token, then it says to use the link from the e-mail and sends nothing', async () => {
    const { wrapper, calls } = await mountAt('/unsubscribe', () => reply(200, {}));
    expect(wrapper.text()).toContain('This page needs the link from an e-mail');
    expect(calls).toEqual([]);
  });
});
