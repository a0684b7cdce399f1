// The cluster on disk and the user it runs as: where its files live, who owns them, how a fresh
// cluster is made, and which leftovers of a crash may be cleared away. As root everything server-side
// runs as the `postgres` user, because PostgreSQL refuses to run as root.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  chmodSync,
  chownSync,
  existsSync,
  mkdirSync,
  readFileSync,
  readdirSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BootstrapError, say, warn } from './log.mjs';
import { commandLineOf, isAlive, isRoot, run } from './proc.mjs';
import { randomSecret } from './secrets.mjs';

export const SUPERUSER = 'lightoff';

/** PG* variables of the caller's shell must not redirect our clients elsewhere. */
export function cleanEnv(extra = {}) {
  const env = Object.fromEntries(Object.entries(process.env).filter(([key]) => !key.startsWith('PG')));
  return { ...env, ...extra };
}

function postgresCanReach(dir) {
  const result = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir, '-a', '-r', dir], {
    cwd: '/',
    stdio: 'ignore',
  });
  return result.status === 0;
}

/**
 * Where the cluster lives. Normally <repo>/.data/{pg,run,pg.log}. As root, when the `postgres` user
 * cannot reach the repository (say, a clone under /root), the server's files go to
 * /var/lib/lightoff/<hash of the repo path>. Bookkeeping (password, owner) always stays in .data.
 */
export function clusterPaths(root) {
  const dataDir = join(root, '.data');
  const hash = createHash('sha256').update(root).digest('hex').slice(0, 12);
  let base = dataDir;
  let relocated = false;
  if (isRoot()) {
    mkdirSync(dataDir, { recursive: true });
    chmodSync(dataDir, 0o755);
    if (!postgresCanReach(dataDir)) {
      base = join('/var/lib/lightoff', hash);
      relocated = true;
    }
  }
  let sockDir = join(base, 'run');
  // A Unix socket path must fit in 107 bytes; a deep checkout gets its socket under the temp dir.
  if (`${sockDir}/.s.PGSQL.65535`.length > 100) sockDir = join(tmpdir(), `lightoff-${hash}`);
  return {
    base,
    relocated,
    pgdata: join(base, 'pg'),
    sockDir,
    logFile: join(base, 'pg.log'),
    passwordFile: join(dataDir, 'pg-password'),
    ownerFile: join(dataDir, 'pg-owner'),
  };
}

export function asPostgres(command, args, options = {}) {
  const env = cleanEnv({ LC_ALL: 'C.UTF-8' });
  if (isRoot())
    return run('runuser', ['-u', 'postgres', '--', command, ...args], { cwd: '/', env, ...options });
  return run(command, args, { env, ...options });
}

/** A directory the server user owns (as root: chown to postgres). */
export function serverDir(dir) {
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  chmodSync(dir, 0o700);
  if (isRoot()) {
    const { uid, gid } = postgresIds();
    chownSync(dir, uid, gid);
  }
}

let ids;
export function postgresIds() {
  if (ids) return ids;
  const out = spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' });
  const grp = spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' });
  if (out.status !== 0)
    throw new BootstrapError(
      'the `postgres` system user is missing: reinstall the Debian package postgresql',
    );
  ids = { uid: Number(out.stdout.trim()), gid: Number(grp.stdout.trim()) };
  return ids;
}

export function readPidFile(pgdata) {
  const file = join(pgdata, 'postmaster.pid');
  if (!existsSync(file)) return null;
  const lines = readFileSync(file, 'utf8').split('\n');
  return { file, pid: Number(lines[0]), port: Number(lines[3]) };
}

/**
 * After a crash (kill -9, power loss) the socket's lock file still names the dead postmaster; when that
 * pid lingers as a zombie, PostgreSQL thinks it is alive and refuses to start. Remove such leftovers.
 */
export function removeStaleSocketLocks(sockDir, pgdata) {
  if (!existsSync(sockDir)) return;
  for (const name of readdirSync(sockDir)) {
    const match = /^\.s\.PGSQL\.(\d+)\.lock$/.exec(name);
    if (!match) continue;
    const lock = join(sockDir, name);
    const pid = Number(readFileSync(lock, 'utf8').split('\n')[0]);
    if (isOurPostmaster(pid, pgdata)) continue;
    rmSync(lock, { force: true });
    rmSync(join(sockDir, `.s.PGSQL.${match[1]}`), { force: true });
  }
}

// The postmaster's command line names its data directory; a reused pid of another program does not.
export const isOurPostmaster = (pid, pgdata) => isAlive(pid) && commandLineOf(pid).includes(pgdata);

export async function initCluster(paths, bin) {
  if (existsSync(join(paths.pgdata, 'PG_VERSION'))) {
    // A relocated cluster outlives .data (a fresh clone at the same path): its copy of the password
    // sits beside it.
    const copy = join(paths.base, 'pg-password');
    if (!existsSync(paths.passwordFile) && paths.relocated && existsSync(copy)) {
      writeFileSync(paths.passwordFile, readFileSync(copy), { mode: 0o600 });
    }
    if (!existsSync(paths.passwordFile)) {
      throw new BootstrapError(
        `the database cluster in ${paths.pgdata} exists but its password file ${paths.passwordFile} is gone; ` +
          `remove ${paths.pgdata} to start with a fresh, empty cluster`,
      );
    }
    return false;
  }
  if (existsSync(paths.pgdata) && readdirSync(paths.pgdata).length > 0) {
    warn(`${paths.pgdata} holds an unfinished cluster (no PG_VERSION): removing it`);
    rmSync(paths.pgdata, { recursive: true, force: true });
  }
  mkdirSync(paths.base, { recursive: true, mode: 0o755 });
  serverDir(paths.pgdata);
  serverDir(paths.sockDir);
  const password = randomSecret(24);
  writeFileSync(paths.passwordFile, `${password}\n`, { mode: 0o600 });
  chmodSync(paths.passwordFile, 0o600);
  if (paths.relocated) writeFileSync(join(paths.base, 'pg-password'), `${password}\n`, { mode: 0o600 });
  // initdb reads the password from a file the server user can read; it is removed right after.
  const pwfile = join(paths.sockDir, '.initdb-pw');
  writeFileSync(pwfile, `${password}\n`, { mode: 0o600 });
  if (isRoot()) chownSync(pwfile, postgresIds().uid, postgresIds().gid);
  try {
    await asPostgres(
      join(bin, 'initdb'),
      [
        '-D',
        paths.pgdata,
        '-U',
        SUPERUSER,
        `--pwfile=${pwfile}`,
        '--auth-host=scram-sha-256',
        '--auth-local=peer',
        '--encoding=UTF8',
        '--locale=C.UTF-8',
      ],
      { output: 'capture' },
    );
  } finally {
    rmSync(pwfile, { force: true });
  }
  say(`created a database cluster in ${paths.pgdata}`);
  return true;
}

export function tail(file, lines = 15) {
  try {
    return readFileSync(file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no log)';
  }
}

/** The owner is the bootstrap process that started the cluster; a dead owner means it was left behind. */
export function readOwner(file) {
  try {
    return Number(readFileSync(file, 'utf8').trim()) || null;
  } catch {
    return null;
  }
}
