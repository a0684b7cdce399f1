import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeEquipmentModel, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer, TestClient } from '../support/server';
import type { RunningServer } from '../../api/src/server';
import { equipmentModels } from '../../api/src/db/schema/index';
import { eq } from 'drizzle-orm';

let server: RunningServer;
let client: TestClient;
beforeAll(async () => {
  server = await startTestServer();
  client = await signedInClient(server, await makeUser());
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

describe('check routes', () => {
  it('When a unit conversion is asked for, then the answer carries its source and caution', async () => {
    const res = await client.post('/api/checks/convert', { value: 1, from: 'in_wc', to: 'pa' });
    expect(res.status).toBe(200);
    expect(res.body.result.value).toBeCloseTo(249.0889, 3);
    expect(res.body.result.source).toMatch(/NIST SP 811/);
    expect(res.body.result.cautions.length).toBeGreaterThan(0);
  });

  it('When a value is impossible, then 400 names the field: negative length, O₂ at 20.9 %, a negative rise', async () => {
    const pipe = await client.post('/api/checks/pipe-size', {
      fuel: 'natural-gas',
      lengthFt: -10,
      loadBtuh: 80000,
    });
    expect(pipe.status).toBe(400);
    expect(pipe.body.error.fields).toHaveProperty('lengthFt');
    const co = await client.post('/api/checks/co-air-free', { coPpm: 50, o2Pct: 20.9 });
    expect(co.body.error.fields).toHaveProperty('o2Pct');
    const rise = await client.post('/api/checks/temperature-rise', {
      outputBtuh: 80000,
      supplyF: 60,
      returnF: 70,
    });
    expect(rise.body.error.fields).toHaveProperty('supplyF');
  });

  it('When the kind is unknown, then 404', async () => {
    expect((await client.post('/api/checks/flux-capacity', {})).status).toBe(404);
  });

  it('When nobody is signed in, then 401', async () => {
    expect(
      (await new TestClient(server).post('/api/checks/convert', { value: 1, from: 'psi', to: 'pa' })).status,
    ).toBe(401);
  });

  it('When gas pressure is checked for a model with a spec, then the model spec is used, else common practice', async () => {
    const model = await makeEquipmentModel();
    await testDb()
      .db.update(equipmentModels)
      .set({
        spec: {
          staging: 'single',
          inputBtuh: { high: 80_000 },
          fuels: {
            'natural-gas': {
              inletMinInWc: 4.5,
              inletMaxInWc: 10.5,
              manifold: [{ stage: 'high', targetInWc: 3.2, toleranceInWc: 0.2 }],
            },
          },
        },
      })
      .where(eq(equipmentModels.id, model.id));
    const withModel = await client.post('/api/checks/gas-pressure', {
      fuel: 'natural-gas',
      equipmentModelId: model.id,
      manifold: [{ stage: 'high', valueInWc: 3.5 }],
    });
    expect(withModel.body.result.specSource).toBe('model');
    expect(withModel.body.result.items[0]).toMatchObject({
      verdict: 'high',
      adjust: 'lower',
      targetInWc: 3.2,
    });
    const typical = await client.post('/api/checks/gas-pressure', {
      fuel: 'natural-gas',
      manifold: [{ stage: 'high', valueInWc: 3.5 }],
    });
    expect(typical.body.result.specSource).toBe('typical');
    expect(typical.body.result.items[0].verdict).toBe('ok');
  });

  it('When gas pressure is checked against an article, then its spec table gives the targets; an article without one is 400', async () => {
    const specialist = await signedInClient(server, await makeUser({ role: 'specialist' }));
    const reviewer = await signedInClient(server, await makeUser({ role: 'specialist' }));
    const body = [
      '::: spec gas-pressure',
      '| fuel | stage | target in. w.c. | tolerance |',
      '| --- | --- | --- | --- |',
      '| natural-gas | high | 3.2 | 0.2 |',
      '| propane | high | 10 | 0.5 |',
      ':::',
    ].join('\n');
    const created = await specialist.post('/api/articles', {
      title: 'Setting the high fire on a test unit',
      summary: 'Targets for the high-fire manifold pressure by fuel.',
      body,
      kind: 'procedure',
      audience: 'contractor',
    });
    await reviewer.post(`/api/articles/${created.body.article.id}/publish`);
    const res = await client.post('/api/checks/gas-pressure', {
      fuel: 'natural-gas',
      articleId: created.body.article.id,
      manifold: [{ stage: 'high', valueInWc: 3.5 }],
    });
    expect(res.body.result.specSource).toBe('article');
    expect(res.body.result.items[0]).toMatchObject({ verdict: 'high', targetInWc: 3.2, adjust: 'lower' });
    const plain = await specialist.post('/api/articles', {
      ...created.body.article,
      title: 'No table here at all',
      body: 'Just words.',
      equipmentModelIds: [],
    });
    await reviewer.post(`/api/articles/${plain.body.article.id}/publish`);
    const none = await client.post('/api/checks/gas-pressure', {
      fuel: 'natural-gas',
      articleId: plain.body.article.id,
      manifold: [{ stage: 'high', valueInWc: 3.5 }],
    });
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('articleId');
  });
});
