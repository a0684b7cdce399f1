import {
  branchCreateSchema,
  branchUpdateSchema,
  type Branch,
  type BranchCreate,
  type BranchUpdate,
} from '@shared/schemas/admin';
import { BRANCH_TEXTS } from './adminTexts';
import { useEntityForm, type SaveEntity } from './useEntityForm';

interface BranchForm {
  code: string;
  name: string;
  deskEmail: string;
  active: boolean;
}

/** The new/edit branch form; an empty desk e-mail means "none". */
export function useBranchForm(save: SaveEntity<Branch, BranchCreate, BranchUpdate>) {
  return useEntityForm<Branch, BranchForm, BranchCreate, BranchUpdate>({
    texts: BRANCH_TEXTS,
    fields: ['code', 'name', 'deskEmail', 'active'],
    blank: () => ({ code: '', name: '', deskEmail: '', active: true }),
    fromEntity: ({ code, name, deskEmail, active }) => ({ code, name, deskEmail: deskEmail ?? '', active }),
    toBody: (form) => ({ ...form, deskEmail: form.deskEmail.trim() === '' ? null : form.deskEmail }),
    createSchema: branchCreateSchema,
    updateSchema: branchUpdateSchema,
    save,
  });
}
