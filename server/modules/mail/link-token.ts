import { createHash, randomBytes } from 'node:crypto';

/**
 * A new secret for a link in a message: 32 random bytes (256 bits) in base64url, and its SHA-256 hash,
 * which is all the database keeps, so that a copy of the database opens no account.
 *
 * @returns the token for the link and the hash to store
 */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

/**
 * The stored form of a link token. A fast hash is enough here: the token is random and long, so there is
 * nothing to guess that a slow hash would protect.
 *
 * @param token the token from a link
 * @returns its SHA-256, hex
 */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
