import { TYPICAL_SPEC, type GasPressureSpec } from '@shared/calc/gasPressure';
import { gasSpecOf } from '@shared/schemas/equipmentSpec';

export type GasFuel = 'natural-gas' | 'propane';
/** Where the gas-pressure check takes its targets from. */
export const SPEC_CHOICES = ['typical', 'model', 'entered'] as const;
export type SpecChoice = (typeof SPEC_CHOICES)[number];

export interface ResolvedSpec {
  spec: GasPressureSpec;
  specSource: 'typical' | 'model' | 'body';
  /** Why common practice is used although a model was asked for. */
  fallback: 'no-model' | 'no-model-spec' | null;
}

/**
 * The spec the readings are judged against. A chosen model without a spec for this fuel falls back
 * to common practice and says so; an entered spec is used as typed (the schema checks it).
 */
export function resolveGasSpec(
  choice: SpecChoice,
  fuel: GasFuel,
  modelSpec: unknown,
  entered: GasPressureSpec,
): ResolvedSpec {
  if (choice === 'entered') return { spec: entered, specSource: 'body', fallback: null };
  if (choice === 'model') {
    if (modelSpec === undefined)
      return { spec: TYPICAL_SPEC[fuel], specSource: 'typical', fallback: 'no-model' };
    const own = gasSpecOf(modelSpec, fuel);
    if (own) {
      const { inletMinInWc, inletMaxInWc, manifold } = own;
      return { spec: { inletMinInWc, inletMaxInWc, manifold }, specSource: 'model', fallback: null };
    }
    return { spec: TYPICAL_SPEC[fuel], specSource: 'typical', fallback: 'no-model-spec' };
  }
  return { spec: TYPICAL_SPEC[fuel], specSource: 'typical', fallback: null };
}
