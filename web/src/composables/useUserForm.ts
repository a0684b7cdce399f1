import { computed, reactive, ref } from 'vue';
import { useI18n } from 'vue-i18n';
import {
  userCreateSchema,
  userUpdateSchema,
  type AdminUser,
  type UserCreate,
  type UserUpdate,
} from '@shared/schemas/admin';
import type { Role } from '@shared/schemas/auth';
import { useConfirm } from './useConfirm';
import type { SaveEntity } from './useEntityForm';
import { useFormErrors } from './useFormErrors';

type Save = SaveEntity<AdminUser, UserCreate, UserUpdate>;

const FIELDS = [
  'name',
  'email',
  'role',
  'password',
  'accountId',
  'isAccountOwner',
  'branchIds',
  'active',
] as const;

function blank() {
  return {
    name: '',
    email: '',
    role: 'contractor' as Role,
    password: '',
    accountId: null as number | null,
    isAccountOwner: false,
    branchIds: [] as number[],
    active: true,
  };
}

const sameIds = (a: number[], b: number[]) => [...a].sort().join(',') === [...b].sort().join(',');

/** The new/edit user form: what the links between role, account and branches mean, and saving. */
export function useUserForm(save: Save) {
  const { t } = useI18n();
  const confirm = useConfirm();
  const form = reactive(blank());
  const editing = ref<AdminUser | null>(null);
  const errors = useFormErrors(FIELDS);
  const busy = ref(false);
  const isContractor = computed(() => form.role === 'contractor');

  function reset(user: AdminUser | null): void {
    editing.value = user;
    errors.clear();
    const next = blank();
    if (user) {
      const { name, email, role, accountId, isAccountOwner, branchIds, active } = user;
      Object.assign(next, {
        name,
        email,
        role,
        accountId,
        isAccountOwner,
        branchIds: [...branchIds],
        active,
      });
    }
    Object.assign(form, next);
  }

  /** What the form means for this role: contractors have an account, staff have branches. */
  function links() {
    return isContractor.value
      ? { accountId: form.accountId, isAccountOwner: form.isAccountOwner, branchIds: [] as number[] }
      : { accountId: null, isAccountOwner: false, branchIds: [...form.branchIds] };
  }

  function createBody(): UserCreate | null {
    const { accountId, isAccountOwner, branchIds } = links();
    const body = { name: form.name, email: form.email, role: form.role, password: form.password };
    return errors.validate(
      userCreateSchema,
      isContractor.value ? { ...body, accountId, isAccountOwner } : { ...body, branchIds },
    );
  }

  /** Only what changed (a PATCH); null when invalid, {} when nothing changed. */
  function updateBody(user: AdminUser): UserUpdate | Record<string, never> | null {
    const next = { name: form.name, email: form.email, role: form.role, active: form.active, ...links() };
    const changed: Record<string, unknown> = {};
    for (const [key, value] of Object.entries(next)) {
      const before = user[key as keyof AdminUser];
      const same = Array.isArray(value) ? sameIds(value, before as number[]) : value === before;
      if (!same) changed[key] = value;
    }
    errors.clear();
    if (isContractor.value && !form.accountId) errors.fields.accountId = t('adminUsers.needsAccount');
    if (!isContractor.value && form.branchIds.length === 0)
      errors.fields.branchIds = t('adminUsers.needsBranch');
    if (Object.keys(errors.fields).length > 0) return null;
    if (Object.keys(changed).length === 0) return {};
    return errors.validate(userUpdateSchema, changed);
  }

  /** Saves; resolves to the saved user, or null when it stayed open (invalid, refused, cancelled). */
  async function submit(): Promise<AdminUser | null> {
    if (busy.value) return null;
    const user = editing.value;
    const body = user ? updateBody(user) : createBody();
    if (!body) return null;
    if (user && Object.keys(body).length === 0) return user;
    if (user?.active && form.active === false) {
      const ok = await confirm({
        title: t('adminUsers.deactivateTitle'),
        message: t('adminUsers.deactivateMessage', { name: user.name }),
        confirm: t('adminUsers.deactivateConfirm'),
      });
      if (!ok) return null;
    }
    busy.value = true;
    try {
      return await save(user?.id ?? null, body as UserCreate | UserUpdate);
    } catch (error) {
      errors.fromError(error);
      return null;
    } finally {
      busy.value = false;
    }
  }

  return { form, editing, errors, busy, isContractor, reset, submit };
}
