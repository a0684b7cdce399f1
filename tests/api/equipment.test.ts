import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeEquipmentModel, makeUser } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const spec = {
  staging: 'two-stage',
  inputBtuh: { high: 80_000, low: 52_000 },
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

describe('equipment catalogue and spec tables', () => {
  it('When a model number is searched without its dash, then it is found', async () => {
    const model = await makeEquipmentModel({ modelNumber: `ZQ-${Date.now() % 100000}` });
    const client = await signedInClient(server, await makeUser());
    const res = await client.get(`/api/equipment?q=${model.modelNumber.replace('-', '')}`).expect(200);
    expect(res.body.items.map((m: { id: number }) => m.id)).toContain(model.id);
  });

  it('When a specialist saves a spec, then anyone reads it back and the gas check judges by it', async () => {
    const model = await makeEquipmentModel();
    const specialist = await signedInClient(server, await makeUser({ role: 'specialist' }));
    const saved = await specialist.agent
      .put(`/api/equipment/${model.id}/spec`)
      .set('X-CSRF-Token', specialist.csrfToken)
      .send({ spec });
    expect(saved.status).toBe(200);
    const contractor = await signedInClient(server, await makeUser());
    const read = await contractor.get(`/api/equipment/${model.id}`).expect(200);
    expect(read.body.model.spec).toEqual(spec);
    const check = await contractor.post('/api/checks/gas-pressure', {
      fuel: 'natural-gas',
      equipmentModelId: model.id,
      manifold: [{ stage: 'low', valueInWc: 2.0 }],
    });
    expect(check.body.result).toMatchObject({
      specSource: 'model',
      items: [{ name: 'manifold-low', verdict: 'high', adjust: 'lower' }],
    });
  });

  it('When a spec is invalid, then 400 names the field and the old spec stays', async () => {
    const model = await makeEquipmentModel();
    const specialist = await signedInClient(server, await makeUser({ role: 'specialist' }));
    await specialist.agent
      .put(`/api/equipment/${model.id}/spec`)
      .set('X-CSRF-Token', specialist.csrfToken)
      .send({ spec });
    const bad = await specialist.agent
      .put(`/api/equipment/${model.id}/spec`)
      .set('X-CSRF-Token', specialist.csrfToken)
      .send({ spec: { ...spec, inputBtuh: { high: 80_000 } } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty(['spec.inputBtuh.low']);
    const read = await specialist.get(`/api/equipment/${model.id}`).expect(200);
    expect(read.body.model.spec.inputBtuh.low).toBe(52_000);
  });

  it('When a tech or contractor tries to change a spec, then 403', async () => {
    const model = await makeEquipmentModel();
    for (const role of ['tech', 'contractor'] as const) {
      const client = await signedInClient(server, await makeUser({ role }));
      const res = await client.agent
        .put(`/api/equipment/${model.id}/spec`)
        .set('X-CSRF-Token', client.csrfToken)
        .send({ spec });
      expect(res.status).toBe(403);
    }
  });
});
