// Invitations by e-mail: an admin invites any role of their academy; a coach invites students for a player on their
// own roster. The mail carries a random token; the row keeps its hash. Accepting creates the account in one
// transaction and, for a student invited for a player, links it exactly as POST /api/athletes/:id/account does.
import 'server-only';
import { ZodError } from 'zod';
import { requireAthlete } from '@/lib/auth/access';
import { hashPassword } from '@/lib/auth/password';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoTime } from '@/lib/db/values';
import { ConflictError, ForbiddenError, HttpError, NotFoundError } from '@/lib/http';
import { appUrl, sendInvitationMail } from '@/lib/mail';
import { INVITATION_HOURS, type AcceptInvitationInput, type AcceptInvitationResponse, type CreateInvitationInput, type Invitation } from '@/lib/contracts/invitations';
import type { Role } from '@/lib/contracts/users';
import { academyName } from './academy';
import { hashToken, newToken } from './tokens';

const HOUR_MS = 60 * 60 * 1000;

export class InvalidLinkError extends HttpError {
  constructor(message = 'This link is not valid: it may have been used already, have expired, or be mistyped. Ask for a new one.') {
    super(400, 'invalid_link', message);
  }
}

const fieldError = (field: string, message: string) => new ZodError([{ code: 'custom', path: [field], message, input: undefined }]);

const ROLE_WORDS: Record<Role, string> = { admin: 'an academy admin', coach: 'a coach', student: 'a student', researcher: 'a researcher' };

type InvitationRow = {
  id: number;
  email: string;
  role: Role;
  athlete_id: number | null;
  display_name: string | null;
  inviter_name: string | null;
  sent_at: Date;
  expires_at: Date;
};

function toInvitation(row: InvitationRow, now: Date): Invitation {
  return {
    id: Number(row.id),
    email: row.email,
    role: row.role,
    athleteId: row.athlete_id === null ? null : Number(row.athlete_id),
    athleteName: row.display_name,
    invitedBy: row.inviter_name,
    sentAt: toIsoTime(row.sent_at) ?? '',
    expiresAt: toIsoTime(row.expires_at) ?? '',
    expired: new Date(row.expires_at).getTime() <= now.getTime(),
  };
}

/** Pending = neither accepted nor revoked (expired ones are listed too, flagged, so they can be resent). */
function pendingQuery(viewer: Viewer) {
  const q = db('invitations as i')
    .leftJoin('athletes as a', 'a.id', 'i.athlete_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.academy_id', viewer.academyId)
    .whereNull('i.accepted_at')
    .whereNull('i.revoked_at')
    .select('i.id', 'i.email', 'i.role', 'i.athlete_id', 'a.display_name', 'u.name as inviter_name', 'i.sent_at', 'i.expires_at')
    .orderBy([{ column: 'i.sent_at', order: 'desc' }, { column: 'i.id', order: 'desc' }]);
  // A coach sees the invitations they sent and those for players on their roster.
  if (viewer.role === 'coach') {
    q.where((w) =>
      w.where('i.invited_by', viewer.id).orWhereIn('i.athlete_id', db('coach_athletes').where({ coach_user_id: viewer.id }).select('athlete_id')),
    );
  }
  return q;
}

export async function listPendingInvitations(viewer: Viewer, now = new Date()): Promise<Invitation[]> {
  return (await pendingQuery(viewer)).map((row: InvitationRow) => toInvitation(row, now));
}

async function requirePending(viewer: Viewer, id: number): Promise<InvitationRow> {
  const row = await pendingQuery(viewer).where('i.id', id).first();
  if (!row) throw new NotFoundError('No pending invitation with this id.');
  return row;
}

async function checkInvitable(viewer: Viewer, input: CreateInvitationInput): Promise<number | null> {
  const athleteId = input.athleteId ?? null;
  if (viewer.role === 'coach') {
    if (input.role !== 'student') throw new ForbiddenError('Coaches invite students; ask an academy admin to invite other roles.');
    if (athleteId === null) throw fieldError('athleteId', 'Choose the player on your roster this student account is for.');
    await requireAthlete(viewer, athleteId, 'write', 'player');
  } else if (athleteId !== null) {
    if (input.role !== 'student') throw fieldError('athleteId', 'Only a student account can be linked to a player.');
    const row = await db('athletes').where({ id: athleteId, academy_id: viewer.academyId }).first('id');
    if (!row) throw new NotFoundError('No player with this id.');
  }
  if (athleteId !== null) {
    const linked = await db('athletes').where({ id: athleteId }).whereNotNull('user_id').first('id');
    if (linked) throw new ConflictError('This player already has a student account linked.');
  }
  const existing = await db('users').where({ email: input.email }).first('id');
  if (existing) throw fieldError('email', 'An account with this address exists already; it can sign in or reset its password.');
  return athleteId;
}

async function mailInvitation(viewer: Viewer, invitation: { email: string; role: Role; athleteId: number | null }, token: string): Promise<void> {
  const player = invitation.athleteId === null ? null : await db('athletes').where({ id: invitation.athleteId }).first('display_name');
  await sendInvitationMail(invitation.email, {
    academyName: await academyName(viewer.academyId),
    inviterName: viewer.name,
    roleWords: ROLE_WORDS[invitation.role],
    playerName: player?.display_name ?? null,
    url: appUrl(`/invite/${token}`),
    expiresHours: INVITATION_HOURS,
  });
}

