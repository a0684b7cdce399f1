import { computed, reactive, ref, watch } from 'vue';
import { useI18n } from 'vue-i18n';
import { equipmentSpecSchema } from '@shared/schemas/equipmentSpec';
import { ApiError } from '@/api/http';
import { fieldKey, fromForm, toForm, type SpecForm } from './equipmentSpecForm';
import { useConfirm } from './useConfirm';
import { useEquipmentModel, useSaveEquipmentSpec } from './useEquipmentCatalogue';
import { useNotice } from './useNotice';

/** Field keys the form shows errors under; anything else goes to the alert above the form. */
const FORM_FIELDS =
  /^(staging|minModulationPct|inputBtuh\.(high|low)|outputBtuh|afuePct|riseRangeF\.(min|max)|notes|fuels\.[a-z-]+\.(inletMinInWc|inletMaxInWc|orificeDrill|manifold\.(single|high|low)\.(targetInWc|toleranceInWc)))$/;

/** Loading a model's spec table into the form, checking it with the shared schema, saving, clearing. */
export function useEquipmentSpecEditor(id: () => number) {
  const { t } = useI18n();
  const confirm = useConfirm();
  const notice = useNotice();
  const model = useEquipmentModel(id);
  const save = useSaveEquipmentSpec(id);
  const form = reactive<SpecForm>(toForm(null));
  const errors = reactive<Record<string, string>>({});
  const alert = ref<string | null>(null);
  const loadedFor = ref<number | null>(null);

  function load(spec: unknown): void {
    Object.assign(form, toForm(spec));
  }
  watch(
    () => model.data.value,
    (m) => {
      // Fill the form once per model, so a background refetch never wipes what is being typed.
      if (m && loadedFor.value !== m.id) {
        load(m.spec);
        loadedFor.value = m.id;
      }
    },
    { immediate: true },
  );

  function show(entries: Record<string, string>, stageAt: ReturnType<typeof fromForm>['stageAt']): void {
    for (const key of Object.keys(errors)) delete errors[key];
    alert.value = null;
    const rest: string[] = [];
    for (const [path, message] of Object.entries(entries)) {
      const key = fieldKey(path, stageAt);
      if (FORM_FIELDS.test(key)) errors[key] ??= message;
      else rest.push(message);
    }
    if (rest.length > 0) alert.value = rest.join(' ');
  }

  async function submit(): Promise<void> {
    const { spec, stageAt } = fromForm(form);
    const parsed = equipmentSpecSchema.safeParse(spec);
    if (!parsed.success) {
      const entries: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const notANumber = issue.code === 'invalid_type' && issue.expected === 'number';
        entries[issue.path.join('.')] ??= notANumber ? t('checks.errors.number') : issue.message;
      }
      show(entries, stageAt);
      return;
    }
    show({}, stageAt);
    try {
      const saved = await save.mutateAsync(parsed.data);
      load(saved.model.spec);
      notice.success(t('equipment.spec.saved'));
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fields).length > 0) show(error.fields, stageAt);
      else alert.value = error instanceof ApiError ? error.message : t('errors.unknown');
    }
  }

  async function clear(): Promise<void> {
    const ok = await confirm({
      title: t('equipment.spec.clearTitle'),
      message: t('equipment.spec.clearMessage'),
      confirm: t('equipment.spec.clearConfirm'),
    });
    if (!ok) return;
    try {
      await save.mutateAsync(null);
      load(null);
      show({}, { 'natural-gas': [], propane: [] });
      notice.success(t('equipment.spec.cleared'));
    } catch (error) {
      alert.value = error instanceof ApiError ? error.message : t('errors.unknown');
    }
  }

  const hasSpec = computed(() => model.data.value?.spec != null);
  return { model, form, errors, alert, saving: save.isPending, hasSpec, submit, clear };
}
