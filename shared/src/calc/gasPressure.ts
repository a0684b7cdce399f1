import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

export const STAGES = ['single', 'high', 'low'] as const;
export type Stage = (typeof STAGES)[number];

const inWc = (field: string) =>
  z
    .number({ message: `${field} must be a number` })
    .finite()
    .min(0, 'Cannot be negative')
    .max(60, 'Above 60 in. w.c. is not a low-pressure reading');

export const gasPressureSpecSchema = z
  .object({
    inletMinInWc: inWc('Inlet minimum'),
    inletMaxInWc: inWc('Inlet maximum'),
    manifold: z
      .array(
        z.object({
          stage: z.enum(STAGES),
          targetInWc: inWc('Target'),
          toleranceInWc: z.number().finite().min(0).max(5),
        }),
      )
      .max(3),
  })
  .refine((s) => s.inletMinInWc <= s.inletMaxInWc, {
    path: ['inletMaxInWc'],
    message: 'The maximum must not be below the minimum',
  });
export type GasPressureSpec = z.infer<typeof gasPressureSpecSchema>;

export const gasPressureInputSchema = z
  .object({
    fuel: z.enum(['natural-gas', 'propane']),
    equipmentModelId: z.number().int().positive().optional(),
    /** A knowledge-base article whose `::: spec gas-pressure` table gives the targets. */
    articleId: z.number().int().positive().optional(),
    spec: gasPressureSpecSchema.optional(),
    inletStaticInWc: inWc('Inlet static').optional(),
    inletUnderFireInWc: inWc('Inlet under fire').optional(),
    manifold: z
      .array(z.object({ stage: z.enum(STAGES), valueInWc: inWc('Manifold') }))
      .max(3)
      .optional(),
  })
  .refine(
    (v) =>
      v.inletStaticInWc !== undefined || v.inletUnderFireInWc !== undefined || (v.manifold?.length ?? 0) > 0,
    {
      path: ['manifold'],
      message: 'Enter at least one reading',
    },
  );
export type GasPressureInput = z.infer<typeof gasPressureInputSchema>;

/**
 * What is usual when neither the unit nor an article gives a spec. Inlet ranges and the high-fire
 * manifold targets are common practice (no source); low-fire targets are from memory. The unit's
 * rating plate and instructions always win.
 */
