// Shaping between the readings form, the API and the chat: which fields each kind asks for, the
// payload the form sends (already in the trade's units), and the card data an event message carries.
import type { Message } from '@shared/schemas/tickets';
import type { Reading, ReadingCreate, ReadingKind } from '@shared/schemas/readings';

export const READING_KIND_LIST = ['gas-pressure', 'temperature-rise', 'firing-rate', 'co-air-free'] as const;
export const MANIFOLD_STAGES = ['single', 'high', 'low'] as const;
type ManifoldStage = (typeof MANIFOLD_STAGES)[number];
export type Verdict = 'low' | 'ok' | 'high';

export interface ReadingField {
  key: string;
  /** Follows the page's unit switch; without it the field is typed in its own unit. */
  quantity?: 'pressure' | 'temperature';
  unit?: string;
}

export const READING_FIELDS: Record<ReadingKind, readonly ReadingField[]> = {
  'gas-pressure': [
    { key: 'manifold.single', quantity: 'pressure' },
    { key: 'manifold.high', quantity: 'pressure' },
    { key: 'manifold.low', quantity: 'pressure' },
    { key: 'inletStaticInWc', quantity: 'pressure' },
    { key: 'inletUnderFireInWc', quantity: 'pressure' },
  ],
  'temperature-rise': [
    { key: 'supplyF', quantity: 'temperature' },
    { key: 'returnF', quantity: 'temperature' },
  ],
  'firing-rate': [
    { key: 'dialCuFt', unit: 'cuFt' },
    { key: 'secondsPerRev', unit: 's' },
    { key: 'heatingValueBtuPerCuFt', unit: 'btuPerCuFt' },
  ],
  'co-air-free': [
    { key: 'coPpm', unit: 'ppm' },
    { key: 'o2Pct', unit: 'pct' },
  ],
};

/** Field values in the trade's units (in. w.c., °F, …); undefined when left blank. */
export type ReadingNumbers = Record<string, number | undefined>;

const defined = (entries: [string, number | undefined][]) =>
  Object.fromEntries(entries.filter(([, v]) => v !== undefined)) as Record<string, number>;

/** The body of POST /readings. Blank fields are left out so the server's defaults apply. */
export function toReadingCreate(
  kind: ReadingKind,
  numbers: ReadingNumbers,
  stage: 'high' | 'low',
): ReadingCreate {
  if (kind === 'gas-pressure') {
    const manifold = MANIFOLD_STAGES.flatMap((s) => {
      const valueInWc = numbers[`manifold.${s}`];
      return valueInWc === undefined ? [] : [{ stage: s, valueInWc }];
    });
    const inlets = defined([
      ['inletStaticInWc', numbers.inletStaticInWc],
      ['inletUnderFireInWc', numbers.inletUnderFireInWc],
    ]);
    return { kind, values: { ...inlets, manifold } };
  }
  const own = defined(READING_FIELDS[kind].map((f) => [f.key, numbers[f.key]]));
  const values = kind === 'temperature-rise' ? { ...own, stage } : own;
  // The server checks the rest; the form only shapes what was typed.
  return { kind, values } as ReadingCreate;
}

/** A stored reading back into form values, to run it again with changes. */
export function fromReading(reading: Pick<Reading, 'kind' | 'values'>): {
  numbers: ReadingNumbers;
  stage: 'high' | 'low';
} {
  const v = reading.values;
  const numbers: ReadingNumbers = {};
  for (const field of READING_FIELDS[reading.kind]) {
    const value = v[field.key];
    if (typeof value === 'number') numbers[field.key] = value;
  }
  if (reading.kind === 'gas-pressure' && Array.isArray(v.manifold)) {
    for (const m of v.manifold as { stage: ManifoldStage; valueInWc: number }[]) {
      numbers[`manifold.${m.stage}`] = m.valueInWc;
    }
  }
  return { numbers, stage: v.stage === 'low' ? 'low' : 'high' };
}

/**
 * The form field a server error is about: `values.o2Pct` → `o2Pct`; the n-th manifold entry is the
 * n-th stage that was sent. Anything else → null (shown as the form's alert).
 */
export function fieldOfError(path: string, sent: ReadingCreate): string | null {
  const parts = path.split('.');
  if (parts[0] !== 'values' || parts.length < 2) return null;
  if (parts[1] === 'manifold' && sent.kind === 'gas-pressure') {
    const index = parts[2] === undefined ? Number.NaN : Number(parts[2]);
    const stage = sent.values.manifold[index]?.stage;
    return stage ? `manifold.${stage}` : 'manifold';
  }
  const key = parts[1]!;
  return READING_FIELDS[sent.kind].some((f) => f.key === key) ? key : null;
}

export interface ReadingCard {
  kind: ReadingKind;
  verdict: Verdict | null;
  result: Record<string, unknown>;
}

/** The reading an event message carries, or null for any other message. */
export function readingCardOf(message: Pick<Message, 'kind' | 'data'>): ReadingCard | null {
  const data = message.data;
  if (message.kind !== 'event' || !data || data.type !== 'reading') return null;
  if (!READING_KIND_LIST.includes(data.kind as ReadingKind)) return null;
  if (typeof data.result !== 'object' || data.result === null) return null;
  const verdict = ['low', 'ok', 'high'].includes(data.verdict as string) ? (data.verdict as Verdict) : null;
  return { kind: data.kind as ReadingKind, verdict, result: data.result as Record<string, unknown> };
}
