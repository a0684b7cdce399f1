// Rebuilds the search index: on Meilisearch (MEILI_URL set) the index settings and every published
// article; on PostgreSQL, which indexes by itself, the word list that corrects typos.
import { fileURLToPath } from 'node:url';
import { createDb } from '../src/db/client';
import { MeiliSearchEngine } from '../src/features/search/search.meilisearch';
import { refreshSearchWords } from '../src/features/search/search.repository';
import { rebuildIndex } from '../src/features/search/search.sync';

export async function runSearchReindex(env: NodeJS.ProcessEnv): Promise<string[]> {
  if (!env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
  const handle = createDb(env.DATABASE_URL, { max: 2 });
  const lines: string[] = [];
  try {
    if (env.MEILI_URL) {
      const index = env.MEILI_INDEX || 'articles';
      const meili = new MeiliSearchEngine({ url: env.MEILI_URL, apiKey: env.MEILI_API_KEY, index });
      const done = await rebuildIndex({ db: handle.db }, meili);
      lines.push(
        `Meilisearch index "${index}" at ${env.MEILI_URL}: settings applied with ${done.synonymGroups} synonym groups`,
        `  ${done.indexed} published articles indexed, ${done.removed} documents no longer published removed`,
      );
    } else {
      lines.push(
        'MEILI_URL is not set: search runs on PostgreSQL, which keeps its own index with every change (nothing to rebuild).',
      );
    }
    // PostgreSQL answers when Meilisearch does not, so its typo-correction words are kept either way.
    const words = await refreshSearchWords(handle.db);
    lines.push(`PostgreSQL typo-correction words refreshed: ${words.after} (were ${words.before})`);
    return lines;
  } finally {
    await handle.close();
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  runSearchReindex(process.env).then(
    (lines) => console.log(lines.join('\n')),
    (err) => {
      console.error('search reindex failed:', err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
