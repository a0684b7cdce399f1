import { computed, ref } from 'vue';
import { TYPICAL_SPEC, checkGasPressure, gasPressureInputSchema, type Stage } from '@shared/calc/gasPressure';
import { resolveGasSpec, type GasFuel, type SpecChoice } from './gasPressureSpec';
import { createQuantity, useCheckUnits } from './useCheckUnits';
import { useEquipmentModel } from './useEquipmentCatalogue';
import { useInstantCheck } from './useInstantCheck';

export const GAS_STAGES: readonly Stage[] = ['single', 'high', 'low'];

/** The gas-pressure form: readings, the fuel, and where the targets come from. */
export function useGasPressureCheck() {
  const units = useCheckUnits();
  const fuel = ref<GasFuel>('natural-gas');
  const choice = ref<SpecChoice>('typical');
  const modelId = ref<number | null>(null);
  const model = useEquipmentModel(modelId);

  const p = () => createQuantity('pressure', units);
  const readings = {
    inletStatic: p(),
    inletUnderFire: p(),
    manifold: Object.fromEntries(GAS_STAGES.map((s) => [s, p()])) as Record<Stage, ReturnType<typeof p>>,
  };
  const entered = {
    inletMin: p(),
    inletMax: p(),
    manifold: Object.fromEntries(GAS_STAGES.map((s) => [s, { target: p(), tolerance: p() }])) as Record<
      Stage,
      { target: ReturnType<typeof p>; tolerance: ReturnType<typeof p> }
    >,
  };

  // Which stage each array index stands for, so an error on "manifold.1" lands on its own field.
  const readingStages = computed(() =>
    GAS_STAGES.filter((s) => readings.manifold[s].text.value.trim() !== ''),
  );
  const targetStages = computed(() =>
    GAS_STAGES.filter((s) => entered.manifold[s].target.text.value.trim() !== ''),
  );

  const enteredSpec = () => ({
    inletMinInWc: entered.inletMin.value.value,
    inletMaxInWc: entered.inletMax.value.value,
    manifold: targetStages.value.map((stage) => ({
      stage,
      targetInWc: entered.manifold[stage].target.value.value,
      toleranceInWc: entered.manifold[stage].tolerance.value.value,
    })),
  });

  const input = () => ({
    fuel: fuel.value,
    ...(choice.value === 'model' && modelId.value !== null ? { equipmentModelId: modelId.value } : {}),
    ...(choice.value === 'entered' ? { spec: enteredSpec() } : {}),
    inletStaticInWc: readings.inletStatic.value.value,
    inletUnderFireInWc: readings.inletUnderFire.value.value,
    manifold: readingStages.value.map((stage) => ({
      stage,
      valueInWc: readings.manifold[stage].value.value,
    })),
  });

  const modelSpec = () => (modelId.value === null ? undefined : (model.data.value?.spec ?? null));
  /** What the targets are when they do not come from the form (for the notice above the result). */
  const resolved = computed(() =>
    resolveGasSpec(choice.value, fuel.value, modelSpec(), TYPICAL_SPEC[fuel.value]),
  );
  const waitingForModel = computed(
    () => choice.value === 'model' && modelId.value !== null && !model.data.value,
  );

  const check = useInstantCheck(gasPressureInputSchema, input, (parsed) => {
    if (waitingForModel.value) return null;
    const { spec, specSource } = resolveGasSpec(
      choice.value,
      fuel.value,
      modelSpec(),
      parsed.spec ?? TYPICAL_SPEC[fuel.value],
    );
    return checkGasPressure(parsed, spec, specSource);
  });

  /** Schema paths ("manifold.1.valueInWc", "spec.manifold.0.targetInWc") as the form's own field names. */
  const errors = computed(() => {
    const out: Record<string, string> = {};
    for (const [path, message] of Object.entries(check.errors.value)) {
      const parts = path.split('.');
      let key = path;
      if (parts[0] === 'manifold' && parts.length > 1)
        key = `manifold.${readingStages.value[Number(parts[1])]}`;
      if (parts[0] === 'spec' && parts[1] === 'manifold' && parts.length > 3) {
        key = `spec.manifold.${targetStages.value[Number(parts[2])]}.${parts[3]}`;
      }
      out[key] ??= message;
    }
    return out;
  });

  return { fuel, choice, modelId, model, readings, entered, resolved, result: check.result, errors };
}
