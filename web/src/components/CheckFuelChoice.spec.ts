// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { i18n } from '@/i18n';
import CheckFuelChoice from './CheckFuelChoice.vue';

describe('CheckFuelChoice', () => {
  it('When propane is picked, then the form hears "propane"; the group is labelled as the fuel', async () => {
    const wrapper = mount(CheckFuelChoice, {
      props: { modelValue: 'natural-gas' },
      global: { plugins: [i18n] },
    });
    expect(wrapper.find('legend').text()).toBe('Fuel');
    const radios = wrapper.findAll('input[type="radio"]');
    expect(radios).toHaveLength(2);
    await radios[1]!.setValue(true);
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual(['propane']);
  });
});
