import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

export const altitudeInputSchema = z.object({
  ratedInputBtuh: z.number().finite().positive(),
  elevationFt: z
    .number()
    .finite()
    .min(-1500, 'Below any inhabited ground')
    .max(15000, 'Above any rule for appliances'),
  rule: z.enum(['nfpa54', 'csa-b149']),
});
export type AltitudeInput = z.infer<typeof altitudeInputSchema>;

/**
 * NFPA 54/ANSI Z223.1: ratings hold to 2,000 ft; above, reduce 4 % per 1,000 ft of elevation above
 * sea level. CSA B149.1: 10 % from 2,000 to 4,500 ft; above 4,500 ft the rule does not say.
 * Either way the manufacturer or the authority having jurisdiction can say otherwise.
 */
export function altitudeDerate(input: AltitudeInput): {
  deratedInputBtuh: number | null;
  reductionPct: number | null;
  note: string;
} & Sourced {
  const cautions = [GAS_CAUTION];
  if (input.rule === 'nfpa54') {
    const pct = input.elevationFt <= 2000 ? 0 : (4 * input.elevationFt) / 1000;
    return {
      deratedInputBtuh: Math.round(input.ratedInputBtuh * (1 - pct / 100)),
      reductionPct: round(pct, 1),
      note:
        pct === 0
          ? 'At or below 2,000 ft the rating holds.'
          : `Reduce the input ${round(pct, 1)} % (4 % per 1,000 ft above sea level), unless the manufacturer or the authority having jurisdiction says otherwise.`,
      source: 'NFPA 54/ANSI Z223.1, high-altitude rating: 4 % per 1,000 ft above sea level over 2,000 ft.',
      cautions,
    };
  }
  const source = 'CSA B149.1, high-altitude installations: 10 % reduction from 2,000 to 4,500 ft.';
  if (input.elevationFt > 4500) {
    return {
      deratedInputBtuh: null,
      reductionPct: null,
      note: 'Above 4,500 ft this rule does not apply: follow the manufacturer’s high-altitude instructions.',
      source,
      cautions,
    };
  }
  const pct = input.elevationFt > 2000 ? 10 : 0;
  return {
    deratedInputBtuh: Math.round(input.ratedInputBtuh * (1 - pct / 100)),
    reductionPct: pct,
    note: pct === 0 ? 'At or below 2,000 ft the rating holds.' : 'Reduce the input 10 % (2,000 to 4,500 ft).',
    source,
    cautions,
  };
}
