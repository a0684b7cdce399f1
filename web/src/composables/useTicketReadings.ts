import { onBeforeUnmount, onMounted } from 'vue';
import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { ReadingCreate } from '@shared/schemas/readings';
import type { Message } from '@shared/schemas/tickets';
import { readingsApi } from '@/api/readings';
import { getSocket, type AppSocket } from '@/realtime/socket';
import { readingCardOf } from './readingForm';

/**
 * The readings of one ticket: the list, posting a new one, and a refresh whenever a reading's card
 * arrives in the ticket's chat (someone else posted one). The chat's own socket room brings it.
 */
export function useTicketReadings(ticketId: number) {
  const queryClient = useQueryClient();
  const queryKey = ['readings', ticketId] as const;
  const list = useQuery({
    queryKey,
    queryFn: ({ signal }) => readingsApi.list(ticketId, signal),
  });
  const refresh = () => void queryClient.invalidateQueries({ queryKey });

  const add = useMutation({
    mutationFn: (reading: ReadingCreate) => readingsApi.create(ticketId, reading),
    onSuccess: refresh,
  });

  let socket: AppSocket | null = null;
  let stopped = false;
  const onMessage = ({ message }: { message: Message }) => {
    if (message.ticketId === ticketId && readingCardOf(message)) refresh();
  };
  onMounted(async () => {
    const s = await getSocket();
    if (stopped) return;
    socket = s;
    s.on('message:new', onMessage);
  });
  onBeforeUnmount(() => {
    stopped = true;
    socket?.off('message:new', onMessage);
  });

  return { list, add };
}
