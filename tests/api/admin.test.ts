import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, makeAccount, makeBranch, makeUser, unique, type MadeUser } from '../support/fixtures';
import { TestClient, signedInClient, startTestServer } from '../support/server';
import type { RunningServer } from '../../api/src/server';

let server: RunningServer;
let admin: MadeUser;
let adminClient: TestClient;
beforeAll(async () => {
  server = await startTestServer();
  admin = await makeUser({ role: 'admin' });
  adminClient = await signedInClient(server, admin);
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const ADMIN_ROUTES: [method: 'get' | 'post' | 'patch', path: string][] = [
  ['get', '/api/admin/users'],
  ['post', '/api/admin/users'],
  ['patch', '/api/admin/users/1'],
  ['get', '/api/admin/accounts'],
  ['post', '/api/admin/accounts'],
  ['patch', '/api/admin/accounts/1'],
  ['get', '/api/admin/branches'],
  ['post', '/api/admin/branches'],
  ['patch', '/api/admin/branches/1'],
];

describe('admin routes refuse everyone but admins', () => {
  for (const role of ['contractor', 'tech', 'specialist'] as const) {
    it(`When a ${role} calls any admin route, then every one answers 403`, async () => {
      const client = await signedInClient(server, await makeUser({ role }));
      for (const [method, path] of ADMIN_ROUTES) {
        const res = method === 'get' ? await client.get(path) : await client[method](path, { name: 'x' });
        expect([method, path, res.status]).toEqual([method, path, 403]);
        expect(res.body.error.code).toBe('forbidden');
      }
    });
  }

  it('When nobody is signed in, then every admin route answers 401', async () => {
    const client = new TestClient(server);
    for (const [method, path] of ADMIN_ROUTES) {
      const res = method === 'get' ? await client.get(path) : await client[method](path, {});
      expect([method, path, res.status]).toEqual([method, path, 401]);
    }
  });
});

describe('users', () => {
  it('When the admin creates a contractor user, then they can sign in and see their account', async () => {
    const account = await makeAccount();
    const email = `${unique('new')}@test.example`;
    const res = await adminClient.post('/api/admin/users', {
      email: email.toUpperCase(),
      name: 'Rowan Test',
      role: 'contractor',
      password: 'Long-enough-pass-1',
      accountId: account.id,
      isAccountOwner: true,
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({
      email,
      role: 'contractor',
      accountId: account.id,
      isAccountOwner: true,
      branchIds: [],
    });
    const client = await signedInClient(server, { email, password: 'Long-enough-pass-1' });
    const home = await client.get('/api/home').expect(200);
    expect(home.body.account).toMatchObject({ id: account.id, company: account.company });
  });

  it('When the e-mail is already used in another case, then answers 409 on `email` and stores nothing', async () => {
    const existing = await makeUser();
    const before = await adminClient.get(`/api/admin/users?q=${encodeURIComponent(existing.email)}`);
    const res = await adminClient.post('/api/admin/users', {
      email: existing.email.toUpperCase(),
      name: 'Dup',
      role: 'tech',
      password: 'Long-enough-pass-1',
      branchIds: existing.branchIds.length ? existing.branchIds : [(await makeBranch()).id],
    });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual({ email: 'Already in use' });
    const after = await adminClient.get(`/api/admin/users?q=${encodeURIComponent(existing.email)}`);
    expect(after.body.total).toBe(before.body.total);
  });

  it('When the body is wrong, then answers 400 naming each field', async () => {
    const res = await adminClient.post('/api/admin/users', {
      email: 'nope',
      role: 'boss',
      password: 'short',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password', 'role']);
  });

  it('When a contractor has no account or staff no branch, then answers 400 on that field', async () => {
    const base = { email: `${unique('x')}@test.example`, name: 'X', password: 'Long-enough-pass-1' };
    const contractor = await adminClient.post('/api/admin/users', { ...base, role: 'contractor' });
    expect(contractor.body.error.fields).toEqual({ accountId: 'A contractor needs an account' });
    const tech = await adminClient.post('/api/admin/users', { ...base, role: 'tech', branchIds: [] });
    expect(tech.body.error.fields).toEqual({ branchIds: 'Staff need at least one branch' });
    const ghost = await adminClient.post('/api/admin/users', {
      ...base,
      role: 'contractor',
      accountId: 99_999_999,
    });
    expect(ghost.status).toBe(400);
    expect(ghost.body.error.fields).toEqual({ accountId: 'Does not exist' });
  });

  it('When the list is searched and paged, then it answers that page and the full total', async () => {
    const account = await makeAccount({ company: `Paging Co ${unique()}` });
    for (let i = 0; i < 3; i++) await makeUser({ accountId: account.id });
    const page1 = await adminClient
      .get(`/api/admin/users?accountId=${account.id}&pageSize=2&page=1`)
      .expect(200);
    const page2 = await adminClient
      .get(`/api/admin/users?accountId=${account.id}&pageSize=2&page=2`)
      .expect(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.items).toHaveLength(2);
    expect(page2.body.items).toHaveLength(1);
    const byCompany = await adminClient
      .get(`/api/admin/users?q=${encodeURIComponent(account.company)}`)
      .expect(200);
    expect(byCompany.body.total).toBe(3);
  });

  it('When the admin tries to deactivate themselves, then answers 400 and stays active', async () => {
    const res = await adminClient.patch(`/api/admin/users/${admin.id}`, { active: false });
    expect(res.status).toBe(400);
    await adminClient.get('/api/auth/me').expect(200);
  });

  it('When the user does not exist, then PATCH answers 404', async () => {
    const res = await adminClient.patch('/api/admin/users/99999999', { name: 'Nobody' });
    expect(res.status).toBe(404);
  });
});

describe('accounts and branches', () => {
  it('When the admin opens an account, then it lists with its home branch and a duplicate number is 409', async () => {
    const branch = await makeBranch();
    const number = unique('ac-').toUpperCase();
    const res = await adminClient.post('/api/admin/accounts', {
      company: 'Fresh Air Test',
      accountNumber: number,
      homeBranchId: branch.id,
    });
    expect(res.status).toBe(201);
    expect(res.body.account).toMatchObject({
      company: 'Fresh Air Test',
      accountNumber: number,
      homeBranchName: branch.name,
      userCount: 0,
    });
    const dup = await adminClient.post('/api/admin/accounts', {
      company: 'Other',
      accountNumber: number,
      homeBranchId: branch.id,
    });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toEqual({ accountNumber: 'Already in use' });
    const list = await adminClient.get(`/api/admin/accounts?q=${number}`).expect(200);
    expect(list.body.items.map((a: { id: number }) => a.id)).toEqual([res.body.account.id]);
  });

  it('When the home branch does not exist, then answers 400 on `homeBranchId`', async () => {
    const res = await adminClient.post('/api/admin/accounts', {
      company: 'X',
      accountNumber: unique('x-'),
      homeBranchId: 99_999_999,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ homeBranchId: 'Does not exist' });
  });

  it('When the admin adds and renames a branch, then the list shows the new name', async () => {
    const code = `lk${Array.from({ length: 5 }, () => String.fromCharCode(97 + Math.floor(Math.random() * 26))).join('')}`;
    const res = await adminClient.post('/api/admin/branches', {
      code,
      name: 'Lakeside',
      deskEmail: 'desk@lakeside.example',
    });
    expect(res.status).toBe(201);
    expect(res.body.branch.code).toBe(code.toUpperCase());
    const patched = await adminClient.patch(`/api/admin/branches/${res.body.branch.id}`, {
      name: 'Lakeside South',
    });
    expect(patched.body.branch.name).toBe('Lakeside South');
    const empty = await adminClient.patch(`/api/admin/branches/${res.body.branch.id}`, {});
    expect(empty.status).toBe(400);
  });
});
