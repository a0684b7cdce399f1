import { computed, inject, provide, ref, watch, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import {
  CHECK_PRESSURE_UNITS,
  POWER_UNITS,
  TEMPERATURE_UNITS,
  formatForInput,
  fromBase,
  parseNumber,
  toBase,
  type AnyUnit,
  type CheckPressureUnit,
  type PowerUnit,
  type QuantityKind,
  type TemperatureUnit,
} from './checkUnits';

export interface CheckUnits {
  pressure: Ref<CheckPressureUnit>;
  temperature: Ref<TemperatureUnit>;
  power: Ref<PowerUnit>;
}

const KEY: InjectionKey<CheckUnits> = Symbol('check-units');
const STORAGE_KEY = 'lightoff.checkUnits';

function stored(): Partial<Record<keyof CheckUnits, string>> {
  try {
    return JSON.parse(localStorage.getItem(STORAGE_KEY) ?? '{}') as Partial<Record<keyof CheckUnits, string>>;
  } catch {
    return {};
  }
}

function pick<T extends string>(allowed: readonly T[], value: string | undefined): T {
  return allowed.includes(value as T) ? (value as T) : allowed[0]!;
}

/** The page's unit choice, remembered on this device, for every check form below it. */
export function provideCheckUnits(): CheckUnits {
  const saved = stored();
  const units: CheckUnits = {
    pressure: ref(pick(CHECK_PRESSURE_UNITS, saved.pressure)),
    temperature: ref(pick(TEMPERATURE_UNITS, saved.temperature)),
    power: ref(pick(POWER_UNITS, saved.power)),
  };
  watch([units.pressure, units.temperature, units.power], ([pressure, temperature, power]) => {
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify({ pressure, temperature, power }));
    } catch {
      // Private mode or full storage: the choice lasts for this visit only.
    }
  });
  provide(KEY, units);
  return units;
}

export function useCheckUnits(): CheckUnits {
  return (
    inject(KEY, null) ?? { pressure: ref('in_wc'), temperature: ref('f'), power: ref<PowerUnit>('btuh') }
  );
}

export function unitRef(kind: QuantityKind, units: CheckUnits): Ref<AnyUnit> {
  return kind === 'pressure' ? units.pressure : kind === 'power' ? units.power : units.temperature;
}

export interface Quantity {
  /** What is in the input, in the unit shown. */
  text: Ref<string>;
  unit: Ref<AnyUnit>;
  /** In the checks' unit (in. w.c., °F, Btu/h); undefined when blank, NaN when not a number. */
  value: ComputedRef<number | undefined>;
}

/**
 * One quantity field that follows the unit switch: its text is converted when the unit changes, and
 * the exact value behind it is kept, so switching back and forth never drifts (0.5 → 124.5 Pa → 0.5).
 */
export function createQuantity(kind: QuantityKind, units: CheckUnits, initialBase?: number): Quantity {
  const unit = unitRef(kind, units);
  const format = (base: number) => formatForInput(fromBase(kind, base, unit.value), unit.value);
  const text = ref(initialBase === undefined ? '' : format(initialBase));
  const shown = ref(text.value);
  let exact = initialBase;
  watch(unit, (next, prev) => {
    if (text.value !== shown.value) exact = undefined;
    const typed = parseNumber(text.value);
    if (exact === undefined && typed !== undefined && !Number.isNaN(typed)) exact = toBase(kind, typed, prev);
    if (exact !== undefined) text.value = formatForInput(fromBase(kind, exact, next), next);
    shown.value = text.value;
  });
  const value = computed(() => {
    if (exact !== undefined && text.value === shown.value) return exact;
    const typed = parseNumber(text.value);
    return typed === undefined || Number.isNaN(typed) ? typed : toBase(kind, typed, unit.value);
  });
  return { text, unit, value };
}

/** A plain number field (no unit switch): its text and parsed value. */
export function createNumber(initial = '') {
  const text = ref(initial);
  return { text, value: computed(() => parseNumber(text.value)) };
}
