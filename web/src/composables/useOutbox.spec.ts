import { describe, expect, it, vi } from 'vitest';
import type { Message } from '@shared/schemas/tickets';
import { ApiError } from '@/api/http';
import { useOutbox, type OutboxEntry, type OutboxStorage } from './useOutbox';

const KEY = 'lightoff.outbox.7.42';

/** An in-memory stand-in for localStorage, shared by "page loads" like the real one. */
function fakeStorage(): OutboxStorage & { data: Map<string, string> } {
  const data = new Map<string, string>();
  return {
    data,
    getItem: (k) => data.get(k) ?? null,
    setItem: (k, v) => void data.set(k, v),
    removeItem: (k) => void data.delete(k),
  };
}

const entry = (clientId: string, body = `body of ${clientId}`): OutboxEntry => ({
  clientId,
  ticketId: 42,
  body,
  kind: 'message',
  attachments: [],
  createdAt: '2026-03-04T15:00:00Z',
});

const stored = (e: OutboxEntry, id: number): Message => ({
  id,
  ticketId: e.ticketId,
  clientId: e.clientId,
  kind: e.kind,
  body: e.body,
  author: { id: 7, name: 'Rowan Fielding', role: 'contractor' },
  attachments: [],
  createdAt: e.createdAt,
  deliveredAt: null,
  readAt: null,
});

const offlineError = () => new ApiError(0, 'network_error', 'No connection');

describe('outbox', () => {
  it('When a message is written offline, then it is kept in storage with its clientId, waiting, and nothing is sent', async () => {
    const storage = fakeStorage();
    const deliver = vi.fn(async (e: OutboxEntry) => stored(e, 1));
    const outbox = useOutbox(KEY, deliver, { storage, isOnline: () => false });

    expect(await outbox.send(entry('client-aaaa'))).toBe('waiting');

    expect(deliver).not.toHaveBeenCalled();
    expect(outbox.items.value).toMatchObject([{ clientId: 'client-aaaa', status: 'waiting' }]);
    expect(JSON.parse(storage.data.get(KEY)!)).toEqual([entry('client-aaaa')]);
  });

  it('When the page is loaded again and the connection is back, then each waiting message is sent once, in order, with its first clientId', async () => {
    const storage = fakeStorage();
    const first = useOutbox(KEY, vi.fn(), { storage, isOnline: () => false });
    await first.send(entry('client-aaaa'));
    await first.send(entry('client-bbbb'));

    let online = false;
    const deliver = vi.fn(async (e: OutboxEntry) => stored(e, deliver.mock.calls.length));
    const sent: Message[] = [];
    const reloaded = useOutbox(KEY, deliver, {
      storage,
      isOnline: () => online,
      onSent: (m) => sent.push(m),
    });
    expect(reloaded.items.value.map((i) => [i.clientId, i.status])).toEqual([
      ['client-aaaa', 'waiting'],
      ['client-bbbb', 'waiting'],
    ]);

    online = true;
    // The browser's "online" event and the socket's reconnect both ask for a flush.
    await Promise.all([reloaded.flush(), reloaded.flush()]);

    expect(deliver.mock.calls.map(([e]) => e.clientId)).toEqual(['client-aaaa', 'client-bbbb']);
    expect(sent.map((m) => m.clientId)).toEqual(['client-aaaa', 'client-bbbb']);
    expect(reloaded.items.value).toEqual([]);
    expect(storage.data.has(KEY)).toBe(false);
  });

  it('When a send breaks off for want of a connection, then the message waits and the next try uses the same clientId', async () => {
    const storage = fakeStorage();
    const deliver = vi
      .fn<(e: OutboxEntry) => Promise<Message>>()
      .mockRejectedValueOnce(offlineError())
      .mockImplementation(async (e) => stored(e, 9));
    const outbox = useOutbox(KEY, deliver, { storage, isOnline: () => true });

    expect(await outbox.send(entry('client-aaaa'))).toBe('waiting');
    expect(outbox.items.value[0]).toMatchObject({ status: 'waiting' });
    expect(storage.data.has(KEY)).toBe(true);

    expect(await outbox.flush()).toMatchObject([{ id: 9, clientId: 'client-aaaa' }]);
    expect(deliver.mock.calls.map(([e]) => e.clientId)).toEqual(['client-aaaa', 'client-aaaa']);
    expect(outbox.items.value).toEqual([]);
  });

  it('When the server refuses a new message, then send throws its reason and the outbox forgets it', async () => {
    const storage = fakeStorage();
    const refusal = new ApiError(422, 'validation', 'Write a message or add a photo', { body: 'x' });
    const outbox = useOutbox(KEY, vi.fn().mockRejectedValue(refusal), { storage, isOnline: () => true });

    await expect(outbox.send(entry('client-aaaa'))).rejects.toThrow('Write a message or add a photo');
    expect(outbox.items.value).toEqual([]);
    expect(storage.data.has(KEY)).toBe(false);
  });

  it('When a waiting message is refused on a later try, then it stays marked refused with the reason until thrown away', async () => {
    const storage = fakeStorage();
    const waiting = useOutbox(KEY, vi.fn(), { storage, isOnline: () => false });
    await waiting.send(entry('client-aaaa'));
    const refusal = new ApiError(403, 'forbidden', 'This ticket is closed');
    const outbox = useOutbox(KEY, vi.fn().mockRejectedValue(refusal), { storage, isOnline: () => true });

    await outbox.flush();
    expect(outbox.items.value).toMatchObject([{ status: 'refused', error: 'This ticket is closed' }]);

    outbox.discard('client-aaaa');
    expect(outbox.items.value).toEqual([]);
    expect(storage.data.has(KEY)).toBe(false);
  });

  it('When the message arrives from the server some other way (catch-up after reconnect), then it is no longer waiting', async () => {
    const storage = fakeStorage();
    const deliver = vi.fn();
    const outbox = useOutbox(KEY, deliver, { storage, isOnline: () => false });
    await outbox.send(entry('client-aaaa'));
    await outbox.send(entry('client-bbbb'));

    outbox.settle([stored(entry('client-aaaa'), 5), { ...stored(entry('other-cccc'), 6), clientId: null }]);

    expect(outbox.items.value.map((i) => i.clientId)).toEqual(['client-bbbb']);
    expect(JSON.parse(storage.data.get(KEY)!)).toEqual([entry('client-bbbb')]);
    expect(deliver).not.toHaveBeenCalled();
  });

  it('When storage holds something unreadable, then the outbox starts empty', () => {
    const storage = fakeStorage();
    storage.setItem(KEY, '{not json');
    expect(useOutbox(KEY, vi.fn(), { storage }).items.value).toEqual([]);
  });
});
