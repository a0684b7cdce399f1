import { z } from 'zod';
import { STAGES } from '../calc/gasPressure';

/**
 * What a contractor measured on the job, by kind. Values are in the trade's units (in. w.c., °F,
 * ft³ and seconds, ppm and %); the web app converts from whatever unit the gauge showed.
 */
const inWc = z.number().finite().min(0, 'Cannot be negative').max(60, 'Above low-pressure range');

export const readingValuesSchemas = {
  'gas-pressure': z
    .object({
      inletStaticInWc: inWc.optional(),
      inletUnderFireInWc: inWc.optional(),
      manifold: z
        .array(z.object({ stage: z.enum(STAGES), valueInWc: inWc }))
        .max(3)
        .default([]),
    })
    .refine(
      (v) => v.inletStaticInWc !== undefined || v.inletUnderFireInWc !== undefined || v.manifold.length > 0,
      {
        path: ['manifold'],
        message: 'Enter at least one reading',
      },
    ),
  'temperature-rise': z
    .object({
      supplyF: z.number().finite().min(-40).max(250),
      returnF: z.number().finite().min(-40).max(150),
      stage: z.enum(['high', 'low']).default('high'),
    })
    .refine((v) => v.supplyF > v.returnF, {
      path: ['supplyF'],
      message: 'The supply must be warmer than the return in heating',
    }),
  'firing-rate': z.object({
    dialCuFt: z.number().finite().positive(),
    secondsPerRev: z.number().finite().positive(),
    heatingValueBtuPerCuFt: z.number().finite().min(500).max(3500).default(1000),
  }),
  'co-air-free': z.object({
    coPpm: z.number().finite().min(0).max(100000),
    o2Pct: z.number().finite().min(0).lt(20.9, 'Must be below 20.9 % (that is fresh air)'),
  }),
} as const;
export const READING_KINDS = Object.keys(readingValuesSchemas) as (keyof typeof readingValuesSchemas)[];
export type ReadingKind = keyof typeof readingValuesSchemas;

export const readingCreateSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('gas-pressure'), values: readingValuesSchemas['gas-pressure'] }),
  z.object({ kind: z.literal('temperature-rise'), values: readingValuesSchemas['temperature-rise'] }),
  z.object({ kind: z.literal('firing-rate'), values: readingValuesSchemas['firing-rate'] }),
  z.object({ kind: z.literal('co-air-free'), values: readingValuesSchemas['co-air-free'] }),
]);
export type ReadingCreate = z.infer<typeof readingCreateSchema>;

export const readingSchema = z.object({
  id: z.number().int(),
  ticketId: z.number().int(),
  kind: z.enum(READING_KINDS as [ReadingKind, ...ReadingKind[]]),
  values: z.record(z.string(), z.unknown()),
  /** The check's result (the same shape as POST /api/checks/<kind> returns), with its source and cautions. */
  result: z.record(z.string(), z.unknown()),
  /** low | ok | high over the whole reading: the worst of its items. */
  verdict: z.enum(['low', 'ok', 'high']).nullable(),
  author: z.object({ id: z.number().int(), name: z.string(), role: z.string() }),
  messageId: z.number().int().nullable(),
  createdAt: z.string(),
});
export type Reading = z.infer<typeof readingSchema>;
