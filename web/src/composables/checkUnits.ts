// The unit switches of the checks page. The shared checks work in in. w.c., °F and Btu/h; what a
// person types in another unit is converted before the check runs, and results are shown back in it.
import { convertPressure } from '@shared/calc/units';

export const CHECK_PRESSURE_UNITS = ['in_wc', 'pa', 'mbar'] as const;
export type CheckPressureUnit = (typeof CHECK_PRESSURE_UNITS)[number];
export const TEMPERATURE_UNITS = ['f', 'c'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export const POWER_UNITS = ['btuh', 'kw'] as const;
export type PowerUnit = (typeof POWER_UNITS)[number];

/** 1 kW = 3412.14 Btu/h (the international-table Btu, 1055.056 J). */
export const BTUH_PER_KW = 3412.14;

/** temperature: a reading (°F ↔ °C with the offset); temperatureDiff: a rise or a range (no offset). */
export type QuantityKind = 'pressure' | 'temperature' | 'temperatureDiff' | 'power';
export type UnitOf<K extends QuantityKind> = K extends 'pressure'
  ? CheckPressureUnit
  : K extends 'power'
    ? PowerUnit
    : TemperatureUnit;
export type AnyUnit = CheckPressureUnit | TemperatureUnit | PowerUnit;

/** From the unit shown to the unit the checks use (in. w.c., °F, Btu/h). */
export function toBase(kind: QuantityKind, value: number, unit: AnyUnit): number {
  switch (kind) {
    case 'pressure':
      return convertPressure({ value, from: unit as CheckPressureUnit, to: 'in_wc' }).value;
    case 'temperature':
      return unit === 'c' ? (value * 9) / 5 + 32 : value;
    case 'temperatureDiff':
      return unit === 'c' ? value * 1.8 : value;
    case 'power':
      return unit === 'kw' ? value * BTUH_PER_KW : value;
  }
}

/** From the checks' units back to the unit shown. */
export function fromBase(kind: QuantityKind, value: number, unit: AnyUnit): number {
  switch (kind) {
    case 'pressure':
      return convertPressure({ value, from: 'in_wc', to: unit as CheckPressureUnit }).value;
    case 'temperature':
      return unit === 'c' ? ((value - 32) * 5) / 9 : value;
    case 'temperatureDiff':
      return unit === 'c' ? value / 1.8 : value;
    case 'power':
      return unit === 'kw' ? value / BTUH_PER_KW : value;
  }
}

/** Decimal places worth showing: a gauge reads 0.01 in. w.c. or 1 Pa; a rating plate whole Btu/h. */
const PLACES: Record<AnyUnit, number> = { in_wc: 2, pa: 1, mbar: 2, f: 1, c: 1, btuh: 0, kw: 2 };

export function placesFor(unit: AnyUnit): number {
  return PLACES[unit];
}

const formatters = new Map<number, Intl.NumberFormat>();
/** A number for reading: grouped thousands, at most `places` decimals. */
export function formatNumber(value: number, places: number): string {
  let f = formatters.get(places);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { maximumFractionDigits: places });
    formatters.set(places, f);
  }
  return f.format(value);
}

/** A number to put back into an input: no grouping, one more decimal than is shown in results. */
export function formatForInput(value: number, unit: AnyUnit): string {
  return String(Number(value.toFixed(PLACES[unit] + 1)));
}

/** What was typed: blank is undefined, a comma decimal is accepted, anything else not a number is NaN. */
export function parseNumber(text: string): number | undefined {
  const trimmed = text.trim().replace(/,/g, '.');
  if (trimmed === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}
