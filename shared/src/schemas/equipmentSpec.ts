import { z } from 'zod';

/**
 * An equipment model's spec table: what the rating plate and the installation instructions give,
 * as data the checks can read. Pressures in in. w.c., inputs in Btu/h, temperatures in °F.
 */
const pressure = z.number().finite().min(0, 'Cannot be negative').max(60, 'Above low-pressure range');

export const SPEC_STAGINGS = ['single', 'two-stage', 'modulating'] as const;

const manifoldTargetSchema = z.object({
  stage: z.enum(['single', 'high', 'low']),
  targetInWc: pressure,
  toleranceInWc: z.number().finite().min(0).max(5),
});

const fuelSpecSchema = z
  .object({
    inletMinInWc: pressure,
    inletMaxInWc: pressure,
    // Empty for units without a manifold tap (premix boilers, some tankless heaters).
    manifold: z.array(manifoldTargetSchema).max(3),
    orificeDrill: z.number().int().min(1).max(80).optional(),
  })
  .refine((f) => f.inletMinInWc <= f.inletMaxInWc, {
    path: ['inletMaxInWc'],
    message: 'The maximum must not be below the minimum',
  });

export const equipmentSpecSchema = z
  .object({
    staging: z.enum(SPEC_STAGINGS),
    /** Lowest firing rate of a modulating unit, as % of the maximum. */
    minModulationPct: z.number().finite().min(5).max(100).optional(),
    inputBtuh: z.object({
      high: z.number().int().positive(),
      low: z.number().int().positive().optional(),
    }),
    outputBtuh: z.number().int().positive().optional(),
    afuePct: z.number().finite().min(50).max(100).optional(),
    riseRangeF: z
      .object({ min: z.number().finite().min(0).max(150), max: z.number().finite().min(0).max(150) })
      .refine((r) => r.min <= r.max, { path: ['max'], message: 'The maximum must not be below the minimum' })
      .optional(),
    fuels: z.object({
      'natural-gas': fuelSpecSchema.optional(),
      propane: fuelSpecSchema.optional(),
    }),
    notes: z.string().trim().max(2000).optional(),
  })
  .superRefine((s, ctx) => {
    if (s.staging === 'modulating' && s.minModulationPct === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['minModulationPct'],
        message: 'A modulating unit needs its minimum firing rate',
      });
    }
    if (s.staging !== 'single' && s.inputBtuh.low === undefined) {
      ctx.addIssue({ code: 'custom', path: ['inputBtuh', 'low'], message: 'Give the low-fire input' });
    }
    if (s.inputBtuh.low !== undefined && s.inputBtuh.low > s.inputBtuh.high) {
      ctx.addIssue({
        code: 'custom',
        path: ['inputBtuh', 'low'],
        message: 'Low fire cannot be above high fire',
      });
    }
  });
export type EquipmentSpec = z.infer<typeof equipmentSpecSchema>;
export type EquipmentFuelSpec = z.infer<typeof fuelSpecSchema>;

export const equipmentSpecUpdateSchema = z.object({ spec: equipmentSpecSchema.nullable() });

/** The part of a unit's spec that the gas-pressure check reads, for one fuel; null when absent. */
export function gasSpecOf(spec: unknown, fuel: 'natural-gas' | 'propane'): EquipmentFuelSpec | null {
  const parsed = equipmentSpecSchema.safeParse(spec);
  return parsed.success ? (parsed.data.fuels[fuel] ?? null) : null;
}
