import { reactive, ref } from 'vue';
import type { ZodType, z } from 'zod';
import { useI18n } from 'vue-i18n';
import { ApiError } from '@/api/http';

/**
 * Errors of one form: a message per field (shown under that field) and one alert for the rest.
 * Client checks (the shared zod schemas) and server answers land in the same place.
 */
export function useFormErrors(knownFields: readonly string[]) {
  const { t } = useI18n();
  const fields = reactive<Record<string, string>>({});
  const alert = ref<string | null>(null);
  const known = new Set(knownFields);

  function clear(): void {
    for (const key of Object.keys(fields)) delete fields[key];
    alert.value = null;
  }

  function set(entries: Record<string, string>): void {
    const rest: string[] = [];
    for (const [path, message] of Object.entries(entries)) {
      const key = path.split('.')[0] ?? path;
      if (known.has(key)) fields[key] ??= message;
      else rest.push(message);
    }
    if (rest.length > 0) alert.value = rest.join(' ');
  }

  /** Parse with the schema; on failure show its messages and return null. */
  function validate<S extends ZodType>(schema: S, value: unknown): z.output<S> | null {
    clear();
    const result = schema.safeParse(value);
    if (result.success) return result.data;
    const entries: Record<string, string> = {};
    for (const issue of result.error.issues) entries[issue.path.join('.')] ??= issue.message;
    set(entries);
    return null;
  }

  /** Show what the server said: field messages in place, anything else as the alert. */
  function fromError(error: unknown): void {
    clear();
    if (error instanceof ApiError) {
      if (Object.keys(error.fields).length > 0) set(error.fields);
      else alert.value = error.message;
    } else {
      alert.value = t('errors.unknown');
    }
  }

  return { fields, alert, clear, set, validate, fromError };
}
