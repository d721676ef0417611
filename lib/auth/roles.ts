import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { getAuthOptions } from '@/lib/auth/options';
import { readSessionToken } from '@/lib/auth/session-token';
import type { Viewer } from '@/lib/auth/viewer';
import { findActiveUser } from '@/lib/db/users';
import { ForbiddenError, UnauthenticatedError } from '@/lib/http';
import type { Role } from '@/lib/contracts/users';

/**
 * The signed-in user, or null. The role and academy are re-read from the database so that a deactivated
 * account or a changed role takes effect on the next request, not when the JWT expires.
 */
export async function getViewer(): Promise<Viewer | null> {
  const claims = await sessionClaims();
  if (!claims) return null;
  const current = await findActiveUser(claims.id);
  if (!current) return null;
  // A token from before the last sign-out or deactivation (users.session_version moved on) is dead.
  if (claims.sessionVersion !== current.sessionVersion) return null;
  return { id: claims.id, role: current.role, academyId: current.academyId, name: claims.name, email: claims.email };
}

type Claims = { id: number; name: string; email: string; sessionVersion: number };

/**
 * Who the session cookie names: its JWT decoded directly (lib/auth/session-token.ts), read the way the session
 * callback of lib/auth/options.ts maps it (uid, sv, name, email). next-auth's whole session handler cost ~1.7 ms a
 * call against ~0.08 ms for the decode alone (scripts/bench-api.ts prints both); it also re-encrypted a refreshed
 * token that a route handler or server component throws away.
 */
async function sessionClaims(): Promise<Claims | null> {
  const secret = getAuthOptions().secret;
  if (secret) {
    const token = await readSessionToken(secret);
    const id = token?.uid;
    if (typeof id !== 'number' || !Number.isFinite(id)) return null;
    return { id, name: token!.name ?? '', email: token!.email ?? '', sessionVersion: typeof token!.sv === 'number' ? token!.sv : -1 };
  }
  // no configured secret (a dev run without NEXTAUTH_SECRET): next-auth's own path
  const session = await getServerSession(getAuthOptions());
  const id = session?.user?.id;
  if (typeof id !== 'number' || !Number.isFinite(id)) return null;
  return { id, name: session!.user.name, email: session!.user.email, sessionVersion: session!.user.sessionVersion };
}

/** For route handlers and server actions: 401 without a session, 403 for a role not listed. */
export async function requireRole(...roles: Role[]): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) throw new UnauthenticatedError();
  if (!roles.includes(viewer.role)) throw new ForbiddenError();
  return viewer;
}

/** For pages: send a visitor to sign in, and a user of another role to their own home page. */
export async function requirePageRole(...roles: Role[]): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) redirect('/sign-in');
  if (roles.length > 0 && !roles.includes(viewer.role)) redirect('/');
  return viewer;
}

export const ALL_ROLES: Role[] = ['admin', 'coach', 'student', 'researcher'];
