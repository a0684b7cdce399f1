// What a browser downloads for a route, gzipped: the entry chunk with its static imports, plus the
// route's view chunk with its static imports, read from the Vite manifest. The baseline, measured in
// the same run, is the entry chunk alone (the app shell); each route prints its ratio to it.
// Budget: sign-in at most 150 KB of gzipped JavaScript (KB = 1024 bytes). Exit 1 when over budget.
//   npm run bench:bundle
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { ensureBuilt } from '../../api/scripts/lib/build.mjs';

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  css?: string[];
}
type Manifest = Record<string, ManifestChunk>;

interface Route {
  name: string;
  view: string;
  budgetJsKb?: number;
}

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DIST = join(ROOT, 'dist/web');
const MANIFEST = join(DIST, '.vite/manifest.json');
const ROUTES: Route[] = [
  { name: 'sign-in', view: 'SignInView.vue', budgetJsKb: 150 },
  { name: 'contractor home', view: 'ContractorHomeView.vue' },
];

const kb = (bytes: number) => bytes / 1024;
const gzipped = new Map<string, number>();
function gzipSize(file: string): number {
  let size = gzipped.get(file);
  if (size === undefined) {
    size = gzipSync(readFileSync(join(DIST, file)), { level: 9 }).length;
    gzipped.set(file, size);
  }
  return size;
}

/** The files a chunk brings with it: itself, its CSS, and the same for every static import. */
function closure(manifest: Manifest, key: string, files = new Set<string>()): Set<string> {
  const chunk = manifest[key];
  if (!chunk || files.has(chunk.file)) return files;
  files.add(chunk.file);
  for (const css of chunk.css ?? []) files.add(css);
  for (const imported of chunk.imports ?? []) closure(manifest, imported, files);
  return files;
}

function sizes(files: Iterable<string>) {
  let js = 0;
  let css = 0;
  for (const file of files) {
    if (file.endsWith('.js')) js += gzipSize(file);
    else if (file.endsWith('.css')) css += gzipSize(file);
  }
  return { js, css };
}

function entryKey(manifest: Manifest): string {
  const entries = Object.keys(manifest).filter((key) => manifest[key]?.isEntry);
  const key = entries.find((k) => k === 'index.html' || k.endsWith('/index.html')) ?? entries[0];
  if (!key) throw new Error(`${MANIFEST} has no entry chunk`);
  return key;
}

/** The view's own chunk, or undefined when the view is bundled into the entry (the landing route). */
function viewKey(manifest: Manifest, view: string): string | undefined {
  return Object.keys(manifest).find((key) => (manifest[key]?.src ?? key).endsWith(`views/${view}`));
}

async function main(): Promise<number> {
  await ensureBuilt(ROOT, ['web']);
  if (!existsSync(MANIFEST)) {
    console.error(`${MANIFEST} is missing: vite.config.ts must set build.manifest: true`);
    return 1;
  }
  const manifest = JSON.parse(readFileSync(MANIFEST, 'utf8')) as Manifest;
  const entry = entryKey(manifest);
  const shellChunk = manifest[entry]!;
  const shell = sizes([shellChunk.file, ...(shellChunk.css ?? [])]);
  const shellJs = shell.js;

  const rows: string[][] = [
    [
      'app shell (baseline: entry chunk alone)',
      kb(shell.js).toFixed(1),
      kb(shell.css).toFixed(1),
      '-',
      '-',
      '1.00',
    ],
  ];
  let failed = false;
  for (const route of ROUTES) {
    if (!existsSync(join(ROOT, 'web/src/views', route.view))) {
      console.error(`web/src/views/${route.view} does not exist: cannot measure the ${route.name} route`);
      failed = true;
      continue;
    }
    const files = closure(manifest, entry);
    const key = viewKey(manifest, route.view);
    if (key) closure(manifest, key, files);
    const { js, css } = sizes(files);
    const budget = route.budgetJsKb;
    const ratio = budget ? kb(js) / budget : undefined;
    if (ratio !== undefined && ratio > 1) failed = true;
    rows.push([
      `${route.name}${key ? '' : ' (view inside the entry)'}`,
      kb(js).toFixed(1),
      kb(css).toFixed(1),
      budget ? `${budget} KB JS` : '-',
      ratio === undefined ? '-' : ratio.toFixed(2),
      (js / shellJs).toFixed(2),
    ]);
  }

  const header = ['route', 'JS gzip KB', 'CSS gzip KB', 'budget', 'ratio to budget', 'ratio to shell (JS)'];
  const table = [header, ...rows];
  const widths = header.map((_, i) => Math.max(...table.map((row) => row[i]!.length)));
  const line = (row: string[]) =>
    row.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]!) : cell.padStart(widths[i]!))).join('  ');
  console.log(`\nbundle size per route (gzip -9, KB = 1024 bytes), from ${MANIFEST.slice(ROOT.length)}\n`);
  console.log(line(header));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const row of rows) console.log(line(row));
  console.log(failed ? '\nover budget (or a route could not be measured)' : '\nwithin budget');
  return failed ? 1 : 0;
}

process.exitCode = await main();
