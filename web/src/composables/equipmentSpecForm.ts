// The spec editor's form: every field as typed (strings), to and from the spec table the schema checks.
import { equipmentSpecSchema, type EquipmentSpec } from '@shared/schemas/equipmentSpec';
import { parseNumber } from './checkUnits';

export const SPEC_FUELS = ['natural-gas', 'propane'] as const;
export type SpecFuel = (typeof SPEC_FUELS)[number];
export type SpecStage = 'single' | 'high' | 'low';
export type Staging = EquipmentSpec['staging'];

export interface FuelForm {
  enabled: boolean;
  inletMin: string;
  inletMax: string;
  stages: Record<SpecStage, { target: string; tolerance: string }>;
  orificeDrill: number | null;
}

export interface SpecForm {
  staging: Staging;
  minModulationPct: string;
  inputHigh: string;
  inputLow: string;
  output: string;
  afue: string;
  riseMin: string;
  riseMax: string;
  fuels: Record<SpecFuel, FuelForm>;
  notes: string;
}

/** Manifold taps by staging: a modulating valve is set at its maximum and minimum rate. */
export function stagesFor(staging: Staging): SpecStage[] {
  return staging === 'single' ? ['single'] : ['high', 'low'];
}

const text = (n: number | undefined) => (n === undefined ? '' : String(n));
const num = (s: string) => parseNumber(s);

function emptyFuel(): FuelForm {
  const stage = () => ({ target: '', tolerance: '' });
  return {
    enabled: false,
    inletMin: '',
    inletMax: '',
    stages: { single: stage(), high: stage(), low: stage() },
    orificeDrill: null,
  };
}

/** The form for a saved spec; an empty form when the model has none (or it does not read as one). */
export function toForm(spec: unknown): SpecForm {
  const form: SpecForm = {
    staging: 'single',
    minModulationPct: '',
    inputHigh: '',
    inputLow: '',
    output: '',
    afue: '',
    riseMin: '',
    riseMax: '',
    fuels: { 'natural-gas': emptyFuel(), propane: emptyFuel() },
    notes: '',
  };
  const parsed = equipmentSpecSchema.safeParse(spec);
  if (!parsed.success) return form;
  const s = parsed.data;
  Object.assign(form, {
    staging: s.staging,
    minModulationPct: text(s.minModulationPct),
    inputHigh: text(s.inputBtuh.high),
    inputLow: text(s.inputBtuh.low),
    output: text(s.outputBtuh),
    afue: text(s.afuePct),
    riseMin: text(s.riseRangeF?.min),
    riseMax: text(s.riseRangeF?.max),
    notes: s.notes ?? '',
  });
  for (const fuel of SPEC_FUELS) {
    const f = s.fuels[fuel];
    if (!f) continue;
    const target = form.fuels[fuel];
    target.enabled = true;
    target.inletMin = text(f.inletMinInWc);
    target.inletMax = text(f.inletMaxInWc);
    target.orificeDrill = f.orificeDrill ?? null;
    for (const m of f.manifold)
      target.stages[m.stage] = { target: text(m.targetInWc), tolerance: text(m.toleranceInWc) };
  }
  return form;
}

/** What the form would save, and which stage each manifold index stands for (to place errors). */
export function fromForm(form: SpecForm): { spec: unknown; stageAt: Record<SpecFuel, SpecStage[]> } {
  const stageAt: Record<SpecFuel, SpecStage[]> = { 'natural-gas': [], propane: [] };
  const fuels: Record<string, unknown> = {};
  for (const fuel of SPEC_FUELS) {
    const f = form.fuels[fuel];
    if (!f.enabled) continue;
    stageAt[fuel] = stagesFor(form.staging).filter((st) => f.stages[st].target.trim() !== '');
    fuels[fuel] = {
      inletMinInWc: num(f.inletMin),
      inletMaxInWc: num(f.inletMax),
      manifold: stageAt[fuel].map((stage) => ({
        stage,
        targetInWc: num(f.stages[stage].target),
        toleranceInWc: num(f.stages[stage].tolerance),
      })),
      ...(f.orificeDrill === null ? {} : { orificeDrill: f.orificeDrill }),
    };
  }
  const riseGiven = form.riseMin.trim() !== '' || form.riseMax.trim() !== '';
  const spec = {
    staging: form.staging,
    minModulationPct: form.staging === 'modulating' ? num(form.minModulationPct) : undefined,
    inputBtuh: { high: num(form.inputHigh), low: form.staging === 'single' ? undefined : num(form.inputLow) },
    outputBtuh: num(form.output),
    afuePct: num(form.afue),
    riseRangeF: riseGiven ? { min: num(form.riseMin), max: num(form.riseMax) } : undefined,
    fuels,
    notes: form.notes.trim() === '' ? undefined : form.notes.trim(),
  };
  return { spec, stageAt };
}

/** A schema or server path ("spec.fuels.propane.manifold.1.targetInWc") as the form's field key. */
export function fieldKey(path: string, stageAt: Record<SpecFuel, SpecStage[]>): string {
  const parts = path.split('.');
  if (parts[0] === 'spec') parts.shift();
  if (parts[0] === 'fuels' && parts[2] === 'manifold' && parts.length > 3) {
    const stage = stageAt[parts[1] as SpecFuel]?.[Number(parts[3])];
    if (stage) parts[3] = stage;
  }
  return parts.join('.');
}
