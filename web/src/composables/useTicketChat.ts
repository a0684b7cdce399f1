import { onBeforeUnmount, onMounted, ref } from 'vue';
import type { Message } from '@shared/schemas/tickets';
import { ticketsApi } from '@/api/tickets';
import { getSocket, type AppSocket } from '@/realtime/socket';
import { mergeMessages } from './ticketMerge';

/** A fresh id the server uses to drop a message sent twice (socket, then REST retry). */
export function newClientId(): string {
  if (typeof crypto !== 'undefined' && 'randomUUID' in crypto) return crypto.randomUUID();
  return `c${Date.now().toString(36)}${Math.random().toString(36).slice(2, 12)}`;
}

/**
 * The conversation of one ticket: loads it, joins the ticket's room, takes live messages,
 * catches up after a reconnect, and sends over the socket (REST when the socket is down).
 */
export function useTicketChat(ticketId: number) {
  const messages = ref<Message[]>([]);
  const loading = ref(true);
  const error = ref<Error | null>(null);
  const sending = ref(false);
  let socket: AppSocket | null = null;
  let stopped = false;

  const lastId = () => messages.value.at(-1)?.id;
  const add = (incoming: Message[]) => {
    messages.value = mergeMessages(
      messages.value,
      incoming.filter((m) => m.ticketId === ticketId),
    );
  };

  async function load(after?: number): Promise<void> {
    try {
      const { items } = await ticketsApi.messages(ticketId, after);
      add(items);
      error.value = null;
    } catch (cause) {
      if (after === undefined) error.value = cause as Error;
    } finally {
      loading.value = false;
    }
  }

  function join(): void {
    socket?.emit('ticket:join', { ticketId }, () => undefined);
  }

  const onMessage = (payload: { message: Message }, ack?: (res: { ok: true }) => void) => {
    ack?.({ ok: true });
    add([payload.message]);
  };
  const onConnect = () => {
    join();
    void load(lastId());
  };

  onMounted(async () => {
    await load();
    const s = await getSocket();
    if (stopped) return;
    socket = s;
    s.on('message:new', onMessage);
    s.on('connect', onConnect);
    if (s.connected) join();
  });

  onBeforeUnmount(() => {
    stopped = true;
    if (!socket) return;
    socket.off('message:new', onMessage);
    socket.off('connect', onConnect);
    if (socket.connected) socket.emit('ticket:leave', { ticketId });
  });

  function viaSocket(s: AppSocket, payload: Parameters<typeof ticketsApi.sendMessage>[1]) {
    return new Promise<Message>((resolve, reject) => {
      s.timeout(8000).emit('message:send', { ticketId, ...payload }, (err, res) => {
        if (err) reject(err);
        else if (res.ok) resolve(res.message);
        else reject(Object.assign(new Error(res.error.message), { fields: res.error.fields ?? {} }));
      });
    });
  }

  /** Send a message or internal note; resolves with the stored message. */
  async function send(body: string, kind: 'message' | 'internal-note' = 'message'): Promise<Message> {
    sending.value = true;
    const payload = { body, clientId: newClientId(), kind };
    try {
      let message: Message;
      if (socket?.connected) {
        try {
          message = await viaSocket(socket, payload);
        } catch (cause) {
          // Refused by the server: say so. A timeout: try once more over HTTP (same clientId).
          if ((cause as { fields?: unknown }).fields) throw cause;
          message = (await ticketsApi.sendMessage(ticketId, payload)).message;
        }
      } else {
        message = (await ticketsApi.sendMessage(ticketId, payload)).message;
      }
      add([message]);
      return message;
    } finally {
      sending.value = false;
    }
  }

  return { messages, loading, error, sending, send, reload: () => load() };
}
