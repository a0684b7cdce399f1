import { computed, onScopeDispose, reactive, ref } from 'vue';
import { useI18n } from 'vue-i18n';
import type { Attachment } from '@shared/schemas/tickets';
import { ApiError, type UploadOptions } from '@/api/http';
import { ticketsApi } from '@/api/tickets';
import { compressPhoto } from './photoCompression';

/** What the upload endpoint takes (the server sniffs the bytes as well). */
export const ACCEPTED_TYPES = [
  'image/jpeg',
  'image/png',
  'image/webp',
  'image/heic',
  'image/heif',
  'application/pdf',
] as const;
export const MAX_FILE_BYTES = 15 * 1024 * 1024;
export const MAX_PHOTOS = 10;
/** Tries per photo before the person is asked; waits between them grow. */
export const MAX_TRIES = 3;
export const BACKOFF_MS = [1500, 4000] as const;

export type PhotoState = 'preparing' | 'ready' | 'uploading' | 'retrying' | 'done' | 'failed';

export interface PhotoItem {
  key: string;
  name: string;
  isImage: boolean;
  /** A local preview (object URL) until the upload is done. */
  previewUrl: string | null;
  state: PhotoState;
  /** 0 to 1 while uploading. */
  progress: number;
  attempt: number;
  error: string | null;
  attachment: Attachment | null;
}

export interface PhotoUploadDeps {
  upload?: (ticketId: number, file: File, options: UploadOptions) => Promise<Attachment>;
  compress?: (file: File) => Promise<File>;
  wait?: (ms: number) => Promise<void>;
  preview?: { create: (file: File) => string | null; revoke: (url: string) => void };
}

