import { hash, verify } from '@node-rs/argon2';

// argon2id at OWASP's minimum recommendation: 19 MiB of memory, 2 passes, 1 lane.
// `algorithm: 2` is Algorithm.Argon2id (a const enum the package's types do not let us import).
const OPTIONS = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

// Verified against when the e-mail is unknown, so both answers take the same time.
let dummyHash: Promise<string> | undefined;

export async function verifyPassword(storedHash: string | null, password: string): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= hashPassword('not-a-real-password-for-timing');
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(storedHash, password).catch(() => false);
}
