// The file storage contract. Disk runs for real here; S3 cannot run on this machine, so its
// implementation is checked against the S3 HTTP API contract (the requests the official client
// builds and the answers it maps), and against a real endpoint when S3_ENDPOINT and S3_BUCKET are set.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { S3Client } from '@aws-sdk/client-s3';
import { DiskStorage, S3Storage, type FileStorage } from '../../api/src/features/attachments/storage';

async function contract(storage: FileStorage) {
  const key = `tickets/1/contract-${Date.now()}.jpg`;
  const body = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3]);
  await storage.put(key, body, 'image/jpeg');
  expect(Buffer.compare(await storage.get(key), body)).toBe(0);
  await storage.remove(key);
  await expect(storage.get(key)).rejects.toThrow();
}

describe('disk storage', () => {
  const dir = mkdtempSync(join(tmpdir(), 'lightoff-storage-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('When a file is put, read and removed, then it comes back byte for byte and is gone after', async () => {
    await contract(new DiskStorage(dir));
  });

  it('When a key tries to leave the storage folder, then it is refused', async () => {
    await expect(new DiskStorage(dir).put('../escape.txt', Buffer.from('x'), 'text/plain')).rejects.toThrow(
      /escapes/,
    );
  });
});

/** An S3 endpoint on paper: records each request the client builds and answers as S3 does. */
function recordingClient() {
  const requests: { method: string; path: string; headers: Record<string, string>; body: Buffer }[] = [];
  const objects = new Map<string, Uint8Array>();
  const client = new S3Client({
    region: 'us-east-1',
    endpoint: 'http://s3.test.invalid',
    forcePathStyle: true,
    credentials: { accessKeyId: 'test', secretAccessKey: 'test' },
    requestHandler: {
      async handle(request: {
        method: string;
        path: string;
        headers: Record<string, string>;
        body?: unknown;
      }) {
        const chunks: Buffer[] = [];
        const b = request.body;
        if (b instanceof Uint8Array) chunks.push(Buffer.from(b));
        else if (typeof b === 'string') chunks.push(Buffer.from(b));
        else if (b && typeof (b as Readable).on === 'function')
          for await (const c of b as Readable) chunks.push(Buffer.from(c));
        const body = Buffer.concat(chunks);
        requests.push({ method: request.method, path: request.path, headers: request.headers, body });
        const ok = (status: number, payload = Buffer.alloc(0), headers: Record<string, string> = {}) => ({
          response: { statusCode: status, headers, body: Readable.from([payload]) },
        });
        if (request.method === 'PUT') {
          objects.set(request.path, body);
          return ok(200, Buffer.alloc(0), { etag: '"1"' });
        }
        if (request.method === 'GET') {
          const found = objects.get(request.path);
          return found
            ? ok(200, Buffer.from(found), {
                'content-type': 'image/jpeg',
                'content-length': String(found.length),
              })
            : ok(404, Buffer.from('<Error><Code>NoSuchKey</Code><Message>missing</Message></Error>'), {
                'content-type': 'application/xml',
              });
        }
        if (request.method === 'DELETE') {
          objects.delete(request.path);
          return ok(204);
        }
        return ok(400);
      },
    } as never,
  });
  return { client, requests };
}

describe('S3 storage against the S3 API contract', () => {
  it('When a file is stored, read and removed, then the client sends PUT, GET and DELETE on /bucket/key with the content type', async () => {
    const { client, requests } = recordingClient();
    await contract(new S3Storage(client, 'lightoff-files'));
    expect(requests.map((r) => r.method)).toEqual(['PUT', 'GET', 'DELETE', 'GET']);
    const put = requests[0]!;
    expect(put.path).toMatch(/^\/lightoff-files\/tickets\/1\/contract-\d+\.jpg$/);
    expect(put.headers['content-type']).toBe('image/jpeg');
    expect(put.headers.authorization).toMatch(/^AWS4-HMAC-SHA256 Credential=test\//);
  });

  it.runIf(process.env.S3_ENDPOINT && process.env.S3_BUCKET)(
    'When a real S3-compatible endpoint is configured, then the same contract holds there',
    async () => {
      await contract(
        S3Storage.fromConfig({
          endpoint: process.env.S3_ENDPOINT,
          region: process.env.S3_REGION ?? 'us-east-1',
          bucket: process.env.S3_BUCKET!,
          accessKeyId: process.env.S3_ACCESS_KEY_ID,
          secretAccessKey: process.env.S3_SECRET_ACCESS_KEY,
        }),
      );
    },
  );
});
