import { reactive, ref, type ComputedRef, type Ref } from 'vue';
import { useI18n } from 'vue-i18n';
import {
  readingCreateSchema,
  type Reading,
  type ReadingCreate,
  type ReadingKind,
} from '@shared/schemas/readings';
import { ApiError } from '@/api/http';
import { formatForInput, fromBase, type AnyUnit } from './checkUnits';
import { createNumber, createQuantity, type CheckUnits } from './useCheckUnits';
import {
  READING_FIELDS,
  READING_KIND_LIST,
  fieldOfError,
  fromReading,
  toReadingCreate,
  type ReadingNumbers,
} from './readingForm';

interface FieldState {
  text: Ref<string>;
  value: ComputedRef<number | undefined>;
  unit?: Ref<AnyUnit>;
}

/**
 * The "Add readings" form: one field per value of each kind, following the unit switches, checked
 * with the API's own schema before it is sent; errors (the client's or the server's) land in place.
 */
export function useReadingForm(units: CheckUnits) {
  const { t } = useI18n();
  const kind = ref<ReadingKind>('gas-pressure');
  const stage = ref<'high' | 'low'>('high');
  const fields: Record<string, FieldState> = {};
  for (const k of READING_KIND_LIST) {
    for (const f of READING_FIELDS[k])
      fields[f.key] = f.quantity ? createQuantity(f.quantity, units) : createNumber();
  }
  const errors = reactive<Record<string, string>>({});
  const alert = ref<string | null>(null);

  function clear(): void {
    for (const key of Object.keys(errors)) delete errors[key];
    alert.value = null;
  }

  function place(entries: Record<string, string>, sent: ReadingCreate): void {
    const rest: string[] = [];
    for (const [path, message] of Object.entries(entries)) {
      const key = fieldOfError(path, sent);
      if (key) errors[key] ??= message;
      else rest.push(message);
    }
    if (rest.length > 0) alert.value = rest.join(' ');
  }

  /** What to send, or null with the errors shown. */
  function payload(): ReadingCreate | null {
    clear();
    const numbers: ReadingNumbers = {};
    for (const f of READING_FIELDS[kind.value]) {
      const value = fields[f.key]!.value.value;
      if (value !== undefined && Number.isNaN(value)) errors[f.key] = t('tickets.readings.notNumber');
      else numbers[f.key] = value;
    }
    if (Object.keys(errors).length > 0) return null;
    const sent = toReadingCreate(kind.value, numbers, stage.value);
    const parsed = readingCreateSchema.safeParse(sent);
    if (parsed.success) return sent;
    const entries: Record<string, string> = {};
    for (const issue of parsed.error.issues) entries[issue.path.join('.')] ??= issue.message;
    place(entries, sent);
    return null;
  }

  function fromError(error: unknown, sent: ReadingCreate): void {
    clear();
    if (error instanceof ApiError && Object.keys(error.fields).length > 0) place(error.fields, sent);
    else alert.value = error instanceof Error ? error.message : t('errors.unknown');
  }

  /** Empty the fields of the kind shown (after a reading was posted). */
  function reset(): void {
    for (const f of READING_FIELDS[kind.value]) fields[f.key]!.text.value = '';
    clear();
  }

  /** Fill the form from a stored reading, in the units chosen now, to run it again. */
  function prefill(reading: Pick<Reading, 'kind' | 'values'>): void {
    kind.value = reading.kind;
    const { numbers, stage: s } = fromReading(reading);
    stage.value = s;
    for (const f of READING_FIELDS[reading.kind]) {
      const field = fields[f.key]!;
      const base = numbers[f.key];
      if (base === undefined) field.text.value = '';
      else if (f.quantity && field.unit) {
        field.text.value = formatForInput(fromBase(f.quantity, base, field.unit.value), field.unit.value);
      } else field.text.value = String(base);
    }
    clear();
  }

  return { kind, stage, fields, errors, alert, payload, fromError, reset, prefill, clear };
}
