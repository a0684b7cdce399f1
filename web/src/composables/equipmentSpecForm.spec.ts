import { describe, expect, it } from 'vitest';
import { equipmentSpecSchema } from '@shared/schemas/equipmentSpec';
import { fieldKey, fromForm, toForm } from './equipmentSpecForm';

// An invented demo unit.
const saved = {
  staging: 'two-stage',
  inputBtuh: { high: 80000, low: 52000 },
  outputBtuh: 77600,
  afuePct: 96,
  riseRangeF: { min: 35, max: 65 },
  fuels: {
    'natural-gas': {
      inletMinInWc: 4.5,
      inletMaxInWc: 10.5,
      manifold: [
        { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
        { stage: 'low', targetInWc: 1.7, toleranceInWc: 0.2 },
      ],
      orificeDrill: 45,
    },
  },
  notes: 'Set low fire first.',
};

describe('the spec editor form', () => {
  it('When a saved spec is loaded and saved unchanged, then the same spec comes back', () => {
    const { spec } = fromForm(toForm(saved));
    expect(equipmentSpecSchema.parse(spec)).toEqual(saved);
  });

  it('When the model has no spec, then the form is empty and single-stage', () => {
    const form = toForm(null);
    expect(form.staging).toBe('single');
    expect(form.inputHigh).toBe('');
    expect(form.fuels.propane.enabled).toBe(false);
  });

  it('When low fire is above high fire, then the error lands on the low-fire input', () => {
    const form = toForm(saved);
    form.inputLow = '90000';
    const parsed = equipmentSpecSchema.safeParse(fromForm(form).spec);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.path.join('.'))).toEqual(['inputBtuh.low']);
  });

  it('When a manifold target is wrong, then its index is turned back into the stage', () => {
    const form = toForm(saved);
    form.fuels['natural-gas'].stages.high.target = '';
    form.fuels['natural-gas'].stages.low.target = '-1';
    const { spec, stageAt } = fromForm(form);
    const issue = equipmentSpecSchema.safeParse(spec).error!.issues[0]!;
    expect(fieldKey(issue.path.join('.'), stageAt)).toBe('fuels.natural-gas.manifold.low.targetInWc');
    expect(fieldKey('spec.inputBtuh.low', stageAt)).toBe('inputBtuh.low');
  });

  it('When the unit is single-stage, then no low-fire input or modulation is sent', () => {
    const form = toForm(saved);
    form.staging = 'single';
    form.inputLow = '52000';
    form.minModulationPct = '40';
    const { spec } = fromForm(form) as { spec: { inputBtuh: { low?: number }; minModulationPct?: number } };
    expect(spec.inputBtuh.low).toBeUndefined();
    expect(spec.minModulationPct).toBeUndefined();
  });
});
