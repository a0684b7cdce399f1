// Invitations against the real server, database and mail sink: admins invite staff, account owners
// invite teammates into their own account only, and each e-mailed link works once, for 7 days.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import type { RunningServer } from '../../api/src/server';
import { invitations } from '../../api/src/db/schema/index';
import {
  closeTestDb,
  makeAccount,
  makeBranch,
  makeUser,
  testDb,
  unique,
  type MadeUser,
} from '../support/fixtures';
import { linkToken, mailsTo, mailSinkEnv, waitForMails } from '../support/mailbox';
import { TestClient, signedInClient, startTestServer } from '../support/server';

const APP_URL = 'http://lightoff.test.example';
const NEW_PASSWORD = 'Copper-lantern-orchard-58';
const DAY_MS = 24 * 60 * 60 * 1000;

let server: RunningServer;
let admin: MadeUser;
let adminClient: TestClient;
beforeAll(async () => {
  server = await startTestServer({ APP_URL, ...mailSinkEnv('jobs_invitations') });
  admin = await makeUser({ role: 'admin', name: 'Avery Admin' });
  adminClient = await signedInClient(server, admin);
});
afterEach(() => {
  vi.useRealTimers();
});
afterAll(async () => {
  await server.stop();
  await closeTestDb();
});

const newEmail = (prefix = 'invitee') => `${unique(prefix)}@test.example`;

async function makeOwner() {
  const account = await makeAccount({ company: `Copperline Heating ${unique('')}` });
  const owner = await makeUser({ accountId: account.id, isAccountOwner: true, name: 'Olive Owner' });
  return { account, owner, client: await signedInClient(server, owner) };
}

