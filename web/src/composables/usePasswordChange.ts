import { reactive, ref } from 'vue';
import { useI18n } from 'vue-i18n';
import { passwordChangeBodySchema } from '@shared/schemas/auth';
import { authApi } from '@/api/auth';
import { useFormErrors } from './useFormErrors';

/** Change your own password: current, new, and the new one again. */
export function usePasswordChange() {
  const { t } = useI18n();
  const form = reactive({ current: '', next: '', repeat: '' });
  const errors = useFormErrors(['current', 'next', 'repeat']);
  const busy = ref(false);
  const done = ref(false);

  async function submit(): Promise<void> {
    if (busy.value) return;
    done.value = false;
    const body = errors.validate(passwordChangeBodySchema, { current: form.current, next: form.next });
    if (form.repeat !== form.next) errors.fields.repeat = t('password.mismatch');
    if (!body || errors.fields.repeat) return;
    busy.value = true;
    try {
      await authApi.changePassword(body);
      Object.assign(form, { current: '', next: '', repeat: '' });
      done.value = true;
    } catch (error) {
      errors.fromError(error);
    } finally {
      busy.value = false;
    }
  }

  return { form, errors, busy, done, submit };
}
