// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { resetCsrfToken } from '@/api/http';
import { i18n } from '@/i18n';
import SignInView from './SignInView.vue';

function reply(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

async function mountSignIn(login: () => Response) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string) => (url === '/api/auth/csrf' ? reply(200, { token: 't' }) : login())),
  );
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/sign-in', name: 'sign-in', component: SignInView },
      { path: '/company', name: 'contractor-home', component: { template: '<p>home</p>' } },
      { path: '/reset', name: 'password-reset-request', component: { template: '<p>reset</p>' } },
    ],
  });
  await router.push('/sign-in');
  const wrapper = mount(SignInView, { global: { plugins: [pinia, router, i18n] }, attachTo: document.body });
  await wrapper.find('input[type="email"]').setValue('someone@test.example');
  await wrapper.find('input[type="password"]').setValue('not-the-password');
  return wrapper;
}

describe('SignInView', () => {
  beforeEach(() => resetCsrfToken());
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it('When the server rejects the e-mail field, then its message shows under the e-mail input and what was typed stays', async () => {
    const wrapper = await mountSignIn(() =>
      reply(400, {
        error: {
          code: 'validation_failed',
          message: 'Check the form',
          fields: { email: 'Enter a valid e-mail address' },
        },
      }),
    );
    await wrapper.find('form').trigger('submit');
    await flushPromises();

    const email = wrapper.find('input[type="email"]');
    const describedBy = email.attributes('aria-describedby');
    expect(describedBy).toBeTruthy();
    expect(wrapper.find(`#${describedBy!.split(' ')[0]}`).text()).toBe('Enter a valid e-mail address');
    expect(email.attributes('aria-invalid')).toBe('true');
    expect((email.element as HTMLInputElement).value).toBe('someone@test.example');
    wrapper.unmount();
  });

  it('When the credentials are wrong, then the message shows as an alert in the form and the e-mail is kept', async () => {
    const wrapper = await mountSignIn(() =>
      reply(401, {
        error: { code: 'invalid_credentials', message: 'That e-mail and password do not match.' },
      }),
    );
    await wrapper.find('form').trigger('submit');
    await flushPromises();

    expect(wrapper.find('[role="alert"]').text()).toContain('That e-mail and password do not match.');
    expect((wrapper.find('input[type="email"]').element as HTMLInputElement).value).toBe(
      'someone@test.example',
    );
    wrapper.unmount();
  });

  it('When nothing is typed, then both fields say what is missing and nothing is sent', async () => {
    const wrapper = await mountSignIn(() => reply(500, {}));
    await wrapper.find('input[type="email"]').setValue('');
    await wrapper.find('input[type="password"]').setValue('');
    await wrapper.find('form').trigger('submit');
    await flushPromises();

    expect(wrapper.text()).toContain('Enter the e-mail you sign in with');
    expect(wrapper.text()).toContain('Enter your password');
    expect(fetch).not.toHaveBeenCalled();
    wrapper.unmount();
  });
});