/** Invites through the API and reads the link's token from the e-mail that arrives. */
async function inviteAndReadToken(
  client: TestClient,
  body: { email: string; role?: string; branchIds?: number[]; accountId?: number },
) {
  const before = (await mailsTo(body.email)).length;
  const res = await client.post('/api/invitations', body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const [mail] = (await waitForMails(body.email, before + 1)).slice(-1);
  return { invitation: res.body.invitation, token: linkToken(mail!, 'join'), mail: mail! };
}

async function invitationRows(email: string) {
  return testDb()
    .db.select()
    .from(invitations)
    .where(sql`lower(${invitations.email}) = ${email}`);
}

/** Moves the server's clock (same process) by `ms` from now; Date keeps running from there. */
function moveClock(ms: number) {
  const target = Date.now() + ms;
  vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
  vi.setSystemTime(target);
}

describe('admin invites staff', () => {
  it('When the admin invites a tech to two branches, then the e-mail link lets them join those branches and signs them in', async () => {
    const [east, north] = [
      await makeBranch({ name: 'Eastgate Test' }),
      await makeBranch({ name: 'Northfield Test' }),
    ];
    const email = newEmail('tech');
    const { invitation, token, mail } = await inviteAndReadToken(adminClient, {
      email: email.toUpperCase(),
      role: 'tech',
      branchIds: [east.id, north.id],
    });
    expect(invitation).toMatchObject({
      email,
      role: 'tech',
      accountId: null,
      branchIds: [east.id, north.id],
      status: 'waiting',
      invitedBy: { id: admin.id, name: 'Avery Admin' },
    });
    expect(Date.parse(invitation.expiresAt) - Date.parse(invitation.createdAt)).toBe(7 * DAY_MS);
    expect(mail.subject).toBe('Avery Admin invited you to Lightoff');
    expect(mail.text).toContain(`${APP_URL}/join/${token}`);
    expect(mail.html).toContain(`${APP_URL}/join/${token}`);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    // Only the token's SHA-256 is stored.
    const [row] = await invitationRows(email);
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.tokenHash).not.toContain(token);

    const invitee = new TestClient(server);
    const lookup = await invitee.post('/api/invitations/lookup', { token });
    expect(lookup.status).toBe(200);
    expect(lookup.body.invitation).toMatchObject({
      email,
      role: 'tech',
      accountCompany: null,
      branchNames: ['Eastgate Test', 'Northfield Test'],
      invitedByName: 'Avery Admin',
    });

    const accepted = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Tam Tech',
      password: NEW_PASSWORD,
    });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201);
    expect(accepted.body.user).toMatchObject({
      email,
      name: 'Tam Tech',
      role: 'tech',
      accountId: null,
      branchIds: [east.id, north.id].sort((a, b) => a - b),
      isAccountOwner: false,
    });
    const me = await invitee.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
    await new TestClient(server).signIn({ email, password: NEW_PASSWORD });

    const list = await adminClient.get('/api/invitations?status=joined&pageSize=100');
    expect(list.body.items.find((i: { id: number }) => i.id === invitation.id)).toMatchObject({
      status: 'joined',
    });
  });

  it('When the admin leaves out the role or the branches, or the e-mail is not one, then 400 names each field and nothing is stored', async () => {
    const email = newEmail();
    const noRole = await adminClient.post('/api/invitations', { email });
    expect(noRole.status).toBe(400);
    expect(Object.keys(noRole.body.error.fields)).toEqual(['role']);

    const noBranch = await adminClient.post('/api/invitations', { email, role: 'specialist', branchIds: [] });
    expect(noBranch.status).toBe(400);
    expect(noBranch.body.error.fields).toEqual({ branchIds: 'Choose at least one branch' });

    const badRole = await adminClient.post('/api/invitations', { email, role: 'owner', branchIds: [1] });
    expect(badRole.status).toBe(400);
    expect(Object.keys(badRole.body.error.fields)).toEqual(['role']);

    const badEmail = await adminClient.post('/api/invitations', {
      email: 'not-an-address',
      role: 'tech',
      branchIds: [1],
    });
    expect(badEmail.status).toBe(400);
    expect(badEmail.body.error.fields).toEqual({ email: 'Enter a valid e-mail address' });

    expect(await invitationRows(email)).toHaveLength(0);
  });

  it('When the e-mail already signs in to Lightoff, then the invitation answers 409 on the e-mail', async () => {
    const existing = await makeUser({ role: 'tech' });
    const branch = await makeBranch();
    const res = await adminClient.post('/api/invitations', {
      email: existing.email,
      role: 'tech',
      branchIds: [branch.id],
    });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.fields).toEqual({ email: 'Already has a Lightoff sign-in' });
  });

  it('When people other than admins and owners try to invite, then a tech or plain contractor gets 403 and nobody signed in 401', async () => {
    const branch = await makeBranch();
    const tech = await signedInClient(server, await makeUser({ role: 'tech', branchIds: [branch.id] }));
    const teammate = await signedInClient(server, await makeUser({ role: 'contractor' }));
    for (const client of [tech, teammate]) {
      const res = await client.post('/api/invitations', { email: newEmail() });
      expect(res.status).toBe(403);
      expect((await client.get('/api/invitations')).status).toBe(403);
    }
    expect(
      (await tech.post('/api/invitations', { email: newEmail(), role: 'tech', branchIds: [branch.id] }))
        .status,
    ).toBe(403);
    const anonymous = new TestClient(server);
    expect((await anonymous.post('/api/invitations', { email: newEmail() })).status).toBe(401);
    expect((await anonymous.get('/api/invitations')).status).toBe(401);
  });
});

