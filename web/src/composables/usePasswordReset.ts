import { reactive, ref } from 'vue';
import { useRouter } from 'vue-router';
import { useI18n } from 'vue-i18n';
import { passwordResetConfirmSchema } from '@shared/schemas/invitations';
import { authApi } from '@/api/auth';
import { useSessionStore } from '@/stores/session';
import { useFormErrors } from './useFormErrors';
import { useLinkCheck } from './useLinkCheck';

/** The reset link's page: is the link still good, then the new password twice. */
export function usePasswordReset(token: string) {
  const { t } = useI18n();
  const router = useRouter();
  const session = useSessionStore();
  const link = useLinkCheck(() => authApi.checkReset(token));
  const form = reactive({ password: '', repeat: '' });
  const errors = useFormErrors(['password', 'repeat']);
  const busy = ref(false);

  async function submit(): Promise<void> {
    if (busy.value) return;
    const body = errors.validate(passwordResetConfirmSchema, { token, password: form.password });
    if (form.repeat !== form.password) errors.fields.repeat = t('passwordRule.mismatch');
    if (!body || errors.fields.repeat) return;
    busy.value = true;
    try {
      await authApi.confirmReset(body.token, body.password);
      // Every session of that person ended on the server; this tab may have been one of them.
      if (session.user && session.user.email === link.data.value?.email) session.clear();
      await router.replace({ name: 'sign-in', query: { reason: 'password-reset' } });
    } catch (error) {
      if (!link.refuse(error)) errors.fromError(error);
    } finally {
      busy.value = false;
    }
  }

  return { link, form, errors, busy, submit };
}
