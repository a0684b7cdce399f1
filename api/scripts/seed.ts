// Seeds the demo scenario into DATABASE_URL (idempotent: run it as often as you like).
import { createDb } from '../src/db/client';
import { seedDemo } from '../src/db/seed/demo';
import { seedEquipment, seedTickets } from '../src/db/seed/tickets';
import { DiskStorage } from '../src/features/attachments/storage';
import { runKbImport } from './kb-import';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const handle = createDb(url, { max: 2 });
const storage = new DiskStorage(process.env.UPLOAD_DIR ?? '.data/uploads');

async function main() {
  const { created } = await seedDemo(handle.db);
  await seedEquipment(handle.db);
  const tickets = await seedTickets(handle.db, storage);
  const imported = await runKbImport(url!);
  console.log(
    created || tickets || imported
      ? `demo seeded: ${created} people, ${tickets} tickets, ${imported} articles added`
      : 'demo already seeded',
  );
}

main()
  .catch((err) => {
    console.error('seed failed:', err);
    process.exitCode = 1;
  })
  .finally(() => handle.close());
