// Knowledge-base search under load, through the HTTP API of the real server on PostgreSQL. For
// 10,000 and 100,000 articles (generated from templates: distinct words and model numbers), 500
// queries of the relevance set's kinds (typos, synonyms, model numbers, plain questions) from 10
// concurrent clients (in a worker thread, off the server's event loop); p50/p95/p99 for search and for suggest. Baseline in the same run: an indexed
// lookup through the same API (GET /api/equipment/:id), the floor, and the ratio search/floor.
// Targets: search p95 ≤ 20 ms at 10k, ≤ 50 ms at 100k; suggest p95 ≤ 15 ms at 10k.
//   DATABASE_URL=postgres://… npm run bench:search [-- --sizes 10000,100000 --queries 500 --concurrency 10]
import { performance } from 'node:perf_hooks';
import { parseArgs } from 'node:util';
import { Worker } from 'node:worker_threads';
import { sql } from 'drizzle-orm';
import { closeTestDb, makeEquipmentModel, makeUser, testDb } from '../support/fixtures';
import { signedInClient, startTestServer } from '../support/server';
import { RELEVANCE_CASES } from '../search/relevance.cases';

const { values: args } = parseArgs({
  options: {
    sizes: { type: 'string', default: '10000,100000' },
    queries: { type: 'string', default: '500' },
    concurrency: { type: 'string', default: '10' },
  },
});
const SIZES = args.sizes.split(',').map(Number);
const QUERIES = Number(args.queries);
const CONCURRENCY = Number(args.concurrency);
if (!process.env.DATABASE_URL) {
  console.error('DATABASE_URL is not set: point it at a migrated, empty PostgreSQL database.');
  process.exit(1);
}

const SYMPTOMS = [
  'locks out',
  'short cycles',
  'no heat',
  'pilot goes out',
  'flame drops out',
  'ice on the coil',
  'water in the cabinet',
  'rollout trips',
  'pressure switch open',
  'igniter glows no flame',
];
const PARTS = [
  'flame sensor',
  'hot surface igniter',
  'pressure switch',
  'condensate trap',
  'gas valve',
  'inducer motor',
  'ECM blower',
  'TXV',
  'thermocouple',
  'low water cutoff',
];
const FUELS = ['natural gas', 'LP', 'propane'];
// Body sentences: each article gets three of them, so a trade phrase appears in about a quarter of
// the articles, as in a knowledge base whose articles are about different jobs (a sentence in every
// article would make every query word match every row).
const SENTENCES = [
  'Measure inlet pressure in inches of water column with a manometer, static and under fire.',
  'Set manifold pressure on high and low fire, then compare with the rating plate.',
  'Clean the flame sensor rod with a fine pad and check the ground wire.',
  'Check the hot surface igniter resistance cold and look for cracks.',
  'Clear the condensate trap and drain line, then prime the trap.',
  'Test the pressure switch hose for water and the inducer for a blocked vent.',
  'Clock the gas meter with every other appliance off to find the firing rate.',
  'Measure temperature rise across the heat exchanger and set the blower speed.',
  'Convert the valve and orifices for LP with the kit, then leak-test every joint.',
  'Read flue gas CO and compare air-free CO against the limit.',
  'Test the low water cutoff by draining the probe chamber.',
  'Lift the relief valve lever and watch it reseat.',
];

