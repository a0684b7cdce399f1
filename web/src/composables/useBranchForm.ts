import { useI18n } from 'vue-i18n';
import {
  branchCreateSchema,
  branchUpdateSchema,
  type Branch,
  type BranchCreate,
  type BranchUpdate,
} from '@shared/schemas/admin';
import { useEntityForm } from './useEntityForm';

interface BranchForm {
  code: string;
  name: string;
  deskEmail: string;
  active: boolean;
}

/** The new/edit branch form; an empty desk e-mail means "none". */
export function useBranchForm(
  save: (id: number | null, body: BranchCreate | BranchUpdate) => Promise<Branch>,
) {
  const { t } = useI18n();
  return useEntityForm<Branch, BranchForm, BranchCreate, BranchUpdate>({
    fields: ['code', 'name', 'deskEmail', 'active'],
    blank: () => ({ code: '', name: '', deskEmail: '', active: true }),
    fromEntity: ({ code, name, deskEmail, active }) => ({ code, name, deskEmail: deskEmail ?? '', active }),
    toBody: (form) => ({ ...form, deskEmail: form.deskEmail.trim() === '' ? null : form.deskEmail }),
    createSchema: branchCreateSchema,
    updateSchema: branchUpdateSchema,
    save,
    confirmDeactivate: (branch) => ({
      title: t('adminBranches.deactivateTitle'),
      message: t('adminBranches.deactivateMessage', { name: branch.name }),
      confirm: t('adminBranches.deactivateConfirm'),
    }),
  });
}
