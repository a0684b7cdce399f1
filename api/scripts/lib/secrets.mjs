// Secrets generated on this machine and kept in files only the owner can read.
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

export const randomSecret = (bytes = 32) => randomBytes(bytes).toString('base64url');

/** Read the secret in `file`, or generate one there (mode 600) on first use. */
export function readOrCreateSecret(file, bytes = 32) {
  if (existsSync(file)) {
    const value = readFileSync(file, 'utf8').trim();
    if (value) {
      chmodSync(file, 0o600);
      return value;
    }
  }
  mkdirSync(dirname(file), { recursive: true });
  const value = randomSecret(bytes);
  writeFileSync(file, `${value}\n`, { mode: 0o600 });
  chmodSync(file, 0o600);
  return value;
}