export const TYPICAL_SPEC: Record<'natural-gas' | 'propane', GasPressureSpec> = {
  'natural-gas': {
    inletMinInWc: 5,
    inletMaxInWc: 10.5,
    manifold: [
      { stage: 'single', targetInWc: 3.5, toleranceInWc: 0.3 },
      { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
      { stage: 'low', targetInWc: 1.7, toleranceInWc: 0.2 },
    ],
  },
  propane: {
    inletMinInWc: 11,
    inletMaxInWc: 13,
    manifold: [
      { stage: 'single', targetInWc: 10, toleranceInWc: 0.5 },
      { stage: 'high', targetInWc: 10, toleranceInWc: 0.5 },
      { stage: 'low', targetInWc: 4.9, toleranceInWc: 0.3 },
    ],
  },
};

export type SpecSource = 'body' | 'model' | 'article' | 'typical';

export interface GasPressureItem {
  name: 'inlet-static' | 'inlet-under-fire' | `manifold-${Stage}` | 'inlet-drop';
  valueInWc: number;
  targetInWc?: number;
  minInWc: number;
  maxInWc: number;
  verdict: 'low' | 'ok' | 'high';
  deviationInWc: number;
  adjust: 'raise' | 'lower' | null;
  note: string;
}

/** More than about 1 in. w.c. lost from static to under fire points at piping or the regulator (common practice, no source). */
export const MAX_INLET_DROP_IN_WC = 1;

const verdictOf = (v: number, min: number, max: number) => (v < min ? 'low' : v > max ? 'high' : 'ok');

export function checkGasPressure(
  input: GasPressureInput,
  spec: GasPressureSpec,
  specSource: SpecSource,
): { items: GasPressureItem[]; specSource: SpecSource } & Sourced {
  const items: GasPressureItem[] = [];
  const inlet = (name: 'inlet-static' | 'inlet-under-fire', value: number) => {
    const verdict = verdictOf(value, spec.inletMinInWc, spec.inletMaxInWc);
    const outside =
      value < spec.inletMinInWc
        ? value - spec.inletMinInWc
        : value > spec.inletMaxInWc
          ? value - spec.inletMaxInWc
          : 0;
    items.push({
      name,
      valueInWc: value,
      minInWc: spec.inletMinInWc,
      maxInWc: spec.inletMaxInWc,
      verdict,
      deviationInWc: round(outside),
      adjust: null,
      note:
        verdict === 'ok'
          ? 'Within the inlet range.'
          : verdict === 'low'
            ? 'Below the inlet minimum: check the supply regulator, the meter and the piping size before touching the appliance.'
            : 'Above the inlet maximum: check the supply regulator; the appliance valve may not hold it.',
    });
  };
  if (input.inletStaticInWc !== undefined) inlet('inlet-static', input.inletStaticInWc);
  if (input.inletUnderFireInWc !== undefined) inlet('inlet-under-fire', input.inletUnderFireInWc);
  if (input.inletStaticInWc !== undefined && input.inletUnderFireInWc !== undefined) {
    const drop = round(input.inletStaticInWc - input.inletUnderFireInWc);
    const tooMuch = drop > MAX_INLET_DROP_IN_WC;
    items.push({
      name: 'inlet-drop',
      valueInWc: drop,
      minInWc: 0,
      maxInWc: MAX_INLET_DROP_IN_WC,
      verdict: tooMuch ? 'high' : 'ok',
      deviationInWc: tooMuch ? round(drop - MAX_INLET_DROP_IN_WC) : 0,
      adjust: null,
      note: tooMuch
        ? 'The inlet pressure falls by more than about 1 in. w.c. under fire: undersized piping or a weak regulator is likely.'
        : 'The inlet holds under fire.',
    });
  }
  for (const reading of input.manifold ?? []) {
    const target = spec.manifold.find((m) => m.stage === reading.stage);
    if (!target) continue;
    const min = round(target.targetInWc - target.toleranceInWc);
    const max = round(target.targetInWc + target.toleranceInWc);
    const deviation = round(reading.valueInWc - target.targetInWc);
    const verdict = verdictOf(reading.valueInWc, min, max);
    const where =
      deviation === 0
        ? 'on target'
        : `${Math.abs(deviation)} in. w.c. ${deviation > 0 ? 'above' : 'below'} target`;
    items.push({
      name: `manifold-${reading.stage}`,
      valueInWc: reading.valueInWc,
      targetInWc: target.targetInWc,
      minInWc: min,
      maxInWc: max,
      verdict,
      deviationInWc: deviation,
      adjust: verdict === 'low' ? 'raise' : verdict === 'high' ? 'lower' : null,
      note:
        verdict === 'ok'
          ? `Within tolerance, ${where}.`
          : `Out of tolerance, ${where}: ${verdict === 'low' ? 'raise' : 'lower'} it at the gas valve's ${reading.stage === 'low' ? 'low-fire' : 'high-fire'} adjustment, per the manufacturer's instructions.`,
    });
  }
  const sourceOf = {
    body: 'The spec table entered with the readings (from the unit’s instructions or an article).',
    model: 'The unit’s spec table in the equipment catalogue.',
    article: 'The spec table of the knowledge-base article chosen.',
    typical:
      'No spec for this unit: judged against common practice (natural gas inlet 5–10.5 in. w.c., manifold 3.5 ± 0.3 at high fire; propane inlet 11–13, manifold 10 ± 0.5). Check the rating plate.',
  } as const;
  return {
    items,
    specSource,
    source: `${sourceOf[specSource]} Inlet drop over ${MAX_INLET_DROP_IN_WC} in. w.c. under fire: common practice.`,
    cautions: [GAS_CAUTION],
  };
}
