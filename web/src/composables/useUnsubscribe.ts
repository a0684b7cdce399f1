import { computed, ref } from 'vue';
import { MAIL_KINDS, type MailKind } from '@shared/schemas/mail';
import { ApiError } from '@/api/http';
import { mailApi } from '@/api/mail';

export type UnsubscribeState = 'confirm' | 'busy' | 'done' | 'invalid' | 'failed';

/**
 * The page behind "stop these e-mails": nothing changes until the person confirms (mail scanners
 * open links on their own), then the signed token is sent; no sign-in needed.
 */
export function useUnsubscribe(token: () => string) {
  const state = ref<UnsubscribeState>(token() ? 'confirm' : 'invalid');
  const problem = ref<string | null>(null);
  // The kind is readable in the token (only its signature is secret), so the page can name it.
  const kind = computed<MailKind | null>(() => {
    const named = token().split('.')[1] ?? '';
    return (MAIL_KINDS as readonly string[]).includes(named) ? (named as MailKind) : null;
  });

  async function confirm(): Promise<void> {
    if (state.value === 'busy') return;
    state.value = 'busy';
    problem.value = null;
    try {
      await mailApi.unsubscribe(token());
      state.value = 'done';
    } catch (error) {
      const refused = error instanceof ApiError && (error.status === 400 || error.status === 404);
      state.value = refused ? 'invalid' : 'failed';
      problem.value = error instanceof Error ? error.message : null;
    }
  }

  return { state, problem, kind, confirm };
}
