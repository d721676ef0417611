import 'server-only';
import { cookies } from 'next/headers';
import type { JWT } from 'next-auth/jwt';
import { cookieSettings } from '@/lib/auth/cookies';
import { decodeSessionToken } from '@/lib/auth/token-memo';

// Reads the signed-in user's next-auth session JWT straight from the request's cookie: next-auth's own `decode` (HKDF
// key, JWE A256GCM, exp checked with its 15 s tolerance), remembered per token text (lib/auth/token-memo.ts). getServerSession does the
// same decode inside next-auth's whole session handler, and then encrypts a refreshed token that a route handler
// or server component throws away. Who the user is now (active, role, academy) is still read from the database on
// every request by getViewer (lib/auth/roles.ts).

/** The session cookie's value; next-auth splits values over 4 kB into NAME.0, NAME.1, ... */
async function sessionCookie(name: string): Promise<string | null> {
  const jar = await cookies();
  const whole = jar.get(name)?.value;
  if (whole) return whole;
  const parts = jar
    .getAll()
    .filter((c) => c.name.startsWith(`${name}.`) && /^\d+$/.test(c.name.slice(name.length + 1)))
    .sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1)));
  return parts.length ? parts.map((c) => c.value).join('') : null;
}

/** The decoded session token, or null (no cookie, tampered, expired, or another secret). */
export async function readSessionToken(secret: string): Promise<JWT | null> {
  const token = await sessionCookie(cookieSettings().sessionTokenName);
  if (!token) return null;
  return decodeSessionToken(token, secret);
}
