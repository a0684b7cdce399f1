import { useMutation, useQueryClient } from '@tanstack/vue-query';
import type { Ticket, TicketUpdate } from '@shared/schemas/tickets';
import { ticketsApi } from '@/api/tickets';

/** Changes a desk member makes to a ticket (status, assignee, branch, resolution), every cached copy updated. */
export function useTicketChange(ticketId: () => number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: TicketUpdate) => ticketsApi.update(ticketId(), change),
    onSuccess: ({ ticket }: { ticket: Ticket }) => {
      queryClient.setQueryData(['ticket', ticket.id], { ticket });
      void queryClient.invalidateQueries({ queryKey: ['tickets'] });
      void queryClient.invalidateQueries({ queryKey: ['desk-board'] });
    },
  });
}
