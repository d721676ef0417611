import 'server-only';
import { db } from '@/lib/db/client';
import { compileOnce } from '@/lib/db/compiled';
import { ConflictError, ForbiddenError, NotFoundError } from '@/lib/http';
import type { Role, UpdateUserInput } from '@/lib/contracts/users';
import type { AcademyUser } from '@/lib/contracts/users';

export type UserForSignIn = {
  id: number;
  academyId: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  passwordHash: string;
  sessionVersion: number;
};

type UserRow = {
  id: number;
  academy_id: number;
  email: string;
  name: string;
  role: Role;
  active: number | boolean;
  password_hash?: string;
  session_version?: number;
};

function toAcademyUser(row: UserRow): AcademyUser {
  return { id: Number(row.id), email: row.email, name: row.name, role: row.role, active: Boolean(row.active) };
}

/** Emails are stored lower-case (schema rule); callers pass the normalised address. */
export async function findUserForSignIn(email: string): Promise<UserForSignIn | null> {
  const row: UserRow | undefined = await db('users')
    .select('id', 'academy_id', 'email', 'name', 'role', 'active', 'password_hash', 'session_version')
    .where({ email: email.toLowerCase() })
    .first();
  if (!row) return null;
  return {
    id: Number(row.id),
    academyId: Number(row.academy_id),
    email: row.email,
    name: row.name,
    role: row.role,
    active: Boolean(row.active),
    passwordHash: row.password_hash ?? '',
    sessionVersion: Number(row.session_version ?? 0),
  };
}

export async function listAcademyUsers(academyId: number): Promise<AcademyUser[]> {
  const rows: UserRow[] = await db('users')
    .select('id', 'academy_id', 'email', 'name', 'role', 'active')
    .where({ academy_id: academyId })
    .orderBy([{ column: 'role' }, { column: 'name' }]);
  return rows.map(toAcademyUser);
}

export async function getAcademyUser(academyId: number, userId: number): Promise<AcademyUser> {
  const row: UserRow | undefined = await db('users')
    .select('id', 'academy_id', 'email', 'name', 'role', 'active')
    .where({ academy_id: academyId, id: userId })
    .first();
  if (!row) throw new NotFoundError('No user with this id in your academy.');
  return toAcademyUser(row);
}

export async function createAcademyUser(
  academyId: number,
  input: { email: string; name: string; role: Role; passwordHash: string },
): Promise<AcademyUser> {
  const now = new Date();
  try {
    const [id] = await db('users').insert({
      academy_id: academyId,
      email: input.email.toLowerCase(),
      name: input.name,
      role: input.role,
      password_hash: input.passwordHash,
      active: true,
      created_at: now,
      updated_at: now,
    });
    return getAcademyUser(academyId, Number(id));
  } catch (error) {
    if ((error as { code?: string }).code === 'ER_DUP_ENTRY') {
      throw new ConflictError('An account with this email already exists.');
    }
    throw error;
  }
}

/** Admins change roles and deactivate accounts; they cannot do either to themselves (no self lock-out). */
export async function updateAcademyUser(
  admin: { id: number; academyId: number },
  userId: number,
  patch: UpdateUserInput,
): Promise<AcademyUser> {
  await getAcademyUser(admin.academyId, userId);
  if (userId === admin.id) throw new ForbiddenError('You cannot change your own role or deactivate yourself.');
  const columns: Record<string, unknown> = { updated_at: new Date() };
  if (patch.role !== undefined) columns.role = patch.role;
  if (patch.active !== undefined) columns.active = patch.active;
  // Deactivation ends every session of the account for good: reactivating it later does not revive old tokens.
  if (patch.active === false) columns.session_version = db.raw('session_version + 1');
  await db('users').where({ id: userId, academy_id: admin.academyId }).update(columns);
  return getAcademyUser(admin.academyId, userId);
}

// on every authenticated request's path: compiled once (lib/db/compiled.ts)
const ACTIVE_USER = compileOnce(1, (conn, userId: number) => conn('users').select('role', 'academy_id', 'active', 'session_version').where({ id: userId }).limit(1));

/** Active flag, current role and session version, re-read on each request so a deactivated account loses access at once. */
export async function findActiveUser(userId: number): Promise<{ role: Role; academyId: number; sessionVersion: number } | null> {
  const row = (await ACTIVE_USER.rows(db, userId))[0] as UserRow | undefined;
  if (!row || !row.active) return null;
  return { role: row.role, academyId: Number(row.academy_id), sessionVersion: Number(row.session_version ?? 0) };
}

/** Sign-out: every token issued before now stops working (getViewer compares versions). */
export async function bumpSessionVersion(userId: number): Promise<void> {
  await db('users').where({ id: userId }).update({ session_version: db.raw('session_version + 1') });
}
