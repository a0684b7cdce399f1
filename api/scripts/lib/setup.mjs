// The set-up every mode shares: dependencies, the PostgreSQL server and our cluster, migrations.
import { DATA, ROOT, onCleanup, onExitSync } from './lifecycle.mjs';
import { step } from './log.mjs';
import { parsePort } from './net.mjs';
import { ensurePostgresServer, startCluster } from './postgres.mjs';
import { run } from './proc.mjs';
import { ensureNodeModules } from './system.mjs';

export { DATA, ROOT };

/** Run a Node script of the repository (as one process, so it stops by pid). */
export const node = (args, options) => run(process.execPath, args, { cwd: ROOT, ...options });

/** Dependencies, the server package and the running cluster; returns the cluster handle. */
export async function preparePostgres(results) {
  await step('dependencies', () => ensureNodeModules(ROOT), results);
  await step('postgresql server', () => ensurePostgresServer(), results);
  const port = parsePort(process.env.LIGHTOFF_PGPORT, 54329, 'LIGHTOFF_PGPORT');
  const pg = await step('database cluster', () => startCluster({ root: ROOT, port }), results);
  onCleanup('stop PostgreSQL', () => pg.stop());
  onExitSync(() => pg.stopSync());
  return pg;
}

export async function migrate(env) {
  await node(['--import', 'tsx', 'api/scripts/migrate.ts'], { env, output: '[migrate] ' });
}
