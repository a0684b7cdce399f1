// Imports kb/*.md into DATABASE_URL as published articles by the demo product specialist.
import { fileURLToPath } from 'node:url';
import { createDb } from '../src/db/client';
import { importKb } from '../src/db/seed/kb';
import { findActiveSessionUser } from '../src/features/auth/auth.repository';
import { sql } from 'drizzle-orm';

export async function runKbImport(url: string): Promise<number> {
  const handle = createDb(url, { max: 2 });
  try {
    const [row] = (
      await handle.db.execute<{ id: number }>(
        sql`select id from users where email = 'specialist@harborvalley.example'`,
      )
    ).rows;
    const author = row ? await findActiveSessionUser(handle.db, row.id) : undefined;
    if (!author) throw new Error('the demo specialist is missing: run the demo seed first');
    return await importKb({ db: handle.db }, author, fileURLToPath(new URL('../../kb', import.meta.url)));
  } finally {
    await handle.close();
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('DATABASE_URL is not set');
    process.exit(1);
  }
  runKbImport(url).then(
    (n) => console.log(n ? `knowledge base: ${n} articles imported` : 'knowledge base already imported'),
    (err) => {
      console.error('knowledge-base import failed:', err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
