import { createHash } from 'node:crypto';
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import decodeHeic from 'heic-decode';
import { AppError } from '../../lib/errors';

export const MAX_FILE_BYTES = 15 * 1024 * 1024;
export const MAX_FILES = 10;
const MAX_LONG_SIDE = 2560;
const THUMB_SIDE = 320;
/** Refuse decompression bombs: about 50 megapixels is past any phone camera. */
const MAX_INPUT_PIXELS = 50_000_000;

const ALLOWED = new Set([
  'image/jpeg',
  'image/png',
  'image/webp',
  'image/heic',
  'image/heif',
  'application/pdf',
]);

export interface ProcessedFile {
  body: Buffer;
  contentType: string;
  extension: string;
  width: number | null;
  height: number | null;
  thumbnail: Buffer | null;
  sha256: string;
}

/** What the bytes are, whatever the name says. */
export async function sniff(buffer: Buffer): Promise<string> {
  const type = await fileTypeFromBuffer(buffer);
  if (!type || !ALLOWED.has(type.mime)) {
    throw new AppError(
      'unsupported_media_type',
      'Send photos (JPEG, PNG, WebP, HEIC) or PDF files only',
      415,
    );
  }
  return type.mime;
}

/**
 * Images are decoded and re-encoded: orientation applied, every bit of metadata (EXIF, GPS, serials)
 * dropped, long side at most 2560 px, and a 320 px thumbnail. PDFs are kept as they are.
 */
export async function processUpload(buffer: Buffer, mime: string): Promise<ProcessedFile> {
  if (mime === 'application/pdf') {
    return {
      body: buffer,
      contentType: mime,
      extension: 'pdf',
      width: null,
      height: null,
      thumbnail: null,
      sha256: sha256(buffer),
    };
  }
  try {
    const input =
      mime === 'image/heic' || mime === 'image/heif'
        ? await heicToSharp(buffer)
        : sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS });
    const keepsAlpha = mime === 'image/png' || mime === 'image/webp';
    const pipeline = input
      .rotate()
      .resize({ width: MAX_LONG_SIDE, height: MAX_LONG_SIDE, fit: 'inside', withoutEnlargement: true });
    const encoded = keepsAlpha
      ? pipeline.webp({ quality: 85 })
      : pipeline.jpeg({ quality: 85, mozjpeg: true });
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
    const thumbnail = await sharp(data)
      .resize({ width: THUMB_SIDE, height: THUMB_SIDE, fit: 'inside' })
      .jpeg({ quality: 75 })
      .toBuffer();
    return {
      body: data,
      contentType: keepsAlpha ? 'image/webp' : 'image/jpeg',
      extension: keepsAlpha ? 'webp' : 'jpg',
      width: info.width,
      height: info.height,
      thumbnail,
      sha256: sha256(data),
    };
  } catch (err) {
    if (err instanceof AppError) throw err;
    const message = String((err as Error).message ?? '');
    if (/pixel limit/i.test(message)) {
      throw new AppError('payload_too_large', 'This image has too many pixels to process', 413);
    }
    throw new AppError(
      'unsupported_media_type',
      'This image could not be read; try another photo',
      415,
      undefined,
      { cause: err },
    );
  }
}

async function heicToSharp(buffer: Buffer) {
  const image = await decodeHeic({ buffer });
  if (image.width * image.height > MAX_INPUT_PIXELS) {
    throw new AppError('payload_too_large', 'This image has too many pixels to process', 413);
  }
  return sharp(Buffer.from(image.data.buffer, image.data.byteOffset, image.data.byteLength), {
    raw: { width: image.width, height: image.height, channels: 4 },
  });
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
