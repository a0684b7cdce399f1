// The demo scenario: Harbor Valley Supply, its three branches, its desk, and four contractor accounts.
// Every name here is invented.
import { sql } from 'drizzle-orm';
import type { Db } from '../client';
import { branches, contractorAccounts, staffBranches, users } from '../schema/index';
import { hashPassword } from '../../lib/passwords';

export const DEMO_PASSWORD = 'Harbor-Valley-2026';

const BRANCHES = [
  { code: 'EGT', name: 'Eastgate', deskEmail: 'desk.eastgate@harborvalley.example' },
  { code: 'MBK', name: 'Millbrook', deskEmail: 'desk.millbrook@harborvalley.example' },
  { code: 'NFD', name: 'Northfield', deskEmail: 'desk.northfield@harborvalley.example' },
];

const ALL = ['EGT', 'MBK', 'NFD'];
const STAFF = [
  { email: 'admin@harborvalley.example', name: 'Morgan Ashby', role: 'admin', branches: ALL },
  { email: 'tech.eastgate@harborvalley.example', name: 'Theo Brandt', role: 'tech', branches: ['EGT'] },
  { email: 'tech.millbrook@harborvalley.example', name: 'Priya Calloway', role: 'tech', branches: ['MBK'] },
  { email: 'tech.northfield@harborvalley.example', name: 'Sam Okafor', role: 'tech', branches: ['NFD'] },
  { email: 'specialist@harborvalley.example', name: 'Rosa Lindqvist', role: 'specialist', branches: ALL },
] as const;

const ACCOUNTS = [
  {
    company: 'Keane Heating & Air',
    accountNumber: 'HV-KEA-1001',
    branch: 'EGT',
    owner: { email: 'owner@keaneheating.example', name: 'Declan Keane' },
    tech: { email: 'tech@keaneheating.example', name: 'Luis Ferreira' },
  },
  {
    company: 'Brightline Mechanical',
    accountNumber: 'HV-BRL-1002',
    branch: 'EGT',
    owner: { email: 'owner@brightline.example', name: 'Nadia Brightwater' },
    tech: { email: 'tech@brightline.example', name: 'Jonah Pike' },
  },
  {
    company: 'Summit Comfort Services',
    accountNumber: 'HV-SUM-1003',
    branch: 'MBK',
    owner: { email: 'owner@summitcomfort.example', name: 'Grace Holloway' },
    tech: { email: 'tech@summitcomfort.example', name: 'Eli Varga' },
  },
  {
    company: 'Ridgeway Plumbing & Heating',
    accountNumber: 'HV-RDG-1004',
    branch: 'NFD',
    owner: { email: 'owner@ridgeway.example', name: 'Walt Ridgeway' },
    tech: { email: 'tech@ridgeway.example', name: 'Amara Quist' },
  },
];

/** Adds whatever part of the demo is missing; a second run adds nothing. */
export async function seedDemo(db: Db): Promise<{ created: number }> {
  let created = 0;
  let passwordHash: string | undefined;
  const hashOnce = async () => (passwordHash ??= await hashPassword(DEMO_PASSWORD));

  await db.transaction(async (tx) => {
    await tx.insert(branches).values(BRANCHES).onConflictDoNothing({ target: branches.code });
    const branchRows = await tx.select({ id: branches.id, code: branches.code }).from(branches);
    const branchId = (code: string) => branchRows.find((b) => b.code === code)!.id;

    await tx
      .insert(contractorAccounts)
      .values(
        ACCOUNTS.map((a) => ({
          company: a.company,
          accountNumber: a.accountNumber,
          homeBranchId: branchId(a.branch),
        })),
      )
      .onConflictDoNothing({ target: contractorAccounts.accountNumber });
    const accountRows = await tx
      .select({ id: contractorAccounts.id, accountNumber: contractorAccounts.accountNumber })
      .from(contractorAccounts);
    const accountId = (n: string) => accountRows.find((a) => a.accountNumber === n)!.id;

    const existing = new Set(
      (await tx.select({ email: sql<string>`lower(${users.email})` }).from(users)).map((r) => r.email),
    );
    for (const s of STAFF) {
      if (existing.has(s.email)) continue;
      const [row] = await tx
        .insert(users)
        .values({ email: s.email, name: s.name, role: s.role, passwordHash: await hashOnce() })
        .returning({ id: users.id });
      await tx
        .insert(staffBranches)
        .values(s.branches.map((c) => ({ userId: row!.id, branchId: branchId(c) })));
      created++;
    }
    for (const a of ACCOUNTS) {
      for (const [person, owner] of [
        [a.owner, true],
        [a.tech, false],
      ] as const) {
        if (existing.has(person.email)) continue;
        await tx.insert(users).values({
          email: person.email,
          name: person.name,
          role: 'contractor',
          passwordHash: await hashOnce(),
          accountId: accountId(a.accountNumber),
          isAccountOwner: owner,
        });
        created++;
      }
    }
  });
  return { created };
}
