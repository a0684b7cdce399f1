import { asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { attachments, ticketMessages } from '../../db/schema/index';
import { attachmentColumns, toAttachment } from '../tickets/messages.repository';

export async function insertAttachments(db: Executor, rows: (typeof attachments.$inferInsert)[]) {
  const inserted = await db.insert(attachments).values(rows).returning({ id: attachments.id });
  return inserted.map((r) => r.id);
}

export async function listByIds(db: Executor, ids: number[]) {
  const rows = await db
    .select(attachmentColumns)
    .from(attachments)
    .where(inArray(attachments.id, ids))
    .orderBy(asc(attachments.id));
  return rows.map(toAttachment);
}

/** A stored file with what decides who may read it: its ticket, uploader and the message kind. */
export async function findStored(db: Executor, id: number) {
  const [row] = await db
    .select({
      id: attachments.id,
      ticketId: attachments.ticketId,
      uploadedById: attachments.uploadedById,
      storageKey: attachments.storageKey,
      thumbnailKey: attachments.thumbnailKey,
      fileName: attachments.fileName,
      contentType: attachments.contentType,
      messageKind: ticketMessages.kind,
      messageId: attachments.messageId,
    })
    .from(attachments)
    .leftJoin(ticketMessages, eq(ticketMessages.id, attachments.messageId))
    .where(eq(attachments.id, id));
  return row;
}