describe('account owners invite teammates', () => {
  it('When an owner invites a teammate, then the invitee joins that account as a contractor (not an owner)', async () => {
    const { account, owner, client } = await makeOwner();
    const email = newEmail('mate');
    const { invitation, token, mail } = await inviteAndReadToken(client, { email });
    expect(invitation).toMatchObject({
      role: 'contractor',
      accountId: account.id,
      accountCompany: account.company,
    });
    expect(mail.text).toContain(account.company);

    const lookup = await new TestClient(server).post('/api/invitations/lookup', { token });
    expect(lookup.body.invitation).toMatchObject({
      role: 'contractor',
      accountCompany: account.company,
      invitedByName: 'Olive Owner',
    });

    const invitee = new TestClient(server);
    const res = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Mae Teammate',
      password: NEW_PASSWORD,
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({
      role: 'contractor',
      accountId: account.id,
      isAccountOwner: false,
      branchIds: [],
    });
    const home = await invitee.get('/api/home');
    expect(home.body.account.id).toBe(account.id);
    expect(owner.accountId).toBe(account.id);
  });

  it('When an owner sends another account id, then it answers 404 and stores and sends nothing', async () => {
    const { client } = await makeOwner();
    const other = await makeAccount();
    const email = newEmail('stray');
    const res = await client.post('/api/invitations', { email, accountId: other.id });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(await invitationRows(email)).toHaveLength(0);
    // A made-up account id answers the same as a real one.
    const missing = await client.post('/api/invitations', { email, accountId: 2_000_000_000 });
    expect(missing.status).toBe(404);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await mailsTo(email)).toHaveLength(0);
  });

  it('When an owner asks for a staff role or branches, then it answers 403', async () => {
    const { client } = await makeOwner();
    const branch = await makeBranch();
    expect(
      (await client.post('/api/invitations', { email: newEmail(), role: 'admin', branchIds: [branch.id] }))
        .status,
    ).toBe(403);
    expect(
      (await client.post('/api/invitations', { email: newEmail(), branchIds: [branch.id] })).status,
    ).toBe(403);
  });

  it("When owners list invitations, then each sees only their own account's, and cannot revoke another's (404)", async () => {
    const a = await makeOwner();
    const b = await makeOwner();
    const { invitation: ofA } = await inviteAndReadToken(a.client, { email: newEmail('a') });
    const { invitation: ofB } = await inviteAndReadToken(b.client, { email: newEmail('b') });

    const listA = await a.client.get('/api/invitations?pageSize=100');
    expect(listA.status).toBe(200);
    expect(listA.body.items.map((i: { id: number }) => i.id)).toEqual([ofA.id]);
    expect(listA.body.total).toBe(1);

    const revokeOther = await a.client.post(`/api/invitations/${ofB.id}/revoke`);
    expect(revokeOther.status).toBe(404);
    const all = await adminClient.get('/api/invitations?pageSize=100');
    const ids = all.body.items.map((i: { id: number }) => i.id);
    expect(ids).toEqual(expect.arrayContaining([ofA.id, ofB.id]));
  });
});

