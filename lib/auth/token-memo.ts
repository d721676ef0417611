import { decode, type JWT } from 'next-auth/jwt';

// The decoded session tokens this process has seen, by the token's exact text. A session cookie is the same
// encrypted text on every request until next-auth re-issues it, and decoding it (an HKDF key derivation and an
// AES-GCM decryption, ~0.1 ms) was the largest part of our own cost in an authenticated request (scripts/bench-api.ts).
// Only what a successful decode gave is kept, with the secret it was decoded under; the expiry is checked on every
// use with next-auth's own tolerance, so a remembered token stops working exactly when a decode would refuse it.
// Nothing else is trusted from here: who the user is now (active, role, session version) is still read from the
// database on every request (lib/auth/roles.ts getViewer).

/** next-auth's decode accepts a token until `exp` plus this many seconds (its jose clockTolerance). */
export const CLOCK_TOLERANCE_S = 15;

/** At most this many tokens are remembered; the least recently used goes first. */
export const MEMO_SIZE = 2000;

type Entry = { secret: string; payload: JWT };

export class DecodedTokenMemo {
  private readonly entries = new Map<string, Entry>();

  constructor(private readonly size = MEMO_SIZE) {}

  /** The payload remembered for this token and secret; null when unknown, decoded under another secret, or expired. */
  get(token: string, secret: string, nowS: number): JWT | null {
    const entry = this.entries.get(token);
    if (!entry || entry.secret !== secret) return null;
    if (isExpired(entry.payload, nowS)) {
      this.entries.delete(token);
      return null;
    }
    this.entries.delete(token); // most recently used last
    this.entries.set(token, entry);
    return entry.payload;
  }

  set(token: string, secret: string, payload: JWT): void {
    this.entries.delete(token);
    this.entries.set(token, { secret, payload: Object.freeze(payload) });
    while (this.entries.size > this.size) this.entries.delete(this.entries.keys().next().value as string);
  }

  get count(): number {
    return this.entries.size;
  }
}

/** The decode's own rule: refused once `exp` <= now - tolerance (jose's jwtDecrypt with clockTolerance 15). */
export function isExpired(payload: object, nowS: number): boolean {
  const { exp } = payload as { exp?: unknown };
  return typeof exp === 'number' && exp <= nowS - CLOCK_TOLERANCE_S;
}

const memo = new DecodedTokenMemo();

/**
 * next-auth's `decode` of a session token, remembered: null for a tampered, expired or foreign token, as decode
 * gives. A refused token is never remembered (it costs a decode each time, as before).
 */
export async function decodeSessionToken(token: string, secret: string, nowS = Date.now() / 1000, store = memo): Promise<JWT | null> {
  const known = store.get(token, secret, nowS);
  if (known) return known;
  let payload: JWT | null;
  try {
    payload = await decode({ token, secret });
  } catch {
    return null;
  }
  if (payload) store.set(token, secret, payload);
  return payload;
}