/** Grows the articles table to `size` with generated, published articles. */
async function fillTo(size: number, authorId: number) {
  const { db } = testDb();
  const { rows } = await db.execute<{ n: number }>(sql`select count(*)::int as n from articles`);
  const have = rows[0]!.n;
  if (have > size)
    throw new Error(`the database already holds ${have} articles: give the bench an empty database`);
  if (have === size) return;
  const symptoms = `{${SYMPTOMS.map((s) => `"${s}"`).join(',')}}`;
  const parts = `{${PARTS.map((s) => `"${s}"`).join(',')}}`;
  const fuels = `{${FUELS.map((s) => `"${s}"`).join(',')}}`;
  const sentences = `{${SENTENCES.map((s) => `"${s}"`).join(',')}}`;
  await db.execute(sql`
    insert into articles (slug, title, summary, body, kind, audience, status, author_id, published_at, model_text)
    select 'bench-' || g,
           'Unit ZX-' || (g % 997) || ' ' || (${parts}::text[])[1 + g % 10] || ' ' || (${symptoms}::text[])[1 + (g / 10) % 10],
           'When the ZX-' || (g % 997) || ' on ' || (${fuels}::text[])[1 + g % 3] || ' ' || (${symptoms}::text[])[1 + (g / 7) % 10] || ', check the ' || (${parts}::text[])[1 + (g / 3) % 10] || '.',
           (${sentences}::text[])[1 + g % 12] || ' ' || (${sentences}::text[])[1 + (g / 12) % 12] || ' '
             || (${sentences}::text[])[1 + (g / 144) % 12] || ' Series ' || g || ' word' || (g % 5003) || ' ' || (${parts}::text[])[1 + (g / 11) % 10] || '.',
           (array['procedure','troubleshooting','spec-sheet','bulletin']::article_kind[])[1 + g % 4],
           (case when g % 5 = 0 then 'staff' else 'contractor' end)::audience,
           'published', ${authorId}, now(), 'ZX-' || (g % 997) || ' ZX' || (g % 997)
      from generate_series(${have + 1}::int, ${size}::int) as g`);
  await db.execute(sql`
    insert into search_words (word)
    select distinct lower(m[1]) from (select title || ' ' || summary || ' ' || body as t from articles order by id limit 3000) a,
         regexp_matches(a.t, '([A-Za-z][A-Za-z0-9]{3,29})', 'g') as m
    on conflict do nothing`);
  // A bulk insert leaves its rows in the GIN indexes' pending lists until a vacuum merges them (the
  // autovacuum does so within a minute in service); measure the settled indexes, not the backlog.
  await db.execute(sql`vacuum (analyze) articles`);
  await db.execute(sql`vacuum (analyze) search_words`);
}

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}
const stats = (samples: number[]) => {
  const s = [...samples].sort((a, b) => a - b);
  return { p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99) };
};

/** Sends the paths from CONCURRENCY clients (in a worker thread), each waiting for its answer before the next. */
async function load(base: string, cookie: string, paths: string[]) {
  const worker = new Worker(new URL('./http-load.mjs', import.meta.url), {
    workerData: { base, cookie, paths, concurrency: CONCURRENCY },
  });
  const times = await new Promise<number[]>((resolve, reject) => {
    worker.once('message', resolve);
    worker.once('error', reject);
  });
  await worker.terminate();
  return stats(times);
}

const server = await startTestServer();
try {
  const specialist = await makeUser({ role: 'specialist' });
  const reader = await signedInClient(server, await makeUser());
  const cookie = reader.cookieHeader();
  const model = await makeEquipmentModel();
  const queryTexts = [
    ...RELEVANCE_CASES.map((c) => c.query),
    ...Array.from({ length: 30 }, (_, i) => `ZX-${(i * 37) % 997} ${PARTS[i % 10]}`),
    ...Array.from({ length: 20 }, (_, i) => `zx${(i * 53) % 997}`),
  ];
  const searches = Array.from(
    { length: QUERIES },
    (_, i) => `/api/search?q=${encodeURIComponent(queryTexts[i % queryTexts.length]!)}&limit=10`,
  );
  const suggests = Array.from(
    { length: QUERIES },
    (_, i) => `/api/search/suggest?q=${encodeURIComponent(queryTexts[i % queryTexts.length]!.slice(0, 8))}`,
  );
  const floors = Array.from({ length: QUERIES }, () => `/api/equipment/${model.id}`);
  const rows: string[] = [];
  for (const size of SIZES) {
    const started = performance.now();
    await fillTo(size, specialist.id);
    console.log(
      `  ${size.toLocaleString('en-US')} articles ready in ${((performance.now() - started) / 1000).toFixed(1)} s`,
    );
    await load(server.url, cookie, searches.slice(0, 50)); // warm up caches and plans
    const floor = await load(server.url, cookie, floors);
    const search = await load(server.url, cookie, searches);
    const suggest = await load(server.url, cookie, suggests);
    const f = (v: number) => v.toFixed(1);
    rows.push(
      `| ${size.toLocaleString('en-US')} | ${f(search.p50)} / ${f(search.p95)} / ${f(search.p99)} | ${f(suggest.p50)} / ${f(suggest.p95)} / ${f(suggest.p99)} | ${f(floor.p95)} | ${(search.p95 / floor.p95).toFixed(1)}× |`,
    );
  }
  console.log(
    `\n${QUERIES} queries per size, ${CONCURRENCY} concurrent clients, latencies in ms (p50 / p95 / p99).\n`,
  );
  console.log('| articles | search | suggest | floor p95 (indexed lookup) | search p95 / floor p95 |');
  console.log('|---:|---|---|---:|---:|');
  for (const r of rows) console.log(r);
  console.log('\nTargets: search p95 ≤ 20 ms at 10k, ≤ 50 ms at 100k; suggest p95 ≤ 15 ms at 10k.');
} finally {
  await server.stop();
  await closeTestDb();
}
