// @vitest-environment happy-dom
import { describe, expect, it, vi } from 'vitest';
import { defineComponent } from 'vue';
import { mount } from '@vue/test-utils';
import type { Attachment } from '@shared/schemas/tickets';
import { ApiError, type UploadOptions } from '@/api/http';
import { i18n } from '@/i18n';
import { BACKOFF_MS, MAX_FILE_BYTES, usePhotoUpload, type PhotoUploadDeps } from './usePhotoUpload';

const attachment = (id: number, fileName: string): Attachment => ({
  id,
  ticketId: 42,
  messageId: null,
  fileName,
  contentType: 'image/jpeg',
  bytes: 1000,
  width: 800,
  height: 600,
  hasThumbnail: true,
  url: `/api/attachments/${id}`,
  thumbnailUrl: `/api/attachments/${id}/thumb`,
  createdAt: '2026-03-04T15:00:00Z',
});

const photo = (name = 'rating-plate.jpg', type = 'image/jpeg', bytes = 3000) =>
  new File([new Uint8Array(bytes)], name, { type });

const dropped = () => new ApiError(0, 'network_error', 'No connection');

function setup(deps: PhotoUploadDeps, ticketId: number | null = 42) {
  const waits: number[] = [];
  let photos!: ReturnType<typeof usePhotoUpload>;
  const wrapper = mount(
    defineComponent({
      setup() {
        photos = usePhotoUpload(() => ticketId, {
          compress: async (f) => f,
          wait: async (ms) => void waits.push(ms),
          preview: { create: () => null, revoke: () => undefined },
          ...deps,
        });
        return () => null;
      },
    }),
    { global: { plugins: [i18n] } },
  );
  return { photos, waits, wrapper };
}

describe('photo upload', () => {
  it('When a photo is chosen for a known ticket, then the smaller copy is uploaded with its progress and becomes an attachment', async () => {
    const smaller = photo('rating-plate.jpg', 'image/jpeg', 10);
    const progress: number[] = [];
    const upload = vi.fn(async (_id: number, file: File, options: UploadOptions) => {
      for (const p of [0.25, 0.5, 1]) {
        options.onProgress?.(p);
        progress.push(photos.items.value[0]!.progress);
      }
      return attachment(5, file.name);
    });
    const { photos } = setup({ upload, compress: async () => smaller });

    await photos.add([photo()]);

    expect(upload).toHaveBeenCalledTimes(1);
    expect(upload.mock.calls[0]![0]).toBe(42);
    expect(upload.mock.calls[0]![1]).toBe(smaller);
    expect(progress).toEqual([0.25, 0.5, 1]);
    expect(photos.items.value[0]).toMatchObject({ state: 'done', progress: 1, attempt: 1 });
    expect(photos.attachments.value.map((a) => a.id)).toEqual([5]);
    expect(photos.busy.value).toBe(false);
  });

  it('When the upload breaks off twice, then it is tried again by itself, waiting longer each time, and the third try lands', async () => {
    const upload = vi
      .fn<NonNullable<PhotoUploadDeps['upload']>>()
      .mockRejectedValueOnce(dropped())
      .mockRejectedValueOnce(new ApiError(503, 'unavailable', 'Try later'))
      .mockResolvedValue(attachment(6, 'board.jpg'));
    const { photos, waits } = setup({ upload });

    await photos.add([photo('board.jpg')]);

    expect(upload).toHaveBeenCalledTimes(3);
    expect(waits).toEqual([BACKOFF_MS[0], BACKOFF_MS[1]]);
    expect(photos.items.value[0]).toMatchObject({ state: 'done', attempt: 3 });
  });

  it('When all three tries fail, then the photo shows as failed, and "Try again" uploads it', async () => {
    const upload = vi
      .fn<NonNullable<PhotoUploadDeps['upload']>>()
      .mockRejectedValueOnce(dropped())
      .mockRejectedValueOnce(dropped())
      .mockRejectedValueOnce(dropped())
      .mockResolvedValue(attachment(7, 'board.jpg'));
    const { photos } = setup({ upload });

    await photos.add([photo('board.jpg')]);
    expect(upload).toHaveBeenCalledTimes(3);
    expect(photos.items.value[0]).toMatchObject({ state: 'failed', error: 'No connection' });
    expect(photos.failed.value).toBe(true);
    expect(photos.attachments.value).toEqual([]);

    await photos.retry(photos.items.value[0]!.key);
    expect(upload).toHaveBeenCalledTimes(4);
    expect(photos.items.value[0]).toMatchObject({ state: 'done' });
    expect(photos.attachments.value.map((a) => a.id)).toEqual([7]);
  });

  it('When the server refuses the file, then it is not tried again by itself and its reason is shown', async () => {
    const refusal = new ApiError(415, 'unsupported_type', 'Only photos and PDFs');
    const upload = vi.fn<NonNullable<PhotoUploadDeps['upload']>>().mockRejectedValue(refusal);
    const { photos, waits } = setup({ upload });

    await photos.add([photo()]);

    expect(upload).toHaveBeenCalledTimes(1);
    expect(waits).toEqual([]);
    expect(photos.items.value[0]).toMatchObject({ state: 'failed', error: 'Only photos and PDFs' });
  });

  it('When a photo is removed while it uploads, then its upload is stopped and it is not sent', async () => {
    let signal: AbortSignal | undefined;
    const upload = vi.fn(
      (_id: number, _file: File, options: UploadOptions) =>
        new Promise<Attachment>((_resolve, reject) => {
          signal = options.signal;
          options.signal?.addEventListener('abort', () => reject(new DOMException('stopped', 'AbortError')));
        }),
    );
    const { photos } = setup({ upload });

    const adding = photos.add([photo()]);
    await vi.waitFor(() => expect(upload).toHaveBeenCalled());
    photos.remove(photos.items.value[0]!.key);
    await adding;

    expect(signal?.aborted).toBe(true);
    expect(upload).toHaveBeenCalledTimes(1);
    expect(photos.items.value).toEqual([]);
    expect(photos.attachments.value).toEqual([]);
  });

  it('When a file is not a photo or PDF, or is over 15 MB, then it is turned away with a reason and nothing is uploaded', async () => {
    const upload = vi.fn();
    const { photos } = setup({ upload });

    await photos.add([
      photo('notes.txt', 'text/plain'),
      photo('huge.jpg', 'image/jpeg', MAX_FILE_BYTES + 1),
      photo('manual.pdf', 'application/pdf'),
    ]);

    expect(photos.rejected.value).toEqual([
      'notes.txt: only photos (JPEG, PNG, WebP, HEIC) and PDFs can be added',
      'huge.jpg is larger than 15 MB',
    ]);
    expect(photos.items.value.map((i) => i.name)).toEqual(['manual.pdf']);
    expect(upload).toHaveBeenCalledTimes(1);
  });

  it('When the ticket does not exist yet, then photos wait until uploadAll is given its id, and go one after another', async () => {
    const order: string[] = [];
    const upload = vi.fn(async (id: number, file: File) => {
      order.push(`${id}:${file.name}`);
      return attachment(order.length, file.name);
    });
    const { photos } = setup({ upload }, null);

    await photos.add([photo('a.jpg'), photo('b.png', 'image/png')]);
    expect(upload).not.toHaveBeenCalled();
    expect(photos.items.value.map((i) => i.state)).toEqual(['ready', 'ready']);

    expect(await photos.uploadAll(99)).toBe(true);
    expect(order).toEqual(['99:a.jpg', '99:b.png']);
  });
});
