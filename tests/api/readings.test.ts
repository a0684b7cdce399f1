import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { closeTestDb, makeEquipmentModel, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import { ticketWorld } from '../support/tickets';
import { equipmentModels } from '../../api/src/db/schema/index';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const twoStageSpec = {
  staging: 'two-stage',
  inputBtuh: { high: 80_000, low: 52_000 },
  afuePct: 96,
  riseRangeF: { min: 30, max: 60 },
  fuels: {
    'natural-gas': {
      inletMinInWc: 4.5,
      inletMaxInWc: 10.5,
      manifold: [
        { stage: 'high', targetInWc: 3.5, toleranceInWc: 0.3 },
        { stage: 'low', targetInWc: 1.7, toleranceInWc: 0.2 },
      ],
    },
  },
};

async function worldWithSpec() {
  const model = await makeEquipmentModel();
  await testDb()
    .db.update(equipmentModels)
    .set({ spec: twoStageSpec })
    .where(eq(equipmentModels.id, model.id));
  return ticketWorld(server, { modelText: undefined, equipmentModelId: model.id });
}

describe('readings on a ticket', () => {
  it('When a contractor enters manifold readings, then the verdicts use the unit spec and a result card lands in the chat', async () => {
    const { ticket, contractorClient, techClient } = await worldWithSpec();
    const res = await contractorClient.post(`/api/tickets/${ticket.id}/readings`, {
      kind: 'gas-pressure',
      values: {
        inletStaticInWc: 7,
        inletUnderFireInWc: 6.6,
        manifold: [
          { stage: 'high', valueInWc: 3.5 },
          { stage: 'low', valueInWc: 2.1 },
        ],
      },
    });
    expect(res.status).toBe(201);
    expect(res.body.reading).toMatchObject({ kind: 'gas-pressure', verdict: 'high' });
    const low = res.body.reading.result.items.find((i: { name: string }) => i.name === 'manifold-low');
    expect(low).toMatchObject({ verdict: 'high', adjust: 'lower', targetInWc: 1.7 });
    expect(res.body.reading.result.specSource).toBe('model');
    const thread = await techClient.get(`/api/tickets/${ticket.id}/messages`).expect(200);
    const card = thread.body.items.find((m: { kind: string }) => m.kind === 'event');
    expect(card.data).toMatchObject({ type: 'reading', readingId: res.body.reading.id, verdict: 'high' });
    const list = await techClient.get(`/api/tickets/${ticket.id}/readings`).expect(200);
    expect(list.body.items.map((r: { id: number }) => r.id)).toEqual([res.body.reading.id]);
  });

  it('When supply and return temperatures are entered, then the rise and airflow are judged against the rated range', async () => {
    const { ticket, contractorClient } = await worldWithSpec();
    // 80,000 × 0.96 = 76,800 Btu/h at a 70 °F rise → 1,016 cfm; 70 is over the 30–60 range.
    const res = await contractorClient.post(`/api/tickets/${ticket.id}/readings`, {
      kind: 'temperature-rise',
      values: { supplyF: 140, returnF: 70 },
    });
    expect(res.body.reading.result).toMatchObject({ riseF: 70, airflowCfm: 1016, verdict: 'high' });
  });

  it('When a reading is impossible, then 400 names the field and nothing is stored', async () => {
    const { ticket, contractorClient } = await worldWithSpec();
    const res = await contractorClient.post(`/api/tickets/${ticket.id}/readings`, {
      kind: 'co-air-free',
      values: { coPpm: 40, o2Pct: 21 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['values.o2Pct']);
    const list = await contractorClient.get(`/api/tickets/${ticket.id}/readings`).expect(200);
    expect(list.body.items).toEqual([]);
  });

  it('When another account posts or reads readings, then 404', async () => {
    const { ticket } = await worldWithSpec();
    const stranger = await signedInClient(server, await makeUser());
    expect((await stranger.get(`/api/tickets/${ticket.id}/readings`)).status).toBe(404);
    const post = await stranger.post(`/api/tickets/${ticket.id}/readings`, {
      kind: 'co-air-free',
      values: { coPpm: 40, o2Pct: 6 },
    });
    expect(post.status).toBe(404);
  });
});
