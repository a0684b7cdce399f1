// Runs once before the API and realtime tests: the test database must exist and be migrated.
import { runMigrations } from '../../api/scripts/migrate';

export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error(
      'DATABASE_URL is not set: run the API tests through `npm test` (it makes a throwaway database)',
    );
  }
  await runMigrations(url);
}
