import { computed, reactive } from 'vue';
import { useQuery, useQueryClient } from '@tanstack/vue-query';
import { useI18n } from 'vue-i18n';
import type { MailKind, MailPreferencesResponse } from '@shared/schemas/mail';
import { mailApi } from '@/api/mail';
import { useNotice } from './useNotice';

const KEY = ['me', 'mail-preferences'] as const;

/** My optional e-mails: loaded once, and each switch saved as soon as it is flipped. */
export function useMailPreferences() {
  const { t } = useI18n();
  const notice = useNotice();
  const queryClient = useQueryClient();
  const query = useQuery({ queryKey: KEY, queryFn: ({ signal }) => mailApi.preferences(signal) });
  const saving = reactive<Partial<Record<MailKind, boolean>>>({});

  async function set(kind: MailKind, on: boolean): Promise<void> {
    if (saving[kind]) return;
    saving[kind] = true;
    try {
      const saved = await mailApi.updatePreferences({ [kind]: on });
      queryClient.setQueryData<MailPreferencesResponse>(KEY, saved);
      notice.success(t(on ? 'mail.preferences.savedOn' : 'mail.preferences.savedOff'));
    } catch (error) {
      // The switch shows the stored choice again; say why it did not change.
      notice.error(error instanceof Error ? error.message : t('mail.preferences.saveFailed'));
    } finally {
      saving[kind] = false;
    }
  }

  return {
    preferences: computed(() => query.data.value?.preferences ?? null),
    isPending: query.isPending,
    error: query.error,
    refetch: query.refetch,
    saving,
    set,
  };
}
