import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

/**
 * Number-drill diameters in inches, #1 to #80 (the wire-gauge drill series of ASME B94.11M),
 * from memory.
 */
export const NUMBER_DRILLS: readonly number[] = [
  0.228, 0.221, 0.213, 0.209, 0.2055, 0.204, 0.201, 0.199, 0.196, 0.1935, 0.191, 0.189, 0.185, 0.182, 0.18,
  0.177, 0.173, 0.1695, 0.166, 0.161, 0.159, 0.157, 0.154, 0.152, 0.1495, 0.147, 0.144, 0.1405, 0.136, 0.1285,
  0.12, 0.116, 0.113, 0.111, 0.11, 0.1065, 0.104, 0.1015, 0.0995, 0.098, 0.096, 0.0935, 0.089, 0.086, 0.082,
  0.081, 0.0785, 0.076, 0.073, 0.07, 0.067, 0.0635, 0.0595, 0.055, 0.052, 0.0465, 0.043, 0.042, 0.041, 0.04,
  0.039, 0.038, 0.037, 0.036, 0.035, 0.033, 0.032, 0.031, 0.0292, 0.028, 0.026, 0.025, 0.024, 0.0225, 0.021,
  0.02, 0.018, 0.016, 0.0145, 0.0135,
];

export const orificeInputSchema = z
  .object({
    drill: z.number().int().min(1, 'Drills run #1 to #80').max(80, 'Drills run #1 to #80').optional(),
    diameterIn: z.number().finite().positive().max(0.5).optional(),
    manifoldInWc: z.number().finite().positive().max(15),
    specificGravity: z.number().finite().min(0.4).max(2.2),
    dischargeCoefficient: z.number().finite().min(0.5).max(1).default(0.9),
    heatingValueBtuPerCuFt: z.number().finite().min(500).max(3500).optional(),
  })
  .refine((v) => (v.drill === undefined) !== (v.diameterIn === undefined), {
    path: ['drill'],
    message: 'Give a drill number or a diameter',
  });
export type OrificeInput = z.infer<typeof orificeInputSchema>;

/** Q = 1658.5 · A · Cd · √(h / G): cfh through one orifice (A in in², h in in. w.c.). */
export function orificeFlow(
  input: OrificeInput,
): { diameterIn: number; cfh: number; btuh: number } & Sourced {
  const d = input.diameterIn ?? NUMBER_DRILLS[input.drill! - 1]!;
  const area = (Math.PI / 4) * d * d;
  const cfh =
    1658.5 * area * input.dischargeCoefficient * Math.sqrt(input.manifoldInWc / input.specificGravity);
  // Natural gas is lighter than air, propane heavier: the usual heating values for each (common practice).
  const heatingValue = input.heatingValueBtuPerCuFt ?? (input.specificGravity < 1 ? 1000 : 2500);
  return {
    diameterIn: d,
    cfh: round(cfh, 2),
    btuh: Math.round(cfh * heatingValue),
    source:
      'Orifice flow Q = 1658.5 × A × Cd × √(h ÷ G) (A in in², h in in. w.c.; from memory); number-drill sizes from memory.',
    cautions: [GAS_CAUTION],
  };
}
