import { computed, ref } from 'vue';
import { useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Attachment, Message } from '@shared/schemas/tickets';
import type { WriteUpResult } from '@shared/schemas/writeUp';
import { ticketsApi } from '@/api/tickets';

/** The articles a ticket was written up as, that this reader may open ("written up as …"). */
export function useTicketWriteUps(ticketId: () => number) {
  return useQuery({
    queryKey: computed(() => ['ticket-write-ups', ticketId()] as const),
    queryFn: ({ signal }) => ticketsApi.writeUps(ticketId(), signal),
  });
}

/** The choices of a write-up: the thread's messages and photos, what the desk ticked. */
export interface WriteUpChoices {
  messages: Message[];
  photos: Attachment[];
}

/** Messages that can go into the answer, and the photos sent on the ticket (documents stay out). */
export function choicesOf(thread: readonly Message[]): WriteUpChoices {
  const messages = thread.filter((m) => m.kind !== 'event' && m.body.trim().length > 0);
  const photos = thread.flatMap((m) => m.attachments.filter((a) => a.contentType.startsWith('image/')));
  return { messages, photos };
}

/**
 * The write-up dialog's state: loads the thread as the desk sees it (notes and marks included),
 * ticks the marked messages, and makes the draft.
 */
export function useWriteUpDraft(ticketId: () => number) {
  const queryClient = useQueryClient();
  const choices = ref<WriteUpChoices>({ messages: [], photos: [] });
  const messageIds = ref<number[]>([]);
  const attachmentIds = ref<number[]>([]);
  const keepSerial = ref(false);
  const loading = ref(false);
  const loadError = ref<Error | null>(null);
  const creating = ref(false);

  async function load(): Promise<void> {
    loading.value = true;
    loadError.value = null;
    try {
      const { items } = await ticketsApi.messages(ticketId(), undefined);
      choices.value = choicesOf(items);
      messageIds.value = choices.value.messages.filter((m) => m.partOfAnswer).map((m) => m.id);
      attachmentIds.value = [];
      keepSerial.value = false;
    } catch (error) {
      loadError.value = error as Error;
    } finally {
      loading.value = false;
    }
  }

  async function create(): Promise<WriteUpResult> {
    creating.value = true;
    try {
      const result = await ticketsApi.writeUp(ticketId(), {
        messageIds: messageIds.value,
        attachmentIds: attachmentIds.value,
        keepSerial: keepSerial.value,
      });
      queryClient.setQueryData(['article', result.article.slug], { article: result.article });
      void queryClient.invalidateQueries({ queryKey: ['ticket-write-ups', ticketId()] });
      void queryClient.invalidateQueries({ queryKey: ['kb-recent'] });
      return result;
    } finally {
      creating.value = false;
    }
  }

  return { choices, messageIds, attachmentIds, keepSerial, loading, loadError, creating, load, create };
}
