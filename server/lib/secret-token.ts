import { createHash, randomBytes } from 'node:crypto';

/**
 * A single-use link secret: 32 random bytes, base64url in the link; only its SHA-256
 * is stored, so a copy of the database does not hold working links.
 */
export function newSecretToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashSecretToken(token) };
}

export function hashSecretToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
