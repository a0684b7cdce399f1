import { reactive, ref } from 'vue';
import { useI18n } from 'vue-i18n';
import { authApi } from '@/api/auth';
import { useFormErrors } from './useFormErrors';

/** "Forgot your password?": the e-mail to send a link to, and whether it was asked for. */
export function usePasswordResetRequest() {
  const { t } = useI18n();
  const form = reactive({ email: '' });
  const errors = useFormErrors(['email']);
  const busy = ref(false);
  /** The address the link was asked for; the answer is the same whether or not it has a sign-in. */
  const sentTo = ref<string | null>(null);

  async function submit(): Promise<void> {
    if (busy.value) return;
    errors.clear();
    const email = form.email.trim();
    if (!email) {
      errors.fields.email = t('passwordReset.emailRequired');
      return;
    }
    busy.value = true;
    try {
      await authApi.requestReset(email);
      sentTo.value = email;
    } catch (error) {
      errors.fromError(error);
    } finally {
      busy.value = false;
    }
  }

  function again(): void {
    sentTo.value = null;
  }

  return { form, errors, busy, sentTo, submit, again };
}
