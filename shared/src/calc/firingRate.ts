import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

export const firingRateInputSchema = z.object({
  dialCuFt: z.number().finite().positive('The test dial size must be above 0'),
  secondsPerRev: z.number().finite().positive('Time one full turn of the dial, in seconds'),
  heatingValueBtuPerCuFt: z
    .number()
    .finite()
    .min(500, 'Too low for fuel gas')
    .max(3500, 'Too high for fuel gas'),
  ratedInputBtuh: z.number().finite().positive().optional(),
});
export type FiringRateInput = z.infer<typeof firingRateInputSchema>;

/** Within ±5 % of the rating counts as on rate here: common practice (no source); the instructions win. */
export const FIRING_TOLERANCE_PCT = 5;

/** Clocking the meter: cfh = dial ft³ × 3600 / seconds per turn; input = cfh × heating value. */
export function firingRate(input: FiringRateInput) {
  const cfh = (input.dialCuFt * 3600) / input.secondsPerRev;
  const inputBtuh = cfh * input.heatingValueBtuPerCuFt;
  const result: {
    cfh: number;
    inputBtuh: number;
    percentOfRated?: number;
    verdict?: 'low' | 'ok' | 'high';
  } & Sourced = {
    cfh: round(cfh, 1),
    inputBtuh: Math.round(inputBtuh),
    source:
      'Meter timing: cfh = test-dial ft³ × 3600 ÷ seconds per revolution, input = cfh × the supplier’s heating value (NFPA 54 annex, meter-timing method). Other appliances on the meter must be off.',
    cautions: [GAS_CAUTION],
  };
  if (input.ratedInputBtuh) {
    const pct = (inputBtuh / input.ratedInputBtuh) * 100;
    result.percentOfRated = round(pct, 1);
    result.verdict =
      pct < 100 - FIRING_TOLERANCE_PCT ? 'low' : pct > 100 + FIRING_TOLERANCE_PCT ? 'high' : 'ok';
  }
  return result;
}
