import { describe, expect, it } from 'vitest';
import { equipmentSpecSchema, gasSpecOf } from './equipmentSpec';

const twoStage = {
  staging: 'two-stage',
  inputBtuh: { high: 80_000, low: 52_000 },
  fuels: {
    'natural-gas': {
      inletMinInWc: 4.5,
      inletMaxInWc: 10.5,
      manifold: [
        { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
        { stage: 'low', targetInWc: 1.7, toleranceInWc: 0.2 },
      ],
    },
  },
};

describe('equipment spec document', () => {
  it('When a two-stage spec is complete, then it parses and the gas check can read its natural-gas part', () => {
    expect(equipmentSpecSchema.safeParse(twoStage).success).toBe(true);
    expect(gasSpecOf(twoStage, 'natural-gas')?.manifold).toHaveLength(2);
    expect(gasSpecOf(twoStage, 'propane')).toBeNull();
  });

  it('When a modulating unit has no minimum rate or a staged unit no low-fire input, then those fields are named', () => {
    const modulating = equipmentSpecSchema.safeParse({ ...twoStage, staging: 'modulating' });
    expect(modulating.error?.issues.map((i) => i.path.join('.'))).toContain('minModulationPct');
    const noLow = equipmentSpecSchema.safeParse({ ...twoStage, inputBtuh: { high: 80_000 } });
    expect(noLow.error?.issues.map((i) => i.path.join('.'))).toContain('inputBtuh.low');
  });

  it('When the inlet range is upside down or a pressure negative, then it is refused', () => {
    const fuels = { 'natural-gas': { inletMinInWc: 11, inletMaxInWc: 5, manifold: [] } };
    expect(equipmentSpecSchema.safeParse({ ...twoStage, fuels }).success).toBe(false);
    const negative = { 'natural-gas': { inletMinInWc: -1, inletMaxInWc: 5, manifold: [] } };
    expect(equipmentSpecSchema.safeParse({ ...twoStage, fuels: negative }).success).toBe(false);
  });
});
