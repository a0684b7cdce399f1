import { computed } from 'vue';
import { useI18n } from 'vue-i18n';
import { ALL_ROLES } from '@/api/roles';

/** Every role with its name, for selects. */
export function useRoleOptions() {
  const { t } = useI18n();
  return computed(() => ALL_ROLES.map((value) => ({ value, label: t(`roles.${value}`) })));
}
