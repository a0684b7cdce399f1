import { ref } from 'vue';
import type { Attachment, Message } from '@shared/schemas/tickets';
import { ApiError } from '@/api/http';

/** A message written on this device that the server has not yet confirmed. */
export interface OutboxEntry {
  /** Kept for every try: the server stores one message per clientId. */
  clientId: string;
  ticketId: number;
  body: string;
  kind: 'message' | 'internal-note';
  /** Already uploaded; shown with the waiting message, sent as attachmentIds. */
  attachments: Attachment[];
  createdAt: string;
}

/** sending: on its way · waiting: no connection, sent when it returns · refused: the server said no. */
export type OutboxStatus = 'sending' | 'waiting' | 'refused';
export interface OutboxItem extends OutboxEntry {
  status: OutboxStatus;
  error: string | null;
}

export type OutboxStorage = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

export interface OutboxOptions {
  storage?: OutboxStorage | null;
  isOnline?: () => boolean;
  /** Each message the server stored, as it is confirmed. */
  onSent?: (message: Message) => void;
}

/** No answer at all (offline, dropped, timed out), as opposed to an answer that says no. */
export function isNetworkFailure(error: unknown): boolean {
  if (error instanceof ApiError) return error.status === 0 || error.status >= 500;
  return !(error as { fields?: unknown } | null)?.fields;
}

function browserStorage(): OutboxStorage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

function read(storage: OutboxStorage | null, key: string): OutboxItem[] {
  try {
    const saved: unknown = JSON.parse(storage?.getItem(key) ?? '[]');
    if (!Array.isArray(saved)) return [];
    return (saved as OutboxEntry[])
      .filter((e) => typeof e?.clientId === 'string' && typeof e.body === 'string')
      .map((e) => ({ ...e, attachments: e.attachments ?? [], status: 'waiting', error: null }));
  } catch {
    return [];
  }
}

/**
 * The messages of one ticket not yet confirmed by the server, kept in the browser's storage under
 * `key` so they survive a reload, and sent in the order written once a connection is there.
 * `deliver` sends one entry and resolves with the stored message.
 */
export function useOutbox(
  key: string,
  deliver: (entry: OutboxEntry) => Promise<Message>,
  options: OutboxOptions = {},
) {
  const storage = options.storage === undefined ? browserStorage() : options.storage;
  const isOnline = options.isOnline ?? (() => typeof navigator === 'undefined' || navigator.onLine);
  const items = ref<OutboxItem[]>(read(storage, key));
  let flushing: Promise<Message[]> | null = null;

  function persist(): void {
    const entries: OutboxEntry[] = items.value.map(
      ({ clientId, ticketId, body, kind, attachments, createdAt }) => ({
        clientId,
        ticketId,
        body,
        kind,
        attachments,
        createdAt,
      }),
    );
    try {
      if (entries.length) storage?.setItem(key, JSON.stringify(entries));
      else storage?.removeItem(key);
    } catch {
      // Storage full or blocked: the message still waits in memory for this page's life.
    }
  }

  const find = (clientId: string) => items.value.find((i) => i.clientId === clientId);

  function drop(clientIds: ReadonlySet<string>): void {
    const before = items.value.length;
    items.value = items.value.filter((i) => !clientIds.has(i.clientId));
    if (items.value.length !== before) persist();
  }

  /** Messages the server has (from a load or a live event): their entries are done. */
  function settle(messages: readonly Message[]): void {
    const ids = new Set(messages.flatMap((m) => (m.clientId ? [m.clientId] : [])));
    if (ids.size) drop(ids);
  }

  async function run(): Promise<Message[]> {
    const sent: Message[] = [];
    const tried = new Set<string>();
    for (;;) {
      const next = items.value.find((i) => i.status !== 'refused' && !tried.has(i.clientId));
      if (!next) break;
      if (!isOnline()) {
        for (const i of items.value) if (i.status === 'sending') i.status = 'waiting';
        break;
      }
      tried.add(next.clientId);
      next.status = 'sending';
      try {
        const message = await deliver(next);
        sent.push(message);
        drop(new Set([next.clientId]));
        options.onSent?.(message);
      } catch (error) {
        const item = find(next.clientId);
        if (!item) continue;
        if (isNetworkFailure(error)) {
          // The connection is gone: everything waits for it, in order.
          for (const i of items.value) if (i.status === 'sending') i.status = 'waiting';
          break;
        }
        item.status = 'refused';
        item.error = error instanceof Error ? error.message : String(error);
      }
    }
    return sent;
  }

  /** Send what is waiting, oldest first; one run at a time. Resolves with what the server stored. */
  async function flush(): Promise<Message[]> {
    // Entries added during a run are picked up by it; a run that ended early is started again.
    while (flushing) await flushing.catch(() => undefined);
    flushing = run();
    try {
      return await flushing;
    } finally {
      flushing = null;
    }
  }

  /**
   * Keep a new message and send it (after any older waiting ones). Resolves 'sent' or 'waiting';
   * throws when the server refuses it (and forgets it, so the writer can fix and send again).
   */
  async function send(entry: OutboxEntry): Promise<'sent' | 'waiting'> {
    items.value.push({ ...entry, status: 'sending', error: null });
    persist();
    await flush();
    const item = find(entry.clientId);
    if (!item) return 'sent';
    if (item.status !== 'refused') return 'waiting';
    drop(new Set([entry.clientId]));
    throw new Error(item.error ?? 'refused');
  }

  /** Throw away a message the server refused. */
  function discard(clientId: string): void {
    drop(new Set([clientId]));
  }

  return { items, send, flush, settle, discard };
}
