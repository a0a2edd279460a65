import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random token and the SHA-256 hex digest that is stored in its place. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: sha256Hex(token) };
}

export function sha256Hex(value: string): string {
  return createHash('sha256').update(value).digest('hex');
}
