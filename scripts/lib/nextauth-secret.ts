import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** NEXTAUTH_SECRET from the environment, else the one kept in .data/nextauth-secret (generated on first run). */
export function ensureNextauthSecret(root: string, env: NodeJS.ProcessEnv = process.env): string {
  if (env.NEXTAUTH_SECRET) return env.NEXTAUTH_SECRET;
  const file = join(root, '.data', 'nextauth-secret');
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(32).toString('hex'); // 256 bits
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