const defaultDeps: Required<PhotoUploadDeps> = {
  upload: async (ticketId, file, options) => {
    const { attachments } = await ticketsApi.upload(ticketId, [file], options);
    const [attachment] = attachments;
    if (!attachment) throw new ApiError(500, 'http_error', 'The server stored no file');
    return attachment;
  },
  compress: compressPhoto,
  wait: (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
  preview: {
    create: (file) => (/^image\/(jpeg|png|webp)$/.test(file.type) ? URL.createObjectURL(file) : null),
    revoke: (url) => URL.revokeObjectURL(url),
  },
};

/** A dropped connection or a server hiccup is worth another try; a refused file is not. */
export function isRetryable(error: unknown): boolean {
  if (!(error instanceof ApiError)) return false;
  return error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500;
}

let counter = 0;

/**
 * Photos and PDFs on their way to a ticket: each is made smaller, then uploaded on its own with its
 * progress, tried again after a dropped connection, and can be tried again by hand or removed.
 * Uploads start as soon as the ticket is known (`ticketId()` not null) or when `uploadAll` is called.
 */
export function usePhotoUpload(ticketId: () => number | null, deps: PhotoUploadDeps = {}) {
  const { t } = useI18n();
  const { upload, compress, wait, preview } = { ...defaultDeps, ...deps };
  const items = ref<PhotoItem[]>([]);
  const rejected = ref<string[]>([]);
  const files = new Map<string, File>();
  const controllers = new Map<string, AbortController>();
  let pumping: Promise<void> | null = null;

  const present = (item: PhotoItem) => files.has(item.key);

  function check(file: File): string | null {
    if (!(ACCEPTED_TYPES as readonly string[]).includes(file.type) && !/\.(heic|heif)$/i.test(file.name))
      return t('tickets.photos.wrongType', { name: file.name });
    if (file.size > MAX_FILE_BYTES) return t('tickets.photos.tooLarge', { name: file.name });
    return null;
  }

  /** Take the chosen files: check, make smaller, and upload when the ticket is known. */
  async function add(chosen: Iterable<File>): Promise<void> {
    rejected.value = [];
    const prepared: Promise<void>[] = [];
    for (const file of chosen) {
      const problem =
        items.value.length >= MAX_PHOTOS ? t('tickets.photos.tooMany', { max: MAX_PHOTOS }) : check(file);
      if (problem) {
        if (!rejected.value.includes(problem)) rejected.value.push(problem);
        continue;
      }
      const item = reactive<PhotoItem>({
        key: `p${++counter}`,
        name: file.name,
        isImage: file.type.startsWith('image/'),
        previewUrl: preview.create(file),
        state: 'preparing',
        progress: 0,
        attempt: 0,
        error: null,
        attachment: null,
      });
      files.set(item.key, file);
      items.value.push(item);
      prepared.push(
        compress(file).then((smaller) => {
          if (!present(item)) return;
          files.set(item.key, smaller);
          item.state = 'ready';
        }),
      );
    }
    await Promise.all(prepared);
    if (ticketId() !== null) await pump();
  }

  async function uploadOne(item: PhotoItem, id: number): Promise<void> {
    for (let attempt = 1; attempt <= MAX_TRIES; attempt++) {
      const file = files.get(item.key);
      if (!file) return;
      const controller = new AbortController();
      controllers.set(item.key, controller);
      Object.assign(item, { state: 'uploading', attempt, progress: 0, error: null });
      try {
        const attachment = await upload(id, file, {
          signal: controller.signal,
          onProgress: (sent) => (item.progress = sent),
        });
        Object.assign(item, { state: 'done', progress: 1, attachment });
        return;
      } catch (error) {
        if (!present(item)) return;
        const last = attempt === MAX_TRIES || !isRetryable(error);
        const message = error instanceof Error && error.message ? error.message : t('tickets.photos.failed');
        if (last) {
          Object.assign(item, { state: 'failed', error: message });
          return;
        }
        item.state = 'retrying';
        await wait(BACKOFF_MS[attempt - 1] ?? BACKOFF_MS.at(-1)!);
        if (!present(item)) return;
      } finally {
        controllers.delete(item.key);
      }
    }
  }

  async function drain(id: number): Promise<void> {
    for (let next = items.value.find((i) => i.state === 'ready'); next;) {
      await uploadOne(next, id);
      next = items.value.find((i) => i.state === 'ready');
    }
  }

  /** Upload what is ready, one at a time; resolves when nothing is left waiting. */
  async function pump(id = ticketId()): Promise<void> {
    if (id === null) return;
    if (pumping) return pumping;
    pumping = drain(id);
    try {
      await pumping;
    } finally {
      pumping = null;
    }
    // Something was added or retried while the last one finished.
    if (items.value.some((i) => i.state === 'ready')) await pump(id);
  }

  /** Upload everything not yet uploaded (failed ones again); true when all are done. */
  async function uploadAll(id: number): Promise<boolean> {
    for (const item of items.value) if (item.state === 'failed') item.state = 'ready';
    await pump(id);
    return items.value.every((i) => i.state === 'done');
  }

  /** "Try again" after the automatic tries gave up. */
  function retry(key: string): Promise<void> {
    const item = items.value.find((i) => i.key === key);
    if (!item || item.state !== 'failed') return Promise.resolve();
    item.state = 'ready';
    return pump();
  }

  function forget(item: PhotoItem): void {
    controllers.get(item.key)?.abort();
    controllers.delete(item.key);
    files.delete(item.key);
    if (item.previewUrl) preview.revoke(item.previewUrl);
  }

  /** Take a photo out before sending (an upload on its way is stopped). */
  function remove(key: string): void {
    const item = items.value.find((i) => i.key === key);
    if (!item) return;
    forget(item);
    items.value = items.value.filter((i) => i.key !== key);
  }

  /** After the message is sent: start over with no photos. */
  function clear(): void {
    for (const item of items.value) forget(item);
    items.value = [];
    rejected.value = [];
  }

  onScopeDispose(clear);

  const attachments = computed(() =>
    items.value.flatMap((i) => (i.state === 'done' && i.attachment ? [i.attachment] : [])),
  );
  const busy = computed(() => items.value.some((i) => i.state !== 'done' && i.state !== 'failed'));
  const failed = computed(() => items.value.some((i) => i.state === 'failed'));

  return { items, rejected, attachments, busy, failed, add, retry, remove, clear, uploadAll };
}
