import { reactive, ref } from 'vue';
import { useRouter } from 'vue-router';
import { useI18n } from 'vue-i18n';
import { invitationAcceptSchema } from '@shared/schemas/invitations';
import { invitationsApi } from '@/api/invitations';
import { homeFor } from '@/router/routes';
import { useSessionStore } from '@/stores/session';
import { useFormErrors } from './useFormErrors';
import { useLinkCheck } from './useLinkCheck';

/** Joining by invitation: who invited whom to what, then a name and a password, then signed in. */
export function useJoin(token: string) {
  const { t } = useI18n();
  const router = useRouter();
  const session = useSessionStore();
  const link = useLinkCheck(async () => (await invitationsApi.lookup(token)).invitation);
  const form = reactive({ name: '', password: '', repeat: '' });
  const errors = useFormErrors(['name', 'password', 'repeat']);
  const busy = ref(false);

  async function submit(): Promise<void> {
    if (busy.value) return;
    const body = errors.validate(invitationAcceptSchema, { token, name: form.name, password: form.password });
    if (form.repeat !== form.password) errors.fields.repeat = t('passwordRule.mismatch');
    if (!body || errors.fields.repeat) return;
    busy.value = true;
    try {
      const { user } = await invitationsApi.accept(body);
      session.adopt(user);
      await router.replace(homeFor(user.role));
    } catch (error) {
      if (!link.refuse(error)) errors.fromError(error);
    } finally {
      busy.value = false;
    }
  }

  return { link, form, errors, busy, submit };
}
