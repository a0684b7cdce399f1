// What the machine must have before anything else runs: node_modules, Debian's packages.
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { BootstrapError, say } from './log.mjs';
import { isRoot, run } from './proc.mjs';

/** npm ci when node_modules is missing or older than package-lock.json. */
export async function ensureNodeModules(root) {
  const lock = join(root, 'package-lock.json');
  const installed = join(root, 'node_modules', '.package-lock.json');
  if (!existsSync(lock))
    throw new BootstrapError('package-lock.json is missing: cannot install dependencies reproducibly');
  if (existsSync(installed) && statSync(installed).mtimeMs >= statSync(lock).mtimeMs) return false;
  say(existsSync(installed) ? 'package-lock.json changed: npm ci' : 'no node_modules yet: npm ci');
  await run('npm', ['ci', '--no-audit', '--no-fund'], {
    cwd: root,
    env: { ...process.env, npm_config_update_notifier: 'false' },
  });
  return true;
}

let aptUpdated = false;

/** Install Debian packages as root; as anyone else, stop with the command to run. */
export async function aptInstall(packages, why) {
  if (!isRoot()) {
    throw new BootstrapError(
      `${why}: install the Debian package${packages.length > 1 ? 's' : ''} ${packages.join(' ')} ` +
        `(sudo apt-get install -y ${packages.join(' ')}) and run again`,
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive', NEEDRESTART_MODE: 'a' };
  say(`${why}: apt-get install ${packages.join(' ')}`);
  if (!aptUpdated) {
    await run('apt-get', ['update'], { env, output: '[apt] ' });
    aptUpdated = true;
  }
  await run('apt-get', ['install', '-y', ...packages], { env, output: '[apt] ' });
}

/** The Chromium that e2e tests drive: CHROMIUM_PATH, or Debian's /usr/bin/chromium (installed when root). */
export async function ensureChromium() {
  const path = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
  if (existsSync(path)) return path;
  if (process.env.CHROMIUM_PATH) throw new BootstrapError(`CHROMIUM_PATH=${path} does not exist`);
  await aptInstall(['chromium'], 'Chromium is needed for the end-to-end tests');
  if (!existsSync(path)) throw new BootstrapError(`apt-get installed chromium but ${path} is still missing`);
  return path;
}
