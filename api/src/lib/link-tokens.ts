import { createHash, randomBytes } from 'node:crypto';

/**
 * Secrets carried by e-mailed links (invitations, password resets): 32 random bytes as base64url.
 * Only the SHA-256 is stored, so a copy of the database cannot be turned back into working links;
 * a plain hash is enough because the token itself has 256 bits of randomness.
 */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
