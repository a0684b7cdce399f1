// Test data made by each test for itself, straight into the real database, with unique names.
import { randomBytes, randomUUID } from 'node:crypto';
import { hash } from '@node-rs/argon2';
import { createDb, type DbHandle } from '../../api/src/db/client';
import { branches, contractorAccounts, staffBranches, users } from '../../api/src/db/schema/index';
import type { Role } from '../../shared/src/schemas/auth';

export const TEST_PASSWORD = 'Test-password-2026!';
let handle: DbHandle | undefined;
let passwordHash: Promise<string> | undefined;

export function testDb(): DbHandle {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test`');
  handle ??= createDb(url, { max: 4 });
  return handle;
}

export async function closeTestDb(): Promise<void> {
  await handle?.close();
  handle = undefined;
}

export const unique = (prefix = 't') => `${prefix}${randomUUID().slice(0, 8)}`;

const randomLetters = (n: number) =>
  Array.from(randomBytes(n), (b) => String.fromCharCode(65 + (b % 26))).join('');

export async function makeBranch(overrides: { name?: string; code?: string } = {}) {
  const code = overrides.code ?? randomLetters(8);
  const [row] = await testDb()
    .db.insert(branches)
    .values({ code, name: overrides.name ?? `Branch ${code}` })
    .returning();
  return row!;
}

export async function makeAccount(overrides: { company?: string; homeBranchId?: number } = {}) {
  const homeBranchId = overrides.homeBranchId ?? (await makeBranch()).id;
  const [row] = await testDb()
    .db.insert(contractorAccounts)
    .values({
      company: overrides.company ?? `Test Heating ${unique('')}`,
      accountNumber: unique('A-').toUpperCase(),
      homeBranchId,
    })
    .returning();
  return row!;
}

export interface MadeUser {
  id: number;
  email: string;
  password: string;
  role: Role;
  accountId: number | null;
  branchIds: number[];
}

/** A user who can sign in with TEST_PASSWORD; contractors get an account, staff a branch, unless given. */
export async function makeUser(
  options: {
    role?: Role;
    accountId?: number;
    branchIds?: number[];
    isAccountOwner?: boolean;
    active?: boolean;
    email?: string;
    name?: string;
  } = {},
): Promise<MadeUser> {
  const role = options.role ?? 'contractor';
  const accountId = role === 'contractor' ? (options.accountId ?? (await makeAccount()).id) : null;
  const branchIds = role === 'contractor' ? [] : (options.branchIds ?? [(await makeBranch()).id]);
  passwordHash ??= hash(TEST_PASSWORD, { algorithm: 2, memoryCost: 19456, timeCost: 2 });
  const email = options.email ?? `${unique(role)}@test.example`;
  const { db } = testDb();
  const [row] = await db
    .insert(users)
    .values({
      email,
      name: options.name ?? `Test ${role}`,
      role,
      passwordHash: await passwordHash,
      accountId,
      isAccountOwner: options.isAccountOwner ?? false,
      active: options.active ?? true,
    })
    .returning();
  if (branchIds.length > 0) {
    await db.insert(staffBranches).values(branchIds.map((branchId) => ({ userId: row!.id, branchId })));
  }
  return { id: row!.id, email, password: TEST_PASSWORD, role, accountId, branchIds };
}

export async function makeEquipmentModel(
  overrides: { modelNumber?: string; type?: 'furnace' | 'boiler' } = {},
) {
  const { equipmentModels } = await import('../../api/src/db/schema/index');
  const [row] = await testDb()
    .db.insert(equipmentModels)
    .values({
      brand: 'Corvane',
      modelNumber: overrides.modelNumber ?? `TST-${randomLetters(6)}`,
      family: 'Test furnace',
      type: overrides.type ?? 'furnace',
      fuels: ['natural-gas', 'propane'],
    })
    .returning();
  return row!;
}
