import { reactive, ref } from 'vue';
import { useQueryClient } from '@tanstack/vue-query';
import { invitationCreateSchema, type Invitation } from '@shared/schemas/invitations';
import { invitationsApi } from '@/api/invitations';
import { useFormErrors } from './useFormErrors';

export type InviteMode = 'staff' | 'teammate';

/** The invite form: an e-mail, and for staff the role and branches. */
export function useInvitationForm(mode: InviteMode) {
  const queryClient = useQueryClient();
  const form = reactive({
    email: '',
    role: 'tech' as 'tech' | 'specialist' | 'admin',
    branchIds: [] as number[],
  });
  const errors = useFormErrors(['email', 'role', 'branchIds', 'accountId']);
  const busy = ref(false);

  function reset(): void {
    Object.assign(form, { email: '', role: 'tech', branchIds: [] });
    errors.clear();
  }

  async function submit(): Promise<Invitation | null> {
    if (busy.value) return null;
    const raw =
      mode === 'staff'
        ? { email: form.email, role: form.role, branchIds: form.branchIds }
        : { email: form.email };
    const body = errors.validate(invitationCreateSchema, raw);
    if (!body) return null;
    busy.value = true;
    try {
      const { invitation } = await invitationsApi.create(body);
      await queryClient.invalidateQueries({ queryKey: ['invitations'] });
      return invitation;
    } catch (error) {
      errors.fromError(error);
      return null;
    } finally {
      busy.value = false;
    }
  }

  return { form, errors, busy, reset, submit };
}
