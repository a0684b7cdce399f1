// Facets and the equipment filters of GET /api/search on the PostgreSQL engine: counts over what
// the reader may see, each facet leaving out only its own filter, and filters that really filter.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipmentModels } from '../../api/src/db/schema/index';
import type { RunningServer } from '../../api/src/server';
import { closeTestDb, makeEquipmentModel, makeUser, testDb, unique } from '../support/fixtures';
import { signedInClient, startTestServer, type TestClient } from '../support/server';

let server: RunningServer;
let contractor: TestClient;
let tech: TestClient;
/** A word only this file's articles use. */
const word = `facetword${unique('')}`;
const slugs: Record<'furnace' | 'boiler' | 'plain' | 'staff', string> = {
  furnace: '',
  boiler: '',
  plain: '',
  staff: '',
};

async function publish(
  writer: TestClient,
  reviewer: TestClient,
  over: { title: string; kind: string; audience: string; equipmentModelIds: number[] },
) {
  const created = await writer.post('/api/articles', {
    summary: `What to check first when the ${word} unit acts up.`,
    body: `Read the rating plate, then test the ${word} sequence step by step.`,
    ...over,
  });
  expect(created.status).toBe(201);
  const id = created.body.article.id;
  expect((await reviewer.post(`/api/articles/${id}/publish`)).status).toBe(200);
  return created.body.article.slug as string;
}

beforeAll(async () => {
  server = await startTestServer();
  const writer = await signedInClient(server, await makeUser({ role: 'specialist' }));
  const reviewer = await signedInClient(server, await makeUser({ role: 'specialist' }));
  contractor = await signedInClient(server, await makeUser());
  tech = await signedInClient(server, await makeUser({ role: 'tech' }));
  const furnace = await makeEquipmentModel(); // Corvane furnace, natural gas and propane
  const [boiler] = await testDb()
    .db.insert(equipmentModels)
    .values({
      brand: 'Halden',
      modelNumber: `HB-${unique('').toUpperCase()}`,
      family: 'Test boiler',
      type: 'boiler',
      fuels: ['natural-gas'],
    })
    .returning();
  slugs.furnace = await publish(writer, reviewer, {
    title: `Furnace ${word} start-up`,
    kind: 'procedure',
    audience: 'contractor',
    equipmentModelIds: [furnace.id],
  });
  slugs.boiler = await publish(writer, reviewer, {
    title: `Boiler ${word} lockout`,
    kind: 'troubleshooting',
    audience: 'contractor',
    equipmentModelIds: [boiler!.id],
  });
  slugs.plain = await publish(writer, reviewer, {
    title: `General ${word} notes`,
    kind: 'bulletin',
    audience: 'contractor',
    equipmentModelIds: [],
  });
  slugs.staff = await publish(writer, reviewer, {
    title: `Warranty ${word} rules`,
    kind: 'bulletin',
    audience: 'staff',
    equipmentModelIds: [furnace.id],
  });
}, 60_000);
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const searchAs = async (client: TestClient, filters = '') =>
  (await client.get(`/api/search?q=${word}&limit=20${filters}`).expect(200)).body;
const slugsOf = (body: { hits: { slug: string }[] }) => body.hits.map((h) => h.slug).sort();

describe('facets on PostgreSQL', () => {
  it('When a contractor searches, then every facet counts only the contractor articles that match', async () => {
    const body = await searchAs(contractor);
    expect(body.engine).toBe('postgres');
    expect(body.fallback).toBe(false);
    expect(body.total).toBe(3);
    expect(slugsOf(body)).toEqual([slugs.boiler, slugs.furnace, slugs.plain].sort());
    expect(body.facets).toEqual({
      kind: { procedure: 1, troubleshooting: 1, bulletin: 1 },
      equipmentType: { furnace: 1, boiler: 1 },
      brand: { Corvane: 1, Halden: 1 },
      fuel: { 'natural-gas': 2, propane: 1 },
    });
  });

  it('When a tech searches, then the staff article is counted too', async () => {
    const body = await searchAs(tech);
    expect(body.total).toBe(4);
    expect(body.facets.brand).toEqual({ Corvane: 2, Halden: 1 });
    expect(body.facets.kind).toEqual({ procedure: 1, troubleshooting: 1, bulletin: 2 });
  });
});

describe('equipment filters on PostgreSQL', () => {
  it('When the brand filter is set (any case), then only that brand’s articles come back and the brand facet still shows the others', async () => {
    const body = await searchAs(contractor, '&brand=halden');
    expect(slugsOf(body)).toEqual([slugs.boiler]);
    expect(body.total).toBe(1);
    expect(body.facets.brand).toEqual({ Corvane: 1, Halden: 1 });
    expect(body.facets.equipmentType).toEqual({ boiler: 1 });
    expect(body.facets.kind).toEqual({ troubleshooting: 1 });
  });

  it('When the equipment type filter is set, then only articles with a model of that type come back', async () => {
    expect(slugsOf(await searchAs(contractor, '&equipmentType=furnace'))).toEqual([slugs.furnace]);
    expect(slugsOf(await searchAs(contractor, '&equipmentType=heat-pump'))).toEqual([]);
  });

  it('When the fuel filter is set, then only articles with a model for that fuel come back', async () => {
    const propane = await searchAs(contractor, '&fuel=propane');
    expect(slugsOf(propane)).toEqual([slugs.furnace]);
    expect(propane.facets.fuel).toEqual({ 'natural-gas': 2, propane: 1 });
    expect(slugsOf(await searchAs(contractor, '&fuel=natural-gas'))).toEqual(
      [slugs.furnace, slugs.boiler].sort(),
    );
  });

  it('When filters are combined, then an article must pass each of them', async () => {
    expect(slugsOf(await searchAs(contractor, '&brand=Corvane&equipmentType=boiler'))).toEqual([]);
    const both = await searchAs(contractor, '&brand=Corvane&kind=procedure');
    expect(slugsOf(both)).toEqual([slugs.furnace]);
    expect(both.facets.kind).toEqual({ procedure: 1 });
  });

  it('When the kind filter is set, then the kind facet still counts every kind', async () => {
    const body = await searchAs(contractor, '&kind=bulletin');
    expect(slugsOf(body)).toEqual([slugs.plain]);
    expect(body.facets.kind).toEqual({ procedure: 1, troubleshooting: 1, bulletin: 1 });
    expect(body.facets.brand).toEqual({});
  });

  it('When the query is empty, then nothing is searched and the facets are empty', async () => {
    const body = (await contractor.get('/api/search?q=').expect(200)).body;
    expect(body).toMatchObject({
      hits: [],
      total: 0,
      facets: { kind: {}, equipmentType: {}, brand: {}, fuel: {} },
    });
  });
});
