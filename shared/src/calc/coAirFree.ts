import { z } from 'zod';
import { GAS_CAUTION, type Sourced } from './common';

export const coAirFreeInputSchema = z.object({
  coPpm: z.number().finite().min(0, 'Cannot be negative').max(100000),
  o2Pct: z
    .number()
    .finite()
    .min(0, 'Cannot be negative')
    .lt(20.9, 'Must be below 20.9 % (that is fresh air)'),
});
export type CoAirFreeInput = z.infer<typeof coAirFreeInputSchema>;

/** CO corrected to zero excess air: CO × 20.9 ÷ (20.9 − O₂). */
export function coAirFree(input: CoAirFreeInput): { coAirFreePpm: number } & Sourced {
  return {
    coAirFreePpm: Math.round((input.coPpm * 20.9) / (20.9 - input.o2Pct)),
    source:
      'Air-free CO = measured CO × 20.9 ÷ (20.9 − measured O₂ %), the correction flue-gas analysers use.',
    cautions: [GAS_CAUTION],
  };
}
