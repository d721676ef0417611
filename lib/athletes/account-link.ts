import 'server-only';
import { requireAthlete } from '@/lib/auth/access';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ConflictError, NotFoundError } from '@/lib/http';
import { ZodError } from 'zod';
import type { AccountLinkResponse } from '@/lib/contracts/account-links';

// Who may link: an admin, for any player of their academy; a coach, for a player on their roster (write access).

async function requireLinkable(viewer: Viewer, athleteId: number): Promise<void> {
  if (viewer.role === 'admin') {
    const row = await db('athletes').where({ id: athleteId, academy_id: viewer.academyId }).first('id');
    if (!row) throw new NotFoundError('No athlete with this id.');
    return;
  }
  await requireAthlete(viewer, athleteId, 'write');
}

const fieldError = (field: string, message: string) => new ZodError([{ code: 'custom', path: [field], message, input: undefined }]);

export async function linkAccount(viewer: Viewer, athleteId: number, email: string): Promise<AccountLinkResponse> {
  await requireLinkable(viewer, athleteId);
  return db.transaction(async (trx) => {
    const user = await trx('users').where({ email, academy_id: viewer.academyId }).first('id', 'email', 'name', 'role', 'active');
    // one message for "no such account" and "another academy's account", so addresses cannot be probed
    if (!user || !user.active) throw fieldError('email', 'No active account with this e-mail address in your academy.');
    if (user.role !== 'student') throw fieldError('email', 'This account is not a student account; only student accounts can be linked to a player.');
    const other = await trx('athletes').where({ user_id: user.id }).whereNot({ id: athleteId }).forUpdate().first('id', 'display_name');
    if (other) throw new ConflictError(`This student account is already linked to ${other.display_name}; unlink it there first.`);
    await trx('athletes').where({ id: athleteId }).update({ user_id: user.id });
    return { athleteId, account: { id: Number(user.id), email: user.email, name: user.name } };
  });
}

export async function unlinkAccount(viewer: Viewer, athleteId: number): Promise<AccountLinkResponse> {
  await requireLinkable(viewer, athleteId);
  await db('athletes').where({ id: athleteId }).update({ user_id: null });
  return { athleteId, account: null };
}

export async function linkedAccount(athleteId: number): Promise<AccountLinkResponse['account']> {
  const row = await db('athletes as a').join('users as u', 'u.id', 'a.user_id').where('a.id', athleteId).first('u.id', 'u.email', 'u.name');
  return row ? { id: Number(row.id), email: row.email, name: row.name } : null;
}
