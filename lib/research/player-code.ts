import { createHmac } from 'node:crypto';

// A stable pseudonymous code for a player: HMAC-SHA256 (RFC 2104, FIPS 198-1) of the player id under a server
// secret (RESEARCH_CODE_SECRET), the first 12 hex digits (48 bits), prefixed 'P'. Without the secret the code cannot be
// turned back into an id or made for a guessed id; changing the secret changes every code.
export const PLAYER_CODE_HEX_DIGITS = 12;

export function playerCode(secret: string, athleteId: number): string {
  if (secret.length < 32) throw new RangeError('the player-code secret must be at least 32 characters');
  const mac = createHmac('sha256', secret).update(`stanceline-athlete:${athleteId}`, 'utf8').digest('hex');
  return `P${mac.slice(0, PLAYER_CODE_HEX_DIGITS)}`;
}