describe('the link works once, for 7 days', () => {
  it('When the link is used a second time, then it answers 410 "already used"', async () => {
    const { client } = await makeOwner();
    const { token } = await inviteAndReadToken(client, { email: newEmail() });
    const first = await new TestClient(server).post('/api/invitations/accept', {
      token,
      name: 'First Use',
      password: NEW_PASSWORD,
    });
    expect(first.status).toBe(201);
    const again = await new TestClient(server).post('/api/invitations/accept', {
      token,
      name: 'Second Use',
      password: NEW_PASSWORD,
    });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('link_used');
    expect(again.body.error.message).toMatch(/already been used/);
    const lookup = await new TestClient(server).post('/api/invitations/lookup', { token });
    expect(lookup.body.error.code).toBe('link_used');
  });

  it('When two people accept the same link at the same moment, then exactly one gets in', async () => {
    const { client } = await makeOwner();
    const { token } = await inviteAndReadToken(client, { email: newEmail('race') });
    const tries = await Promise.all(
      [1, 2, 3].map((n) =>
        new TestClient(server).post('/api/invitations/accept', {
          token,
          name: `Racer ${n}`,
          password: NEW_PASSWORD,
        }),
      ),
    );
    expect(tries.map((r) => r.status).sort()).toEqual([201, 410, 410]);
  });

  it('When a token is wrong, then lookup and accept answer 404 "not valid" and create nobody', async () => {
    const client = new TestClient(server);
    const wrong = 'A'.repeat(43);
    const lookup = await client.post('/api/invitations/lookup', { token: wrong });
    expect(lookup.status).toBe(404);
    expect(lookup.body.error.code).toBe('link_unknown');
    const accept = await client.post('/api/invitations/accept', {
      token: wrong,
      name: 'Nobody',
      password: NEW_PASSWORD,
    });
    expect(accept.status).toBe(404);
    expect(accept.body.error.message).toMatch(/not valid/);
    const empty = await client.post('/api/invitations/accept', { name: 'Nobody', password: NEW_PASSWORD });
    expect(empty.status).toBe(400);
    expect(Object.keys(empty.body.error.fields)).toEqual(['token']);
  });

  it('When the invitation is revoked, then its link answers 410 "withdrawn"; revoking twice is harmless', async () => {
    const { client } = await makeOwner();
    const { invitation, token } = await inviteAndReadToken(client, { email: newEmail() });
    const revoked = await client.post(`/api/invitations/${invitation.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.invitation.status).toBe('revoked');
    expect((await client.post(`/api/invitations/${invitation.id}/revoke`)).status).toBe(200);
    const res = await new TestClient(server).post('/api/invitations/accept', {
      token,
      name: 'Too Late',
      password: NEW_PASSWORD,
    });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('link_revoked');
  });

  it('When an owner invites the same e-mail again, then only the newest link works', async () => {
    const { client } = await makeOwner();
    const email = newEmail('again');
    const first = await inviteAndReadToken(client, { email });
    const second = await inviteAndReadToken(client, { email });
    expect(second.token).not.toBe(first.token);
    const old = await new TestClient(server).post('/api/invitations/lookup', { token: first.token });
    expect(old.body.error.code).toBe('link_revoked');
    expect(
      (await new TestClient(server).post('/api/invitations/lookup', { token: second.token })).status,
    ).toBe(200);
  });

  it('When 7 days have passed (clock moved), then the link answers 410 "expired"; just before, it still works', async () => {
    const { client } = await makeOwner();
    const early = await inviteAndReadToken(client, { email: newEmail('early') });
    const late = await inviteAndReadToken(client, { email: newEmail('late') });

    moveClock(7 * DAY_MS - 60_000);
    const stillOk = await new TestClient(server).post('/api/invitations/accept', {
      token: early.token,
      name: 'Just In Time',
      password: NEW_PASSWORD,
    });
    expect(stillOk.status).toBe(201);

    vi.setSystemTime(Date.now() + 2 * 60_000);
    const expired = await new TestClient(server).post('/api/invitations/accept', {
      token: late.token,
      name: 'Too Late',
      password: NEW_PASSWORD,
    });
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('link_expired');
    expect(expired.body.error.message).toMatch(/7 days/);
    const [row] = await invitationRows(late.invitation.email);
    expect(row!.acceptedAt).toBeNull();
  });

  it('When the chosen password is common, short or too long, then 400 says why on `password` and the link stays usable', async () => {
    const { client } = await makeOwner();
    const { token, invitation } = await inviteAndReadToken(client, { email: newEmail('weak') });
    const invitee = new TestClient(server);
    const common = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Wes Weak',
      password: 'password1234',
    });
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toMatch(/too easy to guess/);
    const short = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Wes Weak',
      password: 'Kx7#pQ2v!',
    });
    expect(short.body.error.fields).toEqual({ password: 'Use at least 10 characters' });
    const long = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Wes Weak',
      password: 'x'.repeat(65),
    });
    expect(long.body.error.fields).toEqual({ password: 'Use at most 64 characters' });
    const noName = await invitee.post('/api/invitations/accept', {
      token,
      name: '  ',
      password: NEW_PASSWORD,
    });
    expect(noName.body.error.fields).toEqual({ name: 'Required' });

    const [row] = await testDb().db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.acceptedAt).toBeNull();
    const passphrase = 'copper manifold ridge lantern orchard quietly hums along the way';
    expect(passphrase).toHaveLength(64);
    const ok = await invitee.post('/api/invitations/accept', {
      token,
      name: 'Wes Weak',
      password: passphrase,
    });
    expect(ok.status).toBe(201);
  });

  it('When the e-mail got a sign-in after the invitation was sent, then accepting answers 409 and uses nothing up', async () => {
    const { client } = await makeOwner();
    const email = newEmail('taken');
    const { token, invitation } = await inviteAndReadToken(client, { email });
    await makeUser({ role: 'contractor', email });
    const res = await new TestClient(server).post('/api/invitations/accept', {
      token,
      name: 'Dup Person',
      password: NEW_PASSWORD,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain(email);
    const [row] = await testDb().db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.acceptedAt).toBeNull();
  });
});
