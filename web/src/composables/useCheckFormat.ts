import { useI18n } from 'vue-i18n';
import { formatNumber, fromBase, placesFor, type QuantityKind } from './checkUnits';
import { unitRef, useCheckUnits } from './useCheckUnits';

/** Results in the units chosen on the page: `show('pressure', 0.22)` → "54.8 Pa" when Pa is chosen. */
export function useCheckFormat() {
  const { t } = useI18n();
  const units = useCheckUnits();

  const unitLabel = (kind: QuantityKind) => t(`checks.unit.${unitRef(kind, units).value}`);
  const number = (kind: QuantityKind, base: number) => {
    const unit = unitRef(kind, units).value;
    return formatNumber(fromBase(kind, base, unit), placesFor(unit));
  };
  const show = (kind: QuantityKind, base: number) => `${number(kind, base)} ${unitLabel(kind)}`;
  const plain = (value: number, places = 0) => formatNumber(value, places);

  return { units, unitLabel, number, show, plain };
}
