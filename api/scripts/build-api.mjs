// Bundles the API (and the shared/ code it imports) into dist/api/start.js; packages stay external.
import { build } from 'esbuild';

await build({
  entryPoints: ['api/src/start.ts'],
  outfile: 'dist/api/start.js',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  packages: 'external',
  sourcemap: true,
  logLevel: 'warning',
  banner: { js: '// Built by api/scripts/build-api.mjs: do not edit.' },
});
console.log('built dist/api/start.js');
