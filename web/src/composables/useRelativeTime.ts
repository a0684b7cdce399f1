import { useI18n } from 'vue-i18n';
import { useNow } from './useNow';

const UNITS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['year', 365 * 24 * 3600],
  ['month', 30 * 24 * 3600],
  ['week', 7 * 24 * 3600],
  ['day', 24 * 3600],
  ['hour', 3600],
  ['minute', 60],
];

/** "12 minutes ago", "in 3 hours", "yesterday", "now": the largest unit that fits. */
export function formatRelative(value: Date, now: Date, locale: string): string {
  const format = new Intl.RelativeTimeFormat(locale, { numeric: 'auto', style: 'long' });
  const seconds = Math.round((value.getTime() - now.getTime()) / 1000);
  const abs = Math.abs(seconds);
  for (const [unit, size] of UNITS) {
    if (abs >= size) return format.format(Math.trunc(seconds / size), unit);
  }
  return format.format(0, 'second');
}

/** The exact time, for the hover text: "Mar 4, 2026, 9:41 AM". */
export function formatExact(value: Date, locale: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(value);
}

/** Relative and exact renderings of a time, kept fresh and in the current locale. */
export function useRelativeTime() {
  const { locale } = useI18n();
  const now = useNow();
  return {
    relative: (value: Date) => formatRelative(value, now.value, locale.value),
    exact: (value: Date) => formatExact(value, locale.value),
  };
}