/** Creates the invitation and sends its mail. An earlier pending invitation to the same address is revoked. */
export async function createInvitation(viewer: Viewer, input: CreateInvitationInput, now = new Date()): Promise<Invitation> {
  const athleteId = await checkInvitable(viewer, input);
  const { token, hash } = newToken();
  const id = await db.transaction(async (trx) => {
    await trx('invitations').where({ academy_id: viewer.academyId, email: input.email }).whereNull('accepted_at').whereNull('revoked_at').update({ revoked_at: now });
    const [inserted] = await trx('invitations').insert({
      academy_id: viewer.academyId,
      email: input.email,
      role: input.role,
      athlete_id: athleteId,
      invited_by: viewer.id,
      token_hash: hash,
      created_at: now,
      sent_at: now,
      expires_at: new Date(now.getTime() + INVITATION_HOURS * HOUR_MS),
    });
    return Number(inserted);
  });
  await mailInvitation(viewer, { email: input.email, role: input.role, athleteId }, token);
  return toInvitation(await requirePending(viewer, id), now);
}

/** A new token and 72 h from now; the old link stops working. */
export async function resendInvitation(viewer: Viewer, id: number, now = new Date()): Promise<Invitation> {
  const row = await requirePending(viewer, id);
  const { token, hash } = newToken();
  await db('invitations').where({ id }).update({ token_hash: hash, sent_at: now, expires_at: new Date(now.getTime() + INVITATION_HOURS * HOUR_MS) });
  await mailInvitation(viewer, { email: row.email, role: row.role, athleteId: row.athlete_id === null ? null : Number(row.athlete_id) }, token);
  return toInvitation(await requirePending(viewer, id), now);
}

export async function revokeInvitation(viewer: Viewer, id: number, now = new Date()): Promise<void> {
  await requirePending(viewer, id);
  await db('invitations').where({ id }).update({ revoked_at: now });
}

/** What the accept page shows for a token, or null when the link is not usable (used, expired, revoked, unknown). */
export async function describeInvitation(token: string, now = new Date()): Promise<{ email: string; role: Role; academyName: string; playerName: string | null } | null> {
  if (!/^[A-Za-z0-9_-]{43}$/.test(token)) return null;
  const row = await usableInvitation(db, hashToken(token), now);
  if (!row) return null;
  const player = row.athlete_id === null ? null : await db('athletes').where({ id: row.athlete_id }).first('display_name');
  return { email: row.email, role: row.role, academyName: await academyName(Number(row.academy_id)), playerName: player?.display_name ?? null };
}

async function usableInvitation(q: typeof db, hash: string, now: Date, lock = false) {
  const query = q('invitations').where({ token_hash: hash }).whereNull('accepted_at').whereNull('revoked_at').where('expires_at', '>', now);
  if (lock) query.forUpdate();
  return query.first('id', 'academy_id', 'email', 'role', 'athlete_id');
}

/** Creates the account (and the player link for a student); the token is spent in the same transaction. */
export async function acceptInvitation(input: AcceptInvitationInput, now = new Date()): Promise<AcceptInvitationResponse> {
  // A cheap look first, so a link that matches nothing costs no password hash (a public route); checked again under lock.
  if (!(await usableInvitation(db, hashToken(input.token), now))) throw new InvalidLinkError();
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const invitation = await usableInvitation(trx as unknown as typeof db, hashToken(input.token), now, true);
    if (!invitation) throw new InvalidLinkError();
    const athleteId = invitation.athlete_id === null ? null : Number(invitation.athlete_id);
    let name = input.name ?? invitation.email.split('@')[0];
    if (athleteId !== null) {
      const athlete = await trx('athletes').where({ id: athleteId }).forUpdate().first('display_name', 'user_id');
      if (!athlete) throw new InvalidLinkError('The player this invitation was for no longer exists. Ask your coach for a new invitation.');
      if (athlete.user_id !== null) throw new ConflictError('This player already has a student account linked. Ask your coach.');
      name = input.name ?? athlete.display_name;
    }
    if (await trx('users').where({ email: invitation.email }).first('id')) {
      throw new ConflictError('An account with this address exists already. Sign in, or ask for a new password.');
    }
    const [userId] = await trx('users').insert({
      academy_id: invitation.academy_id,
      email: invitation.email,
      name,
      role: invitation.role,
      password_hash: passwordHash,
      active: true,
      created_at: now,
      updated_at: now,
    });
    if (athleteId !== null) await trx('athletes').where({ id: athleteId }).update({ user_id: userId });
    await trx('invitations').where({ id: invitation.id }).update({ accepted_at: now, accepted_user_id: userId });
    return { user: { id: Number(userId), email: invitation.email, name, role: invitation.role }, athleteId };
  });
}

/** Players the viewer may invite a student for: the academy's (admin) or the roster's (coach), with their link state. */
export async function invitablePlayers(viewer: Viewer): Promise<{ id: number; displayName: string; linked: boolean }[]> {
  const q = db('athletes as a').where('a.academy_id', viewer.academyId).orderBy('a.display_name').select('a.id', 'a.display_name', 'a.user_id');
  if (viewer.role === 'coach') q.whereIn('a.id', db('coach_athletes').where({ coach_user_id: viewer.id }).select('athlete_id'));
  return (await q).map((r: { id: number; display_name: string; user_id: number | null }) => ({ id: Number(r.id), displayName: r.display_name, linked: r.user_id !== null }));
}
