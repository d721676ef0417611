import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { getViewer } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { findActiveUser } from '@/lib/db/users';
import { toIsoTime } from '@/lib/db/values';
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '@/lib/http';
import type { TokenCreated, TokenView } from '@/lib/contracts/research';

// Personal API tokens of researchers, for scripts that fetch exports. 32 random bytes (256 bits) in base64url after a
// recognisable prefix; only the SHA-256 of the whole token is stored (a fast hash is enough for a random 256-bit
// secret: there is nothing to guess from). Valid on the export routes only (requireExporter); every other route reads
// the session cookie alone and so answers 401 to a bearer token.

const PREFIX = 'stl_';
const hashOf = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

export async function createToken(viewer: Viewer, name: string): Promise<TokenCreated> {
  const token = `${PREFIX}${randomBytes(32).toString('base64url')}`;
  const [id] = await db('api_tokens').insert({ user_id: viewer.id, name, token_hash: hashOf(token), prefix: token.slice(0, 10) });
  return { id: Number(id), token };
}

export async function listTokens(viewer: Viewer): Promise<TokenView[]> {
  const rows = await db('api_tokens').where({ user_id: viewer.id }).orderBy('id', 'desc').select('*');
  return rows.map((r) => ({
    id: Number(r.id),
    name: r.name,
    prefix: r.prefix,
    createdAt: toIsoTime(r.created_at)!,
    lastUsedAt: toIsoTime(r.last_used_at),
    revokedAt: toIsoTime(r.revoked_at),
  }));
}

/** Revokes one of the viewer's own tokens (another user's token is a 404, as if unknown). Revoking twice is fine. */
export async function revokeToken(viewer: Viewer, id: number): Promise<{ id: number; revokedAt: string }> {
  const row = await db('api_tokens').where({ id, user_id: viewer.id }).first('id', 'revoked_at');
  if (!row) throw new NotFoundError('No token with this id.');
  if (!row.revoked_at) await db('api_tokens').where({ id }).update({ revoked_at: db.raw('NOW(3)') });
  const after = await db('api_tokens').where({ id }).first('revoked_at');
  return { id, revokedAt: toIsoTime(after.revoked_at)! };
}

export type Exporter = Viewer & { tokenId: number | null };

function bearer(request: Request): string | null {
  const header = request.headers.get('authorization');
  if (!header) return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match) throw new UnauthenticatedError('The Authorization header must be "Bearer <token>".');
  return match[1];
}

/**
 * Who asks for an export: a bearer token (researchers; an unknown, revoked or malformed token is a 401 even with a
 * session cookie), else the session: a researcher, or a coach for their own athletes. Other roles get 403.
 */
export async function requireExporter(request: Request): Promise<Exporter> {
  const token = bearer(request);
  if (token !== null) {
    const row = token.startsWith(PREFIX) ? await db('api_tokens').where({ token_hash: hashOf(token) }).whereNull('revoked_at').first('id', 'user_id') : undefined;
    if (!row) throw new UnauthenticatedError('This token is unknown or was revoked.');
    const user = await findActiveUser(Number(row.user_id));
    if (!user) throw new UnauthenticatedError('This token’s account is not active.');
    if (user.role !== 'researcher') throw new ForbiddenError('Tokens work for researcher accounts only.');
    await db('api_tokens').where({ id: row.id }).update({ last_used_at: db.raw('NOW(3)') });
    const full = await db('users').where({ id: row.user_id }).first('name', 'email');
    return { id: Number(row.user_id), role: user.role, academyId: user.academyId, name: full?.name ?? '', email: full?.email ?? '', tokenId: Number(row.id) };
  }
  const viewer = await getViewer();
  if (!viewer) throw new UnauthenticatedError();
  if (viewer.role !== 'researcher' && viewer.role !== 'coach') throw new ForbiddenError();
  return { ...viewer, tokenId: null };
}
