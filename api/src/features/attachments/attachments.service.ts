import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../context';
import type { Attachment, SessionUser } from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { can } from '../../lib/policies';
import { loadScope } from '../tickets/tickets.service';
import * as repo from './attachments.repository';
import { processUpload, sniff, type ProcessedFile } from './images';
import { storageKey } from './storage';

export interface IncomingFile {
  originalname: string;
  buffer: Buffer;
}

/** All or nothing: every file is checked and processed before any is stored. */
export async function uploadAttachments(
  ctx: AppContext,
  user: SessionUser,
  ticketId: number,
  files: IncomingFile[],
): Promise<Attachment[]> {
  await loadScope(ctx.db, user, ticketId);
  if (files.length === 0) throw AppError.validation({ files: 'Add at least one file' });
  const types = await Promise.all(files.map((f) => sniff(f.buffer)));
  const processed: ProcessedFile[] = [];
  for (let i = 0; i < files.length; i++) processed.push(await processUpload(files[i]!.buffer, types[i]!));

  const stored: string[] = [];
  try {
    const rows: Parameters<typeof repo.insertAttachments>[1] = [];
    for (let i = 0; i < processed.length; i++) {
      const p = processed[i]!;
      const base = storageKey('tickets', String(ticketId), randomUUID());
      const key = `${base}.${p.extension}`;
      await ctx.storage.put(key, p.body, p.contentType);
      stored.push(key);
      let thumbnailKey: string | null = null;
      if (p.thumbnail) {
        thumbnailKey = `${base}.thumb.jpg`;
        await ctx.storage.put(thumbnailKey, p.thumbnail, 'image/jpeg');
        stored.push(thumbnailKey);
      }
      rows.push({
        ticketId,
        uploadedById: user.id,
        storageKey: key,
        fileName: safeName(files[i]!.originalname, p.extension),
        contentType: p.contentType,
        bytes: p.body.length,
        width: p.width,
        height: p.height,
        thumbnailKey,
        sha256: p.sha256,
      });
    }
    const ids = await ctx.db.transaction((tx) => repo.insertAttachments(tx, rows));
    return repo.listByIds(ctx.db, ids);
  } catch (err) {
    await Promise.all(stored.map((k) => ctx.storage.remove(k).catch(() => {})));
    throw err;
  }
}

/** The file's bytes for someone who may see its ticket (and its message, for internal notes). */
export async function readAttachment(
  ctx: AppContext,
  user: SessionUser | undefined,
  id: number,
  variant: 'full' | 'thumb',
) {
  const row = await repo.findStored(ctx.db, id);
  if (!row) throw AppError.notFound('File');
  await loadScope(ctx.db, user, row.ticketId);
  const isNote = row.messageKind === 'internal-note';
  const unsent = row.messageId === null;
  if (
    (isNote && !can(user, 'note.view')) ||
    (unsent && row.uploadedById !== user!.id && !can(user, 'note.view'))
  ) {
    throw AppError.notFound('File');
  }
  const key = variant === 'thumb' ? row.thumbnailKey : row.storageKey;
  if (!key) throw AppError.notFound('Thumbnail');
  return {
    body: await ctx.storage.get(key),
    contentType: variant === 'thumb' ? 'image/jpeg' : row.contentType,
    fileName: row.fileName,
  };
}

/** The name people see: the uploaded base name, tamed, with the extension of what we stored. */
export function safeName(original: string, extension: string) {
  const base =
    original
      .replace(/\.[^.]*$/, '')
      .replace(/[^\p{L}\p{N} ._-]+/gu, '')
      .trim()
      .slice(0, 80) || 'photo';
  return `${base}.${extension}`;
}
