// A database of this test file's own, for tests whose results depend on everything in it (search
// relevance): other files share the run's database and publish articles of their own meanwhile.
import pg from 'pg';
import { randomBytes } from 'node:crypto';
import { runMigrations } from '../../api/scripts/migrate';

/**
 * Creates and migrates a fresh database beside the run's one and points DATABASE_URL at it (each
 * test file runs in a process of its own). Returns a function that drops it again.
 */
export async function useOwnDatabase(label: string): Promise<() => Promise<void>> {
  const shared = process.env.DATABASE_URL;
  if (!shared) throw new Error('DATABASE_URL is not set: run the tests through `npm test`');
  const url = new URL(shared);
  const name = `${url.pathname.slice(1)}_${label}_${randomBytes(3).toString('hex')}`.slice(0, 63);
  const admin = new pg.Client({ connectionString: shared });
  await admin.connect();
  try {
    await admin.query(`create database "${name}"`);
  } finally {
    await admin.end();
  }
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
  await runMigrations(process.env.DATABASE_URL);
  return async () => {
    process.env.DATABASE_URL = shared;
    const again = new pg.Client({ connectionString: shared });
    await again.connect();
    try {
      await again.query(`drop database if exists "${name}" with (force)`);
    } finally {
      await again.end();
    }
  };
}
