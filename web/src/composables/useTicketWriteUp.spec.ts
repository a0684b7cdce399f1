import { describe, expect, it } from 'vitest';
import type { Attachment, Message } from '@shared/schemas/tickets';
import { choicesOf } from './useTicketWriteUp';

// Invented demo data; only the fields the helper reads matter.
function attachment(id: number, contentType: string): Attachment {
  return {
    id,
    ticketId: 1,
    messageId: 1,
    fileName: `file-${id}`,
    contentType,
    bytes: 100,
    width: null,
    height: null,
    hasThumbnail: contentType.startsWith('image/'),
    url: `/api/attachments/${id}`,
    thumbnailUrl: null,
    createdAt: '2026-03-04T15:00:00Z',
  };
}
function message(id: number, kind: Message['kind'], body: string, attachments: Attachment[] = []): Message {
  return {
    id,
    ticketId: 1,
    clientId: null,
    kind,
    body,
    author: { id: 2, name: 'Rowan Fielding', role: 'contractor' },
    attachments,
    createdAt: '2026-03-04T15:00:00Z',
    deliveredAt: null,
    readAt: null,
  };
}

describe('write-up choices', () => {
  it('When the thread has messages, notes, reading cards and files, then messages and notes with text and only the photos are offered', () => {
    const thread = [
      message(1, 'message', 'Low fire drops out', [
        attachment(10, 'image/jpeg'),
        attachment(11, 'application/pdf'),
      ]),
      message(2, 'event', 'Gas pressure: low — see the result'),
      message(3, 'internal-note', 'Check the bulletin'),
      message(4, 'message', '   ', [attachment(12, 'image/webp')]),
    ];
    const { messages, photos } = choicesOf(thread);
    expect(messages.map((m) => m.id)).toEqual([1, 3]);
    expect(photos.map((a) => a.id)).toEqual([10, 12]);
  });
});
