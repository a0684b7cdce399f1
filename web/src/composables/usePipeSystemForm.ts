import { effectScope, ref, shallowRef, type EffectScope } from 'vue';
import { useI18n } from 'vue-i18n';
import { pipeSystem, pipeSystemInputSchema } from '@shared/calc/pipeSize';
import { sectionsInLoops } from './pipeLoops';
import { createNumber, createQuantity, useCheckUnits, type Quantity } from './useCheckUnits';
import { useInstantCheck } from './useInstantCheck';

export interface SectionRow {
  key: number;
  id: string;
  parentId: string | null;
  length: ReturnType<typeof createNumber>;
  appliance: Quantity;
  scope: EffectScope;
}

/** The whole-system pipe sizing form: sections from the meter out, each with its length and load. */
export function usePipeSystemForm() {
  const { t } = useI18n();
  const units = useCheckUnits();
  const fuel = ref<'natural-gas' | 'propane'>('natural-gas');
  const drop = createQuantity('pressure', units, 0.5);
  const heatingValue = createNumber();
  let nextKey = 0;

  function makeRow(id: string, parentId: string | null): SectionRow {
    // Each row's unit-following fields live in their own scope, stopped when the row is removed.
    const scope = effectScope();
    const fields = scope.run(() => ({ length: createNumber(), appliance: createQuantity('power', units) }))!;
    return { key: nextKey++, id, parentId, ...fields, scope };
  }

  const rows = shallowRef<SectionRow[]>([makeRow('A', null)]);

  function nextId(): string {
    const taken = new Set(rows.value.map((r) => r.id));
    for (let i = 0; i < 26 * 27; i++) {
      const id =
        i < 26
          ? String.fromCharCode(65 + i)
          : `${String.fromCharCode(64 + Math.floor(i / 26))}${String.fromCharCode(65 + (i % 26))}`;
      if (!taken.has(id)) return id;
    }
    return `S${nextKey}`;
  }

  function add(): void {
    const last = rows.value[rows.value.length - 1];
    rows.value = [...rows.value, makeRow(nextId(), last?.id ?? null)];
  }

  function remove(key: number): void {
    const row = rows.value.find((r) => r.key === key);
    row?.scope.stop();
    rows.value = rows.value.filter((r) => r.key !== key);
  }

  /** Rows are plain objects in a shallow list; a change of id or parent replaces the list to be seen. */
  function update(key: number, patch: Partial<Pick<SectionRow, 'id' | 'parentId'>>): void {
    rows.value = rows.value.map((r) => (r.key === key ? { ...r, ...patch } : r));
  }

  const sections = () =>
    rows.value.map((r) => ({
      id: r.id,
      parentId: r.parentId,
      lengthFt: r.length.value.value,
      applianceBtuh: r.appliance.value.value ?? 0,
    }));

  const loopErrors = () => {
    const looped = sectionsInLoops(rows.value);
    const out: Record<string, string> = {};
    rows.value.forEach((r, i) => {
      if (looped.has(r.id)) out[`sections.${i}.parentId`] = t('checks.system.loop');
    });
    return out;
  };

  const check = useInstantCheck(
    pipeSystemInputSchema,
    () => ({
      fuel: fuel.value,
      pressureDropInWc: drop.value.value,
      heatingValueBtuPerCuFt: heatingValue.value.value,
      sections: sections(),
    }),
    pipeSystem,
    loopErrors,
  );

  return { fuel, drop, heatingValue, rows, add, remove, update, result: check.result, errors: check.errors };
}
