import { describe, expect, it } from 'vitest';
import { coAirFreeInputSchema } from '@shared/calc/coAirFree';
import { gasPressureInputSchema } from '@shared/calc/gasPressure';
import { fieldErrors } from './useInstantCheck';

const NUMBER = 'Enter a number';

describe('fieldErrors', () => {
  it('When a number is missing or not a number, then the field says to enter a number', () => {
    const parsed = coAirFreeInputSchema.safeParse({ coPpm: Number.NaN });
    expect(parsed.success).toBe(false);
    expect(fieldErrors(parsed.error!.issues, NUMBER)).toEqual({ coPpm: NUMBER, o2Pct: NUMBER });
  });

  it('When the schema rejects a value, then its own message lands on the field path', () => {
    const parsed = gasPressureInputSchema.safeParse({
      fuel: 'natural-gas',
      manifold: [{ stage: 'high', valueInWc: -1 }],
    });
    expect(fieldErrors(parsed.error!.issues, NUMBER)).toEqual({
      'manifold.0.valueInWc': 'Cannot be negative',
    });
  });

  it('When there is no reading at all, then the form-level message sits on "manifold"', () => {
    const parsed = gasPressureInputSchema.safeParse({ fuel: 'natural-gas' });
    expect(fieldErrors(parsed.error!.issues, NUMBER)).toEqual({ manifold: 'Enter at least one reading' });
  });
});
