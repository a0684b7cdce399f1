import {
  accountCreateSchema,
  accountUpdateSchema,
  type Account,
  type AccountCreate,
  type AccountUpdate,
} from '@shared/schemas/admin';
import { ACCOUNT_TEXTS } from './adminTexts';
import { useEntityForm, type SaveEntity } from './useEntityForm';

interface AccountForm {
  company: string;
  accountNumber: string;
  homeBranchId: number | null;
  active: boolean;
}

/** The new/edit contractor account form. */
export function useAccountForm(save: SaveEntity<Account, AccountCreate, AccountUpdate>) {
  return useEntityForm<Account, AccountForm, AccountCreate, AccountUpdate>({
    texts: ACCOUNT_TEXTS,
    fields: ['company', 'accountNumber', 'homeBranchId', 'active'],
    blank: () => ({ company: '', accountNumber: '', homeBranchId: null, active: true }),
    toBody: (form) => ({ ...form, homeBranchId: form.homeBranchId ?? undefined }),
    createSchema: accountCreateSchema,
    updateSchema: accountUpdateSchema,
    save,
  });
}
