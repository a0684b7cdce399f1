import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

export const combustionAirInputSchema = z
  .object({
    appliances: z
      .array(
        z.object({ inputBtuh: z.number().finite().positive(), draft: z.enum(['natural', 'fan-assisted']) }),
      )
      .min(1, 'Add at least one appliance')
      .max(20),
    roomVolumeCuFt: z.number().finite().positive().optional(),
    method: z.enum(['standard', 'known-infiltration']).default('standard'),
    ach: z.number().finite().positive().max(10).optional(),
  })
  .refine((v) => v.method !== 'known-infiltration' || v.ach !== undefined, {
    path: ['ach'],
    message: 'Give the air changes per hour',
  });
export type CombustionAirInput = z.infer<typeof combustionAirInputSchema>;

/**
 * NFPA 54 section 9.3. Standard method: 50 ft³ per 1,000 Btu/h. Known infiltration (9.3.2.2):
 * 21 ft³/ACH per 1,000 Btu/h for other appliances, 15 ft³/ACH for fan-assisted, ACH taken at no
 * more than 0.60 (from memory). Openings: indoor 1 in² per 1,000 Btu/h each (100 in² at least);
 * outdoor 1 in² per 4,000 Btu/h each vertical, per 2,000 horizontal; one opening 1 in² per 3,000.
 */
export function combustionAir(input: CombustionAirInput) {
  const total = input.appliances.reduce((s, a) => s + a.inputBtuh, 0);
  let required: number;
  if (input.method === 'standard') {
    required = (50 * total) / 1000;
  } else {
    const ach = Math.min(input.ach!, 0.6);
    const fan = input.appliances
      .filter((a) => a.draft === 'fan-assisted')
      .reduce((s, a) => s + a.inputBtuh, 0);
    required = ((21 / ach) * (total - fan)) / 1000 + ((15 / ach) * fan) / 1000;
  }
  const result: {
    totalInputBtuh: number;
    requiredVolumeCuFt: number;
    adequate?: boolean;
    openings: {
      indoorEachIn2: number;
      outdoorVerticalEachIn2: number;
      outdoorHorizontalEachIn2: number;
      singleIn2: number;
    };
    note: string;
  } & Sourced = {
    totalInputBtuh: total,
    requiredVolumeCuFt: Math.round(required),
    openings: {
      indoorEachIn2: Math.max(100, Math.ceil(total / 1000)),
      outdoorVerticalEachIn2: Math.ceil(total / 4000),
      outdoorHorizontalEachIn2: Math.ceil(total / 2000),
      singleIn2: Math.ceil(total / 3000),
    },
    note: 'Two openings: one within 12 in. of the top and one within 12 in. of the bottom of the space. A single opening must also be at least the area of the vent connectors.',
    source: 'NFPA 54/ANSI Z223.1 section 9.3 (combustion, ventilation and dilution air).',
    cautions: [GAS_CAUTION],
  };
  if (input.roomVolumeCuFt !== undefined) {
    result.adequate = input.roomVolumeCuFt >= required;
    result.note = result.adequate
      ? `The space (${round(input.roomVolumeCuFt, 0)} ft³) is enough on its own; no openings are needed for combustion air.`
      : `The space (${round(input.roomVolumeCuFt, 0)} ft³) is smaller than ${Math.round(required)} ft³: bring air in through openings. ${result.note}`;
  }
  return result;
}
