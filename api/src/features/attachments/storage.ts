import { mkdir, readFile, rm, writeFile, rename } from 'node:fs/promises';
import { dirname, join, resolve, sep } from 'node:path';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

/** Where stored files live. Keys are random; nothing here is served without an authorization check. */
export interface FileStorage {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
}

/** Local disk (the default): a folder outside the web root. */
export class DiskStorage implements FileStorage {
  private readonly root: string;
  constructor(root: string) {
    this.root = resolve(root);
  }
  private path(key: string) {
    const p = resolve(this.root, key);
    if (!p.startsWith(this.root + sep)) throw new Error('storage key escapes the storage folder');
    return p;
  }
  async put(key: string, body: Buffer, _contentType?: string) {
    const p = this.path(key);
    await mkdir(dirname(p), { recursive: true });
    // Write then rename, so a reader never sees half a file.
    const tmp = `${p}.${process.pid}.tmp`;
    await writeFile(tmp, body);
    await rename(tmp, p);
  }
  get(key: string) {
    return readFile(this.path(key));
  }
  async remove(key: string) {
    await rm(this.path(key), { force: true });
  }
}

/** Any S3-compatible object store, through the official client. */
export class S3Storage implements FileStorage {
  constructor(
    private readonly client: S3Client,
    private readonly bucket: string,
  ) {}
  static fromConfig(c: {
    endpoint?: string;
    region: string;
    bucket: string;
    accessKeyId?: string;
    secretAccessKey?: string;
  }) {
    const client = new S3Client({
      region: c.region,
      ...(c.endpoint ? { endpoint: c.endpoint, forcePathStyle: true } : {}),
      ...(c.accessKeyId && c.secretAccessKey
        ? { credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey } }
        : {}),
    });
    return new S3Storage(client, c.bucket);
  }
  async put(key: string, body: Buffer, contentType: string) {
    await this.client.send(
      new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: body, ContentType: contentType }),
    );
  }
  async get(key: string) {
    const res = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
    return Buffer.from(await res.Body!.transformToByteArray());
  }
  async remove(key: string) {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }
}

export function storageKey(...parts: string[]) {
  return join(...parts)
    .split(sep)
    .join('/');
}
