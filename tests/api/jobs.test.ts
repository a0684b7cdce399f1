// The job queue is pg-boss on the test database: a job sent in a rolled-back transaction is never
// run, one sent in a committed one runs once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import type { RunningServer } from '../../api/src/server';
import { startTestServer } from '../support/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

describe('job queue', () => {
  it('runs a job committed with its transaction, and never one that rolled back', async () => {
    const { jobs, db } = server.ctx;
    const queue = `test.jobs.${Date.now()}`;
    const seen: string[] = [];
    await jobs.work<{ word: string }>(queue, async (data) => {
      seen.push(data.word);
    });
    await db
      .transaction(async (tx) => {
        await jobs.send(queue, { word: 'rolled-back' }, {}, tx);
        await tx.execute(sql`select 1`);
        throw new Error('roll back');
      })
      .catch(() => {});
    await db.transaction(async (tx) => {
      await jobs.send(queue, { word: 'committed' }, {}, tx);
    });
    await jobs.drain(queue);
    expect(seen).toEqual(['committed']);
  });
});
