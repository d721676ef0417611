import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** NEXTAUTH_SECRET from the environment, else the one kept in .data/nextauth-secret (generated on first run). */
export function ensureNextauthSecret(root: string, env: NodeJS.ProcessEnv = process.env): string {
  return ensureKeptSecret(root, 'NEXTAUTH_SECRET', 'nextauth-secret', env);
}

/** RESEARCH_CODE_SECRET (the key of the players' research codes) from the environment, else .data/research-code-secret. */
export function ensureResearchCodeSecret(root: string, env: NodeJS.ProcessEnv = process.env): string {
  return ensureKeptSecret(root, 'RESEARCH_CODE_SECRET', 'research-code-secret', env);
}

function ensureKeptSecret(root: string, name: string, fileName: string, env: NodeJS.ProcessEnv): string {
  if (env[name]) return env[name];
  const file = join(root, '.data', fileName);
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(32).toString('hex'); // 256 bits
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
