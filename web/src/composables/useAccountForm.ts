import { useI18n } from 'vue-i18n';
import {
  accountCreateSchema,
  accountUpdateSchema,
  type Account,
  type AccountCreate,
  type AccountUpdate,
} from '@shared/schemas/admin';
import { useEntityForm } from './useEntityForm';

interface AccountForm {
  company: string;
  accountNumber: string;
  homeBranchId: number | null;
  active: boolean;
}

/** The new/edit contractor account form. */
export function useAccountForm(
  save: (id: number | null, body: AccountCreate | AccountUpdate) => Promise<Account>,
) {
  const { t } = useI18n();
  return useEntityForm<Account, AccountForm, AccountCreate, AccountUpdate>({
    fields: ['company', 'accountNumber', 'homeBranchId', 'active'],
    blank: () => ({ company: '', accountNumber: '', homeBranchId: null, active: true }),
    fromEntity: ({ company, accountNumber, homeBranchId, active }) => ({
      company,
      accountNumber,
      homeBranchId,
      active,
    }),
    toBody: (form) => ({ ...form, homeBranchId: form.homeBranchId ?? undefined }),
    createSchema: accountCreateSchema,
    updateSchema: accountUpdateSchema,
    save,
    confirmDeactivate: (account) => ({
      title: t('adminAccounts.deactivateTitle'),
      message: t('adminAccounts.deactivateMessage', { company: account.company }),
      confirm: t('adminAccounts.deactivateConfirm'),
    }),
  });
}
