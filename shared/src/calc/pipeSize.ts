import { z } from 'zod';
import { GAS_CAUTION, round, type Sourced } from './common';

/** Schedule 40 steel pipe: nominal size → inside diameter in inches (ASME B36.10M wall thickness). */
export const SCHEDULE_40 = [
  { nominal: '1/2', insideDiameterIn: 0.622 },
  { nominal: '3/4', insideDiameterIn: 0.824 },
  { nominal: '1', insideDiameterIn: 1.049 },
  { nominal: '1-1/4', insideDiameterIn: 1.38 },
  { nominal: '1-1/2', insideDiameterIn: 1.61 },
  { nominal: '2', insideDiameterIn: 2.067 },
  { nominal: '2-1/2', insideDiameterIn: 2.469 },
  { nominal: '3', insideDiameterIn: 3.068 },
  { nominal: '4', insideDiameterIn: 4.026 },
] as const;

/** IFGC 402.4 factors: Cr for natural gas (SG 0.60) and propane (SG 1.50). */
export const CR = { 'natural-gas': 0.6094, propane: 1.2462 } as const;
/** Heating values used when none is given: common practice (no source). */
export const TYPICAL_HEATING_VALUE = { 'natural-gas': 1000, propane: 2500 } as const;

/** IFGC section 402.4, low-pressure formula (under 1.5 psi): Q = 2313 · D^2.623 · (ΔH / (Cr · L))^0.541, in cfh. */
export function lowPressureCapacityCfh(
  insideDiameterIn: number,
  lengthFt: number,
  dropInWc: number,
  cr: number,
): number {
  return 2313 * insideDiameterIn ** 2.623 * (dropInWc / (cr * lengthFt)) ** 0.541;
}

const fuelSchema = z.enum(['natural-gas', 'propane']);
const length = z
  .number()
  .finite()
  .positive('Length must be above 0')
  .max(2000, 'Longer than any low-pressure run');

export const pipeSizeInputSchema = z
  .object({
    fuel: fuelSchema,
    lengthFt: length,
    loadBtuh: z.number().finite().positive().optional(),
    loadCfh: z.number().finite().positive().optional(),
    pressureDropInWc: z
      .number()
      .finite()
      .positive()
      .max(3, 'Low-pressure sizing uses drops up to a few in. w.c.')
      .default(0.5),
    heatingValueBtuPerCuFt: z.number().finite().min(500).max(3500).optional(),
  })
  .refine((v) => v.loadBtuh !== undefined || v.loadCfh !== undefined, {
    path: ['loadBtuh'],
    message: 'Give the load in Btu/h or cfh',
  });
export type PipeSizeInput = z.infer<typeof pipeSizeInputSchema>;

export interface PipeSizeRow {
  nominal: string;
  insideDiameterIn: number;
  capacityCfh: number;
  capacityBtuh: number;
}

const SOURCE =
  'IFGC section 402.4, low-pressure formula Q = 2313 · D^2.623 · (ΔH ÷ (Cr · L))^0.541 (Cr 0.6094 natural gas, 1.2462 propane), Schedule 40 steel, longest-length method.';

function table(
  fuel: 'natural-gas' | 'propane',
  lengthFt: number,
  drop: number,
  heatingValue: number,
): PipeSizeRow[] {
  return SCHEDULE_40.map((p) => {
    const cfh = lowPressureCapacityCfh(p.insideDiameterIn, lengthFt, drop, CR[fuel]);
    return {
      nominal: p.nominal,
      insideDiameterIn: p.insideDiameterIn,
      capacityCfh: round(cfh, 0),
      capacityBtuh: Math.round(cfh * heatingValue),
    };
  });
}

