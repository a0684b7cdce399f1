// Builds the web app (Vite -> dist/web) and the API (esbuild -> dist/api/start.js) only when their
// inputs changed. The stamp is a content hash of the inputs, so a checkout, a touch or a clock skew
// does not trigger a rebuild, and an edit always does.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { BootstrapError, say } from './log.mjs';
import { run } from './proc.mjs';

const COMMON = ['shared', 'package-lock.json', 'tsconfig.json', 'tsconfig.base.json'];

export const TARGETS = {
  web: {
    inputs: [...COMMON, 'web', 'public', 'index.html', 'vite.config.ts', 'tsconfig.app.json'],
    output: 'dist/web/index.html',
    stamp: 'dist/.build-stamp-web',
    command: (root) => [process.execPath, [join(root, 'node_modules/vite/bin/vite.js'), 'build']],
  },
  api: {
    inputs: [...COMMON, 'api/src', 'api/scripts/build-api.mjs', 'drizzle', 'tsconfig.api.json'],
    output: 'dist/api/start.js',
    stamp: 'dist/.build-stamp-api',
    command: (root) => [process.execPath, [join(root, 'api/scripts/build-api.mjs')]],
  },
};

// Specs, test folders and type declarations do not change a bundle; editing them (or the build
// regenerating web/src/components.d.ts) must not cost a rebuild.
const IGNORED = /(^|\/)(node_modules|dist|coverage|__tests__|\.[^/]+)(\/|$)|\.spec\.ts$|\.d\.ts$/;

function listFiles(root, path, out) {
  const full = join(root, path);
  if (!existsSync(full)) return;
  for (const entry of readdirSync(full, { withFileTypes: true })) {
    const rel = `${path}/${entry.name}`;
    if (IGNORED.test(rel)) continue;
    if (entry.isDirectory()) listFiles(root, rel, out);
    else if (entry.isFile()) out.push(rel);
  }
}

/** sha256 over the input files' paths and contents, plus the Node version that builds them. */
export function inputHash(root, target) {
  const files = [];
  for (const input of TARGETS[target].inputs) {
    const full = join(root, input);
    if (!existsSync(full)) continue;
    if (readdirSafe(full)) listFiles(root, input, files);
    else files.push(input);
  }
  const hash = createHash('sha256').update(`node ${process.version}\n`);
  for (const file of files.sort()) {
    hash.update(`${file}\0`);
    hash.update(readFileSync(join(root, file)));
    hash.update('\0');
  }
  return hash.digest('hex');
}

function readdirSafe(path) {
  try {
    readdirSync(path);
    return true;
  } catch {
    return false;
  }
}

export function isFresh(root, target) {
  const { output, stamp } = TARGETS[target];
  if (!existsSync(join(root, output)) || !existsSync(join(root, stamp))) return false;
  return readFileSync(join(root, stamp), 'utf8').trim() === inputHash(root, target);
}

/**
 * Make dist/ match the sources for the given targets ('web', 'api'); builds run side by side.
 * Returns { web: 'fresh' | 'built', api: ... } for the targets asked for.
 */
export async function ensureBuilt(root, targets = ['web', 'api'], { force = false, output } = {}) {
  const results = {};
  await Promise.all(
    targets.map(async (target) => {
      const { output: artefact, stamp } = TARGETS[target];
      const hash = inputHash(root, target);
      const stampFile = join(root, stamp);
      if (
        !force &&
        existsSync(join(root, artefact)) &&
        existsSync(stampFile) &&
        readFileSync(stampFile, 'utf8').trim() === hash
      ) {
        results[target] = 'fresh';
        return;
      }
      say(`building ${target} (${existsSync(stampFile) ? 'sources changed' : 'no build yet'})`);
      // A half-finished build must never look current.
      rmSync(stampFile, { force: true });
      const [command, args] = TARGETS[target].command(root);
      // NODE_ENV=test or development (say, inherited from vitest) would make Vite bundle dev builds.
      const { NODE_ENV: _ignored, ...env } = process.env;
      await run(command, args, { cwd: root, env, output: output ?? `[build ${target}] ` });
      if (!existsSync(join(root, artefact))) {
        throw new BootstrapError(
          `building ${target} finished but ${relative(root, join(root, artefact)) || artefact} is missing`,
        );
      }
      mkdirSync(join(root, 'dist'), { recursive: true });
      writeFileSync(stampFile, `${hash}\n`);
      results[target] = 'built';
    }),
  );
  return results;
}
