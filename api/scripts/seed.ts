// Seeds the demo scenario into DATABASE_URL (idempotent: run it as often as you like).
import { createDb } from '../src/db/client';
import { seedDemo } from '../src/db/seed/demo';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const handle = createDb(url, { max: 2 });
seedDemo(handle.db)
  .then(({ created }) =>
    console.log(created ? `demo seeded: ${created} people added` : 'demo already seeded'),
  )
  .catch((err) => {
    console.error('seed failed:', err);
    process.exitCode = 1;
  })
  .finally(() => handle.close());
