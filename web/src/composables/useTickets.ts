import { computed, onBeforeUnmount, onMounted } from 'vue';
import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Ticket } from '@shared/schemas/tickets';
import { ticketsApi, type TicketListParams } from '@/api/tickets';
import { getSocket } from '@/realtime/socket';
import { mergeTicket } from './ticketMerge';

type TicketList = { items: Ticket[]; total: number };

/** Calls `handler` for every 'ticket:updated' while the calling component is mounted. */
export function useTicketUpdates(handler: (ticket: Ticket) => void): void {
  const listener = ({ ticket }: { ticket: Ticket }) => handler(ticket);
  let active = true;
  onMounted(() => {
    void getSocket().then((socket) => {
      if (active) socket.on('ticket:updated', listener);
    });
  });
  onBeforeUnmount(() => {
    active = false;
    void getSocket().then((socket) => socket.off('ticket:updated', listener));
  });
}

/** A list of tickets, kept current from the live 'ticket:updated' events. */
export function useTicketList(params: TicketListParams) {
  const queryClient = useQueryClient();
  const queryKey = ['tickets', params] as const;
  const query = useQuery({
    queryKey,
    queryFn: ({ signal }) => ticketsApi.list(params, signal),
  });
  useTicketUpdates((ticket) => {
    queryClient.setQueryData<TicketList>(queryKey, (old) =>
      old ? mergeTicket(old, ticket, params.status) : old,
    );
    queryClient.setQueryData<{ ticket: Ticket }>(['ticket', ticket.id], (old) => (old ? { ticket } : old));
  });
  return query;
}

/** One ticket, kept current from 'ticket:updated'. */
export function useTicket(id: () => number) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: computed(() => ['ticket', id()] as const),
    queryFn: ({ signal }) => ticketsApi.get(id(), signal),
  });
  useTicketUpdates((ticket) => {
    if (ticket.id === id()) queryClient.setQueryData(['ticket', id()], { ticket });
  });
  return query;
}

/** Claim a ticket (staff), updating every cached copy. */
export function useClaimTicket() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => ticketsApi.claim(id),
    onSuccess: ({ ticket }) => {
      queryClient.setQueryData(['ticket', ticket.id], { ticket });
      void queryClient.invalidateQueries({ queryKey: ['tickets'] });
    },
  });
}
