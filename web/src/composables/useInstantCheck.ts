import { computed, ref, watch } from 'vue';
import type { ZodType, z } from 'zod';
import { useI18n } from 'vue-i18n';

export interface CheckIssue {
  path: PropertyKey[];
  message: string;
  code: string;
  expected?: unknown;
}

/** Zod issues as one message per field path ("manifold.1.valueInWc"); a missing or typo'd number reads plainly. */
export function fieldErrors(issues: readonly CheckIssue[], numberMessage: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.');
    const notANumber = issue.code === 'invalid_type' && issue.expected === 'number';
    out[key] ??= notANumber ? numberMessage : issue.message;
  }
  return out;
}

/**
 * A check run in the browser as the person types: the input is parsed with the check's own zod
 * schema and the shared function runs on it, with no round trip (so it works offline too). Errors
 * show once something has been typed, not on an empty form.
 */
export function useInstantCheck<S extends ZodType, R>(
  schema: S,
  input: () => unknown,
  run: (parsed: z.output<S>) => R,
  extraErrors: () => Record<string, string> = () => ({}),
) {
  const { t } = useI18n();
  const touched = ref(false);
  watch(input, () => (touched.value = true));

  const outcome = computed((): { result: R | null; errors: Record<string, string> } => {
    const extra = extraErrors();
    const parsed = schema.safeParse(input());
    if (!parsed.success) {
      return {
        result: null,
        errors: { ...fieldErrors(parsed.error.issues, t('checks.errors.number')), ...extra },
      };
    }
    if (Object.keys(extra).length > 0) return { result: null, errors: extra };
    return { result: run(parsed.data), errors: {} };
  });

  return {
    result: computed(() => outcome.value.result),
    errors: computed(() => (touched.value ? outcome.value.errors : {})),
    touched,
  };
}
