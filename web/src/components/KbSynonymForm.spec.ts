// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { ApiError } from '@/api/http';
import { i18n } from '@/i18n';
import KbSynonymForm from './KbSynonymForm.vue';

function mountForm(save: (terms: string[]) => Promise<unknown>, initial?: string[]) {
  return mount(KbSynonymForm, {
    props: { submitLabel: 'Add the group', save, ...(initial ? { initial } : {}) },
    global: { plugins: [i18n] },
    attachTo: document.body,
  });
}

describe('KbSynonymForm', () => {
  afterEach(() => {
    document.body.innerHTML = '';
  });

  it('When the words are typed with equals signs and mixed case, then the preview and what is saved are the folded terms, and the box empties', async () => {
    const save = vi.fn(async () => undefined);
    const wrapper = mountForm(save);
    await wrapper.find('input').setValue('LP = LPG = Propane = lp');
    expect(wrapper.findAll('.synonym-terms__term').map((t) => t.text())).toEqual(['lp', 'lpg', 'propane']);
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(save).toHaveBeenCalledWith(['lp', 'lpg', 'propane']);
    expect((wrapper.find('input').element as HTMLInputElement).value).toBe('');
    expect(wrapper.emitted('saved')).toHaveLength(1);
  });

  it('When only one word is given, then the field says so and nothing is sent', async () => {
    const save = vi.fn(async () => undefined);
    const wrapper = mountForm(save);
    await wrapper.find('input').setValue('propane');
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(save).not.toHaveBeenCalled();
    expect(wrapper.find('.form-field__error').text()).toBe('Give at least two different terms');
  });

  it('When the server refuses the group, then its message shows by the field and what was typed stays', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(409, 'conflict', 'Already grouped', { terms: '“lp” is already in another group' });
    });
    const wrapper = mountForm(save, ['lp', 'gas']);
    await wrapper.find('input').setValue('lp, bottled gas');
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(wrapper.find('.form-field__error').text()).toBe('“lp” is already in another group');
    expect((wrapper.find('input').element as HTMLInputElement).value).toBe('lp, bottled gas');
    expect(wrapper.emitted('saved')).toBeUndefined();
  });
});
