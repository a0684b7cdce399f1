import { describe, expect, it } from 'vitest';
import { TYPICAL_SPEC } from '@shared/calc/gasPressure';
import { resolveGasSpec } from './gasPressureSpec';

const modelSpec = {
  staging: 'two-stage',
  inputBtuh: { high: 80000, low: 52000 },
  fuels: {
    'natural-gas': {
      inletMinInWc: 4.5,
      inletMaxInWc: 10.5,
      manifold: [
        { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
        { stage: 'low', targetInWc: 1.6, toleranceInWc: 0.2 },
      ],
      orificeDrill: 45,
    },
  },
};
const entered = { inletMinInWc: 6, inletMaxInWc: 9, manifold: [] };

describe('resolveGasSpec', () => {
  it('When common practice is chosen, then the typical spec for the fuel is used', () => {
    expect(resolveGasSpec('typical', 'propane', modelSpec, entered)).toEqual({
      spec: TYPICAL_SPEC.propane,
      specSource: 'typical',
      fallback: null,
    });
  });

  it('When a model is chosen, then its spec for the fuel is used without the orifice drill', () => {
    const resolved = resolveGasSpec('model', 'natural-gas', modelSpec, entered);
    expect(resolved.specSource).toBe('model');
    expect(resolved.spec).toEqual({
      inletMinInWc: 4.5,
      inletMaxInWc: 10.5,
      manifold: modelSpec.fuels['natural-gas'].manifold,
    });
  });

  it('When the model has no spec for this fuel, then common practice is used and the fallback is named', () => {
    const resolved = resolveGasSpec('model', 'propane', modelSpec, entered);
    expect(resolved).toEqual({
      spec: TYPICAL_SPEC.propane,
      specSource: 'typical',
      fallback: 'no-model-spec',
    });
    expect(resolveGasSpec('model', 'propane', null, entered).fallback).toBe('no-model-spec');
  });

  it('When no model is picked yet, then common practice is used and says why', () => {
    expect(resolveGasSpec('model', 'natural-gas', undefined, entered).fallback).toBe('no-model');
  });

  it('When a spec is entered, then it is used as the body spec', () => {
    expect(resolveGasSpec('entered', 'natural-gas', modelSpec, entered)).toEqual({
      spec: entered,
      specSource: 'body',
      fallback: null,
    });
  });
});
