import { and, asc, eq, gt, inArray, isNull, lte, ne, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import { attachments, ticketMessages, users } from '../../db/schema/index';
import type { Attachment, Message } from '../../../../shared/src/index';

export const attachmentColumns = {
  id: attachments.id,
  ticketId: attachments.ticketId,
  messageId: attachments.messageId,
  fileName: attachments.fileName,
  contentType: attachments.contentType,
  bytes: attachments.bytes,
  width: attachments.width,
  height: attachments.height,
  thumbnailKey: attachments.thumbnailKey,
  createdAt: isoTime(attachments.createdAt),
};

export function toAttachment(
  row: { thumbnailKey: string | null } & Omit<Attachment, 'hasThumbnail' | 'url' | 'thumbnailUrl'>,
): Attachment {
  const { thumbnailKey, ...rest } = row;
  return {
    ...rest,
    hasThumbnail: !!thumbnailKey,
    url: `/api/attachments/${row.id}`,
    thumbnailUrl: thumbnailKey ? `/api/attachments/${row.id}/thumb` : null,
  };
}

const messageColumns = {
  id: ticketMessages.id,
  ticketId: ticketMessages.ticketId,
  clientId: ticketMessages.clientId,
  kind: ticketMessages.kind,
  body: ticketMessages.body,
  data: ticketMessages.data,
  partOfAnswer: ticketMessages.partOfAnswer,
  authorId: users.id,
  authorName: users.name,
  authorRole: users.role,
  createdAt: isoTime(ticketMessages.createdAt),
  deliveredAt: isoTime(ticketMessages.deliveredAt),
  readAt: isoTime(ticketMessages.readAt),
};

async function withAttachments(
  db: Executor,
  rows: Awaited<ReturnType<typeof selectMessages>>,
): Promise<Message[]> {
  const ids = rows.map((r) => r.id);
  const files = ids.length
    ? await db
        .select(attachmentColumns)
        .from(attachments)
        .where(inArray(attachments.messageId, ids))
        .orderBy(asc(attachments.id))
    : [];
  return rows.map(({ authorId, authorName, authorRole, ...m }) => ({
    ...m,
    author: authorId ? { id: authorId, name: authorName!, role: authorRole! } : null,
    attachments: files.filter((f) => f.messageId === m.id).map(toAttachment),
  }));
}

function selectMessages(db: Executor) {
  return db
    .select(messageColumns)
    .from(ticketMessages)
    .leftJoin(users, eq(users.id, ticketMessages.authorId));
}

/** Oldest first; without internal notes unless asked for. */
export async function listMessages(
  db: Executor,
  ticketId: number,
  opts: { after?: number; limit: number; includeNotes: boolean },
): Promise<Message[]> {
  const rows = await selectMessages(db)
    .where(
      and(
        eq(ticketMessages.ticketId, ticketId),
        opts.after ? gt(ticketMessages.id, opts.after) : undefined,
        opts.includeNotes ? undefined : ne(ticketMessages.kind, 'internal-note'),
      ),
    )
    .orderBy(asc(ticketMessages.id))
    .limit(opts.limit);
  return withAttachments(db, rows);
}

export async function findMessage(db: Executor, id: number): Promise<Message | undefined> {
  const rows = await selectMessages(db).where(eq(ticketMessages.id, id));
  return (await withAttachments(db, rows))[0];
}

/** Inserts unless this device already sent this clientId on this ticket; returns the id and whether it is new. */
export async function insertMessageOnce(
  db: Executor,
  values: {
    ticketId: number;
    authorId: number | null;
    kind: Message['kind'];
    body: string;
    clientId: string | null;
    data?: Record<string, unknown> | null;
  },
): Promise<{ id: number; created: boolean; createdAt?: string }> {
  const [row] = await db
    .insert(ticketMessages)
    .values(values)
    .onConflictDoNothing({ target: [ticketMessages.ticketId, ticketMessages.clientId] })
    .returning({ id: ticketMessages.id, createdAt: isoTime(ticketMessages.createdAt) });
  if (row) return { id: row.id, created: true, createdAt: row.createdAt };
  const [existing] = await db
    .select({ id: ticketMessages.id })
    .from(ticketMessages)
    .where(and(eq(ticketMessages.ticketId, values.ticketId), eq(ticketMessages.clientId, values.clientId!)));
  return { id: existing!.id, created: false };
}

/** Links uploaded files to their message; only the uploader's own unlinked files of this ticket. */
export async function linkAttachments(
  db: Executor,
  messageId: number,
  ticketId: number,
  userId: number,
  ids: number[],
) {
  if (!ids.length) return 0;
  const linked = await db
    .update(attachments)
    .set({ messageId })
    .where(
      and(
        inArray(attachments.id, ids),
        eq(attachments.ticketId, ticketId),
        eq(attachments.uploadedById, userId),
        isNull(attachments.messageId),
      ),
    )
    .returning({ id: attachments.id });
  return linked.length;
}

export async function markRead(db: Executor, ticketId: number, upToId: number, readerIsStaff: boolean) {
  // A reader marks what the other side wrote.
  const rows = await db
    .update(ticketMessages)
    .set({ readAt: new Date(), deliveredAt: sql`coalesce(${ticketMessages.deliveredAt}, now())` })
    .where(
      and(
        eq(ticketMessages.ticketId, ticketId),
        lte(ticketMessages.id, upToId),
        isNull(ticketMessages.readAt),
        ne(ticketMessages.kind, 'event'),
        sql`${ticketMessages.authorId} in (select id from users where (role = 'contractor') = ${readerIsStaff})`,
      ),
    )
    .returning({ id: ticketMessages.id });
  return rows.map((r) => r.id);
}

/** Marks a chat message or note of this ticket as part of the answer (or not); undefined when there is none. */
export async function setPartOfAnswer(db: Executor, ticketId: number, messageId: number, value: boolean) {
  const [row] = await db
    .update(ticketMessages)
    .set({ partOfAnswer: value })
    .where(
      and(
        eq(ticketMessages.id, messageId),
        eq(ticketMessages.ticketId, ticketId),
        ne(ticketMessages.kind, 'event'),
      ),
    )
    .returning({ id: ticketMessages.id });
  return row;
}

export async function markDelivered(db: Executor, id: number) {
  await db
    .update(ticketMessages)
    .set({ deliveredAt: new Date() })
    .where(and(eq(ticketMessages.id, id), isNull(ticketMessages.deliveredAt)));
}
