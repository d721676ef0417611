// Link tokens (invitations, password resets): 32 random bytes, base64url (43 characters), in the mail only. The
// database keeps the SHA-256 hex of the token, so a leaked table does not hold usable links. A token that differs in
// one character hashes to something else and finds nothing.
import { createHash, randomBytes } from 'node:crypto';

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
