import { computed, onBeforeUnmount, onMounted, ref } from 'vue';
import type { Attachment, Message } from '@shared/schemas/tickets';
import { ticketsApi } from '@/api/tickets';
import { getSocket, type AppSocket } from '@/realtime/socket';
import { useConnectionStore } from '@/stores/connection';
import { useSessionStore } from '@/stores/session';
import { mergeMessages } from './ticketMerge';
import { useOutbox, type OutboxEntry } from './useOutbox';

/** A fresh id the server uses to drop a message sent twice (socket, then REST retry). */
export function newClientId(): string {
  if (typeof crypto !== 'undefined' && 'randomUUID' in crypto) return crypto.randomUUID();
  return `c${Date.now().toString(36)}${Math.random().toString(36).slice(2, 12)}`;
}

export type MessageKind = 'message' | 'internal-note';

/**
 * The conversation of one ticket: loads it, joins the ticket's room, takes live messages,
 * catches up after a reconnect, and sends over the socket (REST when the socket is down).
 * What cannot be sent for want of a connection waits in the outbox and goes when it is back.
 */
export function useTicketChat(ticketId: number) {
  const messages = ref<Message[]>([]);
  const loading = ref(true);
  const error = ref<Error | null>(null);
  const sending = ref(false);
  const online = ref(typeof navigator === 'undefined' || navigator.onLine);
  const connection = useConnectionStore();
  const session = useSessionStore();
  let socket: AppSocket | null = null;
  let stopped = false;

  const add = (incoming: Message[]) => {
    const mine = incoming.filter((m) => m.ticketId === ticketId);
    messages.value = mergeMessages(messages.value, mine);
    outbox.settle(mine);
  };
  const outbox = useOutbox(`lightoff.outbox.${session.user?.id ?? 0}.${ticketId}`, deliver, {
    isOnline: () => online.value,
    onSent: (message) => add([message]),
  });
  const offline = computed(() => !online.value || !connection.connected);

  const lastId = () => messages.value.at(-1)?.id;

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

  const flush = () => void outbox.flush();
  const onMessage = (payload: { message: Message }, ack?: (res: { ok: true }) => void) => {
    ack?.({ ok: true });
    add([payload.message]);
  };
  const onMarked = (p: { ticketId: number; messageId: number; partOfAnswer: boolean }) => {
    if (p.ticketId !== ticketId) return;
    messages.value = messages.value.map((m) =>
      m.id === p.messageId ? { ...m, partOfAnswer: p.partOfAnswer } : m,
    );
  };
  const onConnect = () => {
    join();
    // Catch up first: a waiting message may have reached the server before the line dropped.
    void load(lastId()).then(flush);
  };
  const onOnline = () => {
    online.value = true;
    flush();
  };
  const onOffline = () => (online.value = false);

  onMounted(async () => {
    window.addEventListener('online', onOnline);
    window.addEventListener('offline', onOffline);
    await load();
    flush();
    const s = await getSocket();
    if (stopped) return;
    socket = s;
    s.on('message:new', onMessage);
    s.on('message:marked', onMarked);
    s.on('connect', onConnect);
    if (s.connected) join();
  });

  onBeforeUnmount(() => {
    stopped = true;
    window.removeEventListener('online', onOnline);
    window.removeEventListener('offline', onOffline);
    if (!socket) return;
    socket.off('message:new', onMessage);
    socket.off('message:marked', onMarked);
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

  /** One try at one entry, with its own clientId every time. */
  async function deliver(entry: OutboxEntry): Promise<Message> {
    const payload = {
      body: entry.body,
      clientId: entry.clientId,
      kind: entry.kind,
      attachmentIds: entry.attachments.map((a) => a.id),
    };
    if (socket?.connected) {
      try {
        return await viaSocket(socket, payload);
      } catch (cause) {
        // Refused by the server: say so. A timeout: try once more over HTTP (same clientId).
        if ((cause as { fields?: unknown }).fields) throw cause;
      }
    }
    return (await ticketsApi.sendMessage(ticketId, payload)).message;
  }

  /**
   * Send a message or internal note. Resolves 'sent', or 'waiting' when there is no connection
   * (it is kept and sent later); throws when the server refuses it.
   */
  async function send(
    body: string,
    kind: MessageKind = 'message',
    attachments: Attachment[] = [],
  ): Promise<'sent' | 'waiting'> {
    sending.value = true;
    try {
      return await outbox.send({
        clientId: newClientId(),
        ticketId,
        body,
        kind,
        attachments,
        createdAt: new Date().toISOString(),
      });
    } finally {
      sending.value = false;
    }
  }

  /** Staff: mark a message as part of the answer (or not); the thread follows what the server says. */
  async function mark(messageId: number, partOfAnswer: boolean): Promise<void> {
    const { message } = await ticketsApi.markMessage(ticketId, messageId, partOfAnswer);
    onMarked({ ticketId, messageId, partOfAnswer: message.partOfAnswer ?? partOfAnswer });
  }

  return {
    messages,
    pending: outbox.items,
    mark,
    loading,
    error,
    sending,
    offline,
    send,
    discard: outbox.discard,
    reload: () => load(),
  };
}