/** The smallest Schedule 40 size that carries the load over the (longest) length. */
export function pipeSize(
  input: PipeSizeInput,
): { recommended: PipeSizeRow | null; loadCfh: number; sizes: PipeSizeRow[]; note: string } & Sourced {
  const heatingValue = input.heatingValueBtuPerCuFt ?? TYPICAL_HEATING_VALUE[input.fuel];
  const loadCfh = input.loadCfh ?? input.loadBtuh! / heatingValue;
  const sizes = table(input.fuel, input.lengthFt, input.pressureDropInWc, heatingValue);
  const recommended = sizes.find((s) => s.capacityCfh >= loadCfh) ?? null;
  return {
    recommended,
    loadCfh: round(loadCfh, 1),
    sizes,
    note: recommended
      ? `${recommended.nominal} in. carries ${round(loadCfh, 1)} cfh over ${input.lengthFt} ft with a ${input.pressureDropInWc} in. w.c. drop.`
      : 'No Schedule 40 size up to 4 in. carries this load at low pressure: consider a higher pressure system.',
    source: SOURCE,
    cautions: [GAS_CAUTION],
  };
}

// A whole system: meter → sections → appliances --------------------------------------------------

export const pipeSystemInputSchema = z
  .object({
    fuel: fuelSchema,
    pressureDropInWc: z.number().finite().positive().max(3).default(0.5),
    heatingValueBtuPerCuFt: z.number().finite().min(500).max(3500).optional(),
    /** Each section runs from its parent's end (or the meter, when parent is null) to its own end. */
    sections: z
      .array(
        z.object({
          id: z.string().trim().min(1).max(20),
          parentId: z.string().trim().min(1).max(20).nullable(),
          lengthFt: length,
          applianceBtuh: z.number().finite().min(0).default(0),
        }),
      )
      .min(1)
      .max(50),
  })
  .superRefine((v, ctx) => {
    const ids = new Set(v.sections.map((s) => s.id));
    v.sections.forEach((s, i) => {
      if (s.parentId !== null && !ids.has(s.parentId)) {
        ctx.addIssue({
          code: 'custom',
          path: ['sections', i, 'parentId'],
          message: 'No section has this id',
        });
      }
    });
    if (ids.size !== v.sections.length)
      ctx.addIssue({ code: 'custom', path: ['sections'], message: 'Section ids must be unique' });
    if (!v.sections.some((s) => s.parentId === null)) {
      ctx.addIssue({ code: 'custom', path: ['sections'], message: 'One section must start at the meter' });
    }
  });
export type PipeSystemInput = z.infer<typeof pipeSystemInputSchema>;

/**
 * Longest-length method (IFGC 402.4.1): every section is sized for the gas it carries, using the
 * length from the meter to the farthest outlet.
 */
export function pipeSystem(input: PipeSystemInput) {
  const heatingValue = input.heatingValueBtuPerCuFt ?? TYPICAL_HEATING_VALUE[input.fuel];
  const children = new Map<string | null, typeof input.sections>();
  for (const s of input.sections) children.set(s.parentId, [...(children.get(s.parentId) ?? []), s]);
  const carried = new Map<string, number>();
  const seen = new Set<string>();
  const loadOf = (id: string): number => {
    if (seen.has(id) && !carried.has(id)) throw new Error(`sections form a loop at ${id}`);
    seen.add(id);
    const own = input.sections.find((s) => s.id === id)!.applianceBtuh;
    const total = own + (children.get(id) ?? []).reduce((sum, c) => sum + loadOf(c.id), 0);
    carried.set(id, total);
    return total;
  };
  const distance = (id: string): number => {
    const s = input.sections.find((x) => x.id === id)!;
    return s.lengthFt + (s.parentId ? distance(s.parentId) : 0);
  };
  for (const root of children.get(null) ?? []) loadOf(root.id);
  const longestLengthFt = Math.max(...input.sections.map((s) => distance(s.id)));
  const sections = input.sections.map((s) => {
    const result = pipeSize({
      fuel: input.fuel,
      lengthFt: longestLengthFt,
      loadBtuh: Math.max(carried.get(s.id) ?? 0, 1),
      pressureDropInWc: input.pressureDropInWc,
      heatingValueBtuPerCuFt: heatingValue,
    });
    return {
      id: s.id,
      loadBtuh: carried.get(s.id) ?? 0,
      loadCfh: result.loadCfh,
      recommended: result.recommended,
    };
  });
  return { longestLengthFt, sections, source: SOURCE, cautions: [GAS_CAUTION] };
}
