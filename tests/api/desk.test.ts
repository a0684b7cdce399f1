import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeBranch, makeUser } from '../support/fixtures';
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

describe('desk directory', () => {
  it('When a tech asks for branches and desk members, then they get every active branch and staff only', async () => {
    const branch = await makeBranch({ name: 'Directory Branch' });
    const specialist = await makeUser({
      role: 'specialist',
      branchIds: [branch.id],
      name: 'Directory Specialist',
    });
    const contractor = await makeUser({ name: 'Directory Contractor' });
    const tech = await signedInClient(server, await makeUser({ role: 'tech' }));
    const branches = await tech.get('/api/desk/branches').expect(200);
    expect(branches.body.items).toContainEqual({
      id: branch.id,
      code: branch.code,
      name: 'Directory Branch',
    });
    const members = await tech.get('/api/desk/members').expect(200);
    const ids = members.body.items.map((m: { id: number }) => m.id);
    expect(members.body.items).toContainEqual({
      id: specialist.id,
      name: 'Directory Specialist',
      role: 'specialist',
      branchIds: [branch.id],
    });
    expect(ids).not.toContain(contractor.id);
  });

  it('When a contractor asks for the desk directory, then both answer 403', async () => {
    const contractor = await signedInClient(server, await makeUser());
    await contractor.get('/api/desk/branches').expect(403);
    await contractor.get('/api/desk/members').expect(403);
  });
});
