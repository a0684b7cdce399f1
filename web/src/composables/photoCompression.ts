// Photos from a phone camera are 3-12 MB; on a job site's signal that is minutes per photo. They are
// made smaller in the browser before upload (the server still checks and resizes what arrives).
import libUrl from 'browser-image-compression/dist/browser-image-compression.js?url';

/** Types the browser can decode and re-encode; HEIC and PDF go up as they are. */
const COMPRESSIBLE = new Set(['image/jpeg', 'image/png', 'image/webp']);

export const COMPRESSION = {
  maxWidthOrHeight: 2560,
  maxSizeMB: 1,
  useWebWorker: true,
} as const;

/** A smaller copy of a photo, or the file itself when it cannot (or need not) be made smaller. */
export async function compressPhoto(file: File): Promise<File> {
  if (!COMPRESSIBLE.has(file.type)) return file;
  try {
    const { default: imageCompression } = await import('browser-image-compression');
    // The library's worker loads the library again by URL; by default from a CDN, which our CSP
    // (script-src 'self') blocks and a job site may not reach. Our own copy is served with the app.
    const smaller = await imageCompression(file, {
      ...COMPRESSION,
      libURL: new URL(libUrl, window.location.href).href,
    });
    if (smaller.size >= file.size) return file;
    return new File([smaller], file.name, {
      type: smaller.type || file.type,
      lastModified: file.lastModified,
    });
  } catch {
    return file;
  }
}
