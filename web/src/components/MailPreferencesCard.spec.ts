// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query';
import { resetCsrfToken } from '@/api/http';
import { i18n } from '@/i18n';
import MailPreferencesCard from './MailPreferencesCard.vue';

const reply = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function mountCard(patch: (body: unknown) => Response) {
  const sent: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      if (url === '/api/auth/csrf') return reply(200, { token: 't' });
      if (init?.method === 'PATCH') {
        const body = JSON.parse(String(init.body));
        sent.push(body);
        return patch(body);
      }
      return reply(200, { preferences: { ticketReceived: true, replies: true, resolved: true } });
    }),
  );
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const wrapper = mount(MailPreferencesCard, {
    global: { plugins: [i18n, [VueQueryPlugin, { queryClient }]] },
  });
  return { wrapper, sent };
}

const switchOf = (wrapper: ReturnType<typeof mount>, kind: string) =>
  wrapper.find(`[data-testid="mail-kind-${kind}"] input[role="switch"]`);

describe('MailPreferencesCard', () => {
  beforeEach(() => resetCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('When a switch is flipped, then that one choice is saved and the switch shows what the server stored', async () => {
    const { wrapper, sent } = mountCard(() =>
      reply(200, { preferences: { ticketReceived: true, replies: false, resolved: true } }),
    );
    await flushPromises();
    expect(switchOf(wrapper, 'replies').attributes('aria-checked')).toBe('true');
    await wrapper.find('[data-testid="mail-kind-replies"]').trigger('click');
    await flushPromises();
    expect(sent).toEqual([{ replies: false }]);
    expect(switchOf(wrapper, 'replies').attributes('aria-checked')).toBe('false');
    expect(switchOf(wrapper, 'resolved').attributes('aria-checked')).toBe('true');
  });

  it('When saving fails, then the switch keeps the stored choice', async () => {
    const { wrapper, sent } = mountCard(() => reply(500, { error: { code: 'internal', message: 'Down' } }));
    await flushPromises();
    await wrapper.find('[data-testid="mail-kind-resolved"]').trigger('click');
    await flushPromises();
    expect(sent).toEqual([{ resolved: false }]);
    expect(switchOf(wrapper, 'resolved').attributes('aria-checked')).toBe('true');
  });
});
