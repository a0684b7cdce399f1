// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent } from 'vue';
import { mount } from '@vue/test-utils';
import type { AdminUser } from '@shared/schemas/admin';
import { i18n } from '@/i18n';
import { useUserForm } from './useUserForm';

const confirm = vi.fn<() => Promise<boolean>>();
vi.mock('./useConfirm', () => ({ useConfirm: () => confirm }));

const contractor: AdminUser = {
  id: 7,
  email: 'pat@test.example',
  name: 'Pat Fielding',
  role: 'contractor',
  active: true,
  accountId: 3,
  accountCompany: 'Copperline Heating',
  isAccountOwner: false,
  branchIds: [],
  lastSignInAt: null,
  createdAt: '2026-01-01T00:00:00Z',
};

function setup(user: AdminUser | null) {
  const save = vi.fn(async (_id: number | null, body: object) => ({ ...contractor, ...body }) as AdminUser);
  let form!: ReturnType<typeof useUserForm>;
  mount(
    defineComponent({
      setup() {
        form = useUserForm(save);
        form.reset(user);
        return () => null;
      },
    }),
    { global: { plugins: [i18n] } },
  );
  return { form, save };
}

describe('the person form', () => {
  afterEach(() => confirm.mockReset());

  it('When a desk tech is created, then the body carries their branches and no account', async () => {
    const { form, save } = setup(null);
    Object.assign(form.form, {
      name: 'Dana Counter',
      email: 'Dana@Test.Example',
      role: 'tech',
      password: 'long-enough-pass',
      accountId: 3,
      branchIds: [2, 5],
    });
    await form.submit();
    expect(save).toHaveBeenCalledWith(null, {
      name: 'Dana Counter',
      email: 'dana@test.example',
      role: 'tech',
      password: 'long-enough-pass',
      branchIds: [2, 5],
    });
  });

  it('When a contractor is created without an account, then the account field says so and nothing is sent', async () => {
    const { form, save } = setup(null);
    Object.assign(form.form, { name: 'Pat', email: 'pat@test.example', password: 'long-enough-pass' });
    await form.submit();
    expect(form.errors.fields.accountId).toBe('A contractor needs an account');
    expect(save).not.toHaveBeenCalled();
  });

  it('When only the name of a contractor changes, then only the name is sent', async () => {
    const { form, save } = setup(contractor);
    form.form.name = 'Pat Fielding-Ross';
    await form.submit();
    expect(save).toHaveBeenCalledWith(7, { name: 'Pat Fielding-Ross' });
  });

  it('When a contractor becomes a desk tech, then the account goes and a branch is required', async () => {
    const { form, save } = setup(contractor);
    form.form.role = 'tech';
    await form.submit();
    expect(form.errors.fields.branchIds).toBe('Staff need at least one branch');
    expect(save).not.toHaveBeenCalled();

    form.form.branchIds = [4];
    await form.submit();
    expect(save).toHaveBeenCalledWith(7, { role: 'tech', accountId: null, branchIds: [4] });
  });

  it('When sign-in is turned off, then it asks first, and a "no" sends nothing', async () => {
    const { form, save } = setup(contractor);
    form.form.active = false;
    confirm.mockResolvedValueOnce(false);
    expect(await form.submit()).toBeNull();
    expect(confirm).toHaveBeenCalledTimes(1);
    expect(save).not.toHaveBeenCalled();

    confirm.mockResolvedValueOnce(true);
    await form.submit();
    expect(save).toHaveBeenCalledWith(7, { active: false });
  });
});
