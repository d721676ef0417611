import 'server-only';
import bcrypt from 'bcryptjs';

// Cost 12 for real accounts (schema rule); about 0.2-0.3 s per hash on a small server.
export const BCRYPT_COST = 12;

// Compared against when the email is unknown, with the same cost as real accounts, so an unknown email takes
// about as long as a known one (no account discovery by timing). Made on first use, not at import.
let dummyHash: string | undefined;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  if (hash) return bcrypt.compare(password, hash);
  dummyHash ??= await bcrypt.hash('stanceline-no-such-account', BCRYPT_COST);
  await bcrypt.compare(password, dummyHash);
  return false;
}
