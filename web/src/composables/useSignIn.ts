import { reactive, ref } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { useI18n } from 'vue-i18n';
import { ApiError } from '@/api/http';
import { homeFor } from '@/router/routes';
import { safeRedirect } from '@/router/safeRedirect';
import { useSessionStore } from '@/stores/session';
import { useFormErrors } from './useFormErrors';

/** The sign-in form: what was typed, its errors, and where to go once signed in. */
export function useSignIn() {
  const { t } = useI18n();
  const session = useSessionStore();
  const route = useRoute();
  const router = useRouter();
  const form = reactive({ email: '', password: '' });
  const errors = useFormErrors(['email', 'password']);
  const busy = ref(false);

  /**
   * Only "is anything typed": the server checks the rest, and the zod schemas stay out of the
   * first page a phone loads.
   */
  function check(): { email: string; password: string } | null {
    errors.clear();
    const email = form.email.trim();
    if (!email) errors.fields.email = t('signIn.emailRequired');
    if (!form.password) errors.fields.password = t('signIn.passwordRequired');
    return errors.fields.email || errors.fields.password ? null : { email, password: form.password };
  }

  async function submit(): Promise<void> {
    if (busy.value) return;
    const body = check();
    if (!body) return;
    busy.value = true;
    try {
      const user = await session.signIn(body);
      await router.replace(safeRedirect(route.query.redirect) ?? homeFor(user.role));
    } catch (error) {
      errors.fromError(error);
      // Wrong credentials and "too many tries" belong to the form as a whole, not one field.
      if (error instanceof ApiError && error.status === 401) form.password = '';
    } finally {
      busy.value = false;
    }
  }

  return { form, errors, busy, submit };
}
