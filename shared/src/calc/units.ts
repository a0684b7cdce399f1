import { z } from 'zod';
import { ESTIMATE_CAUTION, round, type Sourced } from './common';

/**
 * Pascals per unit. The inch and millimetre of water are the conventional units of NIST SP 811
 * (2008), appendix B.8: 1 in. H2O (conventional) = 249.0889 Pa (from 1 in. × 9.80665 m/s² ×
 * 1000 kg/m³ = 249.08891 Pa); 1 mm H2O (conventional) = 9.80665 Pa; 1 psi = 6894.757 Pa.
 */
export const PASCALS_PER_UNIT = {
  in_wc: 249.08891,
  mm_wc: 9.80665,
  pa: 1,
  kpa: 1000,
  mbar: 100,
  psi: 6894.757293168,
  oz_in2: 6894.757293168 / 16,
} as const;

export const PRESSURE_UNITS = Object.keys(PASCALS_PER_UNIT) as (keyof typeof PASCALS_PER_UNIT)[];
export type PressureUnit = keyof typeof PASCALS_PER_UNIT;
export const pressureUnitSchema = z.enum(PRESSURE_UNITS as [PressureUnit, ...PressureUnit[]]);

export const convertInputSchema = z.object({
  value: z.number().finite(),
  from: pressureUnitSchema,
  to: pressureUnitSchema,
});
export type ConvertInput = z.infer<typeof convertInputSchema>;

export const CONVERT_SOURCE =
  'NIST SP 811 (2008), appendix B.8: inch of water (conventional) = 249.0889 Pa, millimetre of water (conventional) = 9.80665 Pa, psi = 6894.757 Pa';

export function convertPressure(input: ConvertInput): { value: number } & Sourced {
  const pa = input.value * PASCALS_PER_UNIT[input.from];
  return { value: pa / PASCALS_PER_UNIT[input.to], source: CONVERT_SOURCE, cautions: [ESTIMATE_CAUTION] };
}

/** Rounded for display: 4 significant figures is past what any gauge on a job site reads. */
export const displayPressure = (value: number) => round(value, value !== 0 && Math.abs(value) < 1 ? 4 : 2);
