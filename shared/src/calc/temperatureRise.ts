import { z } from 'zod';
import { ESTIMATE_CAUTION, round, type Sourced } from './common';

/** 0.075 lb/ft³ × 60 min/h × 0.24 Btu/lb·°F for standard air. */
export const SENSIBLE_HEAT_FACTOR = 1.08;

export const temperatureRiseInputSchema = z
  .object({
    outputBtuh: z.number().finite().positive().optional(),
    inputBtuh: z.number().finite().positive().optional(),
    efficiencyPct: z
      .number()
      .finite()
      .min(50, 'Below any furnace')
      .max(100, 'Cannot be over 100 %')
      .optional(),
    supplyF: z.number().finite().min(-40).max(250).optional(),
    returnF: z.number().finite().min(-40).max(150).optional(),
    airflowCfm: z.number().finite().positive().max(20000).optional(),
    riseMinF: z.number().finite().min(0).max(150).optional(),
    riseMaxF: z.number().finite().min(0).max(150).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.outputBtuh === undefined && (v.inputBtuh === undefined || v.efficiencyPct === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['outputBtuh'],
        message: 'Give the output, or the input and the efficiency',
      });
    }
    const temps = v.supplyF !== undefined && v.returnF !== undefined;
    if (!temps && v.airflowCfm === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['supplyF'],
        message: 'Give supply and return temperatures, or the airflow',
      });
    }
    if (temps && v.supplyF! - v.returnF! <= 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['supplyF'],
        message: 'The supply must be warmer than the return in heating',
      });
    }
    if (v.riseMinF !== undefined && v.riseMaxF !== undefined && v.riseMinF > v.riseMaxF) {
      ctx.addIssue({
        code: 'custom',
        path: ['riseMaxF'],
        message: 'The maximum must not be below the minimum',
      });
    }
  });
export type TemperatureRiseInput = z.infer<typeof temperatureRiseInputSchema>;

/** Q = 1.08 × cfm × ΔT: the rise from temperatures gives the airflow, or the airflow gives the rise. */
export function temperatureRise(input: TemperatureRiseInput) {
  const output = input.outputBtuh ?? input.inputBtuh! * (input.efficiencyPct! / 100);
  const measured = input.supplyF !== undefined && input.returnF !== undefined;
  const riseF = measured
    ? input.supplyF! - input.returnF!
    : output / (SENSIBLE_HEAT_FACTOR * input.airflowCfm!);
  const airflowCfm = measured ? output / (SENSIBLE_HEAT_FACTOR * riseF) : input.airflowCfm!;
  const result: {
    riseF: number;
    airflowCfm: number;
    outputBtuh: number;
    verdict?: 'low' | 'ok' | 'high';
    note?: string;
  } & Sourced = {
    riseF: round(riseF, 1),
    airflowCfm: Math.round(airflowCfm),
    outputBtuh: Math.round(output),
    source: 'Sensible heat of standard air: Q = 1.08 × cfm × ΔT (0.075 lb/ft³ × 60 min/h × 0.24 Btu/lb·°F).',
    cautions: [ESTIMATE_CAUTION],
  };
  if (input.riseMinF !== undefined && input.riseMaxF !== undefined) {
    result.verdict = riseF < input.riseMinF ? 'low' : riseF > input.riseMaxF ? 'high' : 'ok';
    result.note =
      result.verdict === 'high'
        ? 'Rise above the rated range: too little air (filter, coil, ducts, blower speed). It can overheat the heat exchanger.'
        : result.verdict === 'low'
          ? 'Rise below the rated range: too much air or the unit under-fired; it risks condensing in a non-condensing heat exchanger.'
          : 'Within the rated rise range.';
  }
  return result;
}
