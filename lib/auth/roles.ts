import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { getAuthOptions } from '@/lib/auth/options';
import type { Viewer } from '@/lib/auth/viewer';
import { findActiveUser } from '@/lib/db/users';
import { ForbiddenError, UnauthenticatedError } from '@/lib/http';
import type { Role } from '@/lib/contracts/users';

/**
 * The signed-in user, or null. The role and academy are re-read from the database so that a deactivated
 * account or a changed role takes effect on the next request, not when the JWT expires.
 */
export async function getViewer(): Promise<Viewer | null> {
  const session = await getServerSession(getAuthOptions());
  const id = session?.user?.id;
  if (typeof id !== 'number' || !Number.isFinite(id)) return null;
  const current = await findActiveUser(id);
  if (!current) return null;
  // A token from before the last sign-out or deactivation (users.session_version moved on) is dead.
  if (session!.user.sessionVersion !== current.sessionVersion) return null;
  return { id, role: current.role, academyId: current.academyId, name: session!.user.name, email: session!.user.email };
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
