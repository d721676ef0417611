// A coach sends the student a lesson summary or one swing by e-mail. The mail holds only a link to the page, which
// needs sign-in; the student's home lists what was shared, newest first.
import 'server-only';
import { requireAthlete, requireSession, requireSwing } from '@/lib/auth/access';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoDate, toIsoTime } from '@/lib/db/values';
import { ConflictError, NotFoundError } from '@/lib/http';
import { restorableUntil, withinBin } from '@/lib/sessions/store';
import { BIN_DAYS, type BinnedRef } from '@/lib/contracts/sessions';
import { appUrl, sendShareMail } from '@/lib/mail';
import type { CreateShareInput, Share, ShareNotePatch } from '@/lib/contracts/shares';
import { academyName } from './academy';

type ShareRow = {
  id: number;
  athlete_id: number;
  session_id: number | null;
  swing_id: number | null;
  swing_session_id: number | null;
  session_date: unknown;
  swing_session_date: unknown;
  sharer_name: string | null;
  note: string | null;
  created_at: Date;
};

function hrefOf(sessionId: number, swingId: number | null): string {
  return swingId === null ? `/sessions/${sessionId}/summary` : `/swings/${swingId}`;
}

function toShare(row: ShareRow): Share {
  const swingId = row.swing_id === null ? null : Number(row.swing_id);
  const sessionId = Number(row.session_id ?? row.swing_session_id);
  return {
    id: Number(row.id),
    kind: swingId === null ? 'lesson' : 'swing',
    athleteId: Number(row.athlete_id),
    sessionId,
    swingId,
    sessionDate: toIsoDate(row.session_date ?? row.swing_session_date) ?? '',
    sharedBy: row.sharer_name,
    note: row.note,
    createdAt: toIsoTime(row.created_at) ?? '',
    href: hrefOf(sessionId, swingId),
  };
}

// Binned sessions, recordings and swings drop out of the list (the bin rule in DEVELOPERS.md), and so do binned shares
// (a coach removed them) unless `binned` asks for those alone (the restore).
function shareQuery(opts: { binned?: boolean } = {}) {
  return db('shares as sh')
    .where((w) => (opts.binned ? w.whereNotNull('sh.binned_at') : w.whereNull('sh.binned_at')))
    .leftJoin('practice_sessions as p', 'p.id', 'sh.session_id')
    .leftJoin('swings as s', 's.id', 'sh.swing_id')
    .leftJoin('recordings as r', 'r.id', 's.recording_id')
    .leftJoin('practice_sessions as sp', 'sp.id', 'r.session_id')
    .leftJoin('users as u', 'u.id', 'sh.shared_by')
    .where((w) => w.whereNotNull('sh.session_id').whereNull('p.binned_at').orWhere((o) => o.whereNotNull('sh.swing_id').whereNull('r.binned_at').whereNull('sp.binned_at')))
    .select(
      'sh.id',
      'sh.athlete_id',
      'sh.session_id',
      'sh.swing_id',
      'r.session_id as swing_session_id',
      'p.session_date',
      'sp.session_date as swing_session_date',
      'u.name as sharer_name',
      'sh.note',
      'sh.created_at',
    )
    .orderBy([{ column: 'sh.created_at', order: 'desc' }, { column: 'sh.id', order: 'desc' }]);
}

/** The coach of the athlete shares; the athlete needs a linked student account to receive it (else 409). */
export async function shareWithStudent(viewer: Viewer, input: CreateShareInput, now = new Date()): Promise<Share> {
  const { athleteId } = input.swingId !== undefined ? await requireSwing(viewer, input.swingId, 'write') : await requireSession(viewer, input.sessionId!, 'write');
  const student = await db('athletes as a').join('users as u', 'u.id', 'a.user_id').where('a.id', athleteId).where('u.active', true).first('u.id', 'u.email');
  if (!student) throw new ConflictError('This player has no student account yet. Invite them first (Invitations), then share again.');
  const [id] = await db('shares').insert({
    athlete_id: athleteId,
    session_id: input.sessionId ?? null,
    swing_id: input.swingId ?? null,
    shared_by: viewer.id,
    recipient_user_id: student.id,
    note: input.note ? input.note : null,
    created_at: now,
  });
  const share = toShare(await shareQuery().where('sh.id', id).first());
  await sendShareMail(student.email, {
    academyName: await academyName(viewer.academyId),
    coachName: viewer.name,
    what: share.kind,
    sessionDate: share.sessionDate,
    note: share.note,
    url: appUrl(share.href),
  });
  return share;
}

/** A student's shares, newest first. */
export async function listSharesForStudent(viewer: Viewer): Promise<Share[]> {
  return (await shareQuery().where('sh.recipient_user_id', viewer.id)).map(toShare);
}

/** What a coach sent one of their players, newest first (binned shares left out). */
export async function listSharesForAthlete(viewer: Viewer, athleteId: number): Promise<Share[]> {
  await requireAthlete(viewer, athleteId, 'write');
  return (await shareQuery().where('sh.athlete_id', athleteId)).map(toShare);
}

/**
 * A share the viewer may change: the coach who may write for its lesson or swing (requireSession / requireSwing with
 * 'write'). Anyone else, an unknown id, and a share whose lesson or swing is in the bin get the same 404. `binned`
 * reaches shares in the bin only (the restore route).
 */
async function requireShareToWrite(viewer: Viewer, id: number, opts: { binned?: boolean } = {}): Promise<void> {
  const row = await db('shares').where({ id }).first('session_id', 'swing_id', 'binned_at');
  const visible = row && (opts.binned ? row.binned_at !== null : row.binned_at === null);
  if (!visible) throw new NotFoundError(opts.binned ? 'No share with this id in the bin.' : 'No share with this id.');
  try {
    if (row.swing_id !== null) await requireSwing(viewer, Number(row.swing_id), 'write');
    else await requireSession(viewer, Number(row.session_id), 'write');
  } catch (error) {
    // the lesson's or swing's own 404 would name it; the answer is about the share
    if (error instanceof NotFoundError) throw new NotFoundError('No share with this id.');
    throw error;
  }
}

async function readShare(id: number): Promise<Share> {
  const row = await shareQuery().where('sh.id', id).first();
  if (!row) throw new NotFoundError('No share with this id.');
  return toShare(row);
}

/** The note changes (an empty note clears it); the student is not mailed again. */
export async function updateShareNote(viewer: Viewer, id: number, patch: ShareNotePatch): Promise<Share> {
  await requireShareToWrite(viewer, id);
  await db('shares').where({ id }).whereNull('binned_at').update({ note: patch.note ? patch.note : null });
  return readShare(id);
}

function binnedName(share: Share): string {
  return share.kind === 'swing' ? `Swing of ${share.sessionDate}` : `Lesson summary of ${share.sessionDate}`;
}

/** To the bin: the student's list leaves it out; restorable for BIN_DAYS days, the sweep removes it after that. */
export async function deleteShare(viewer: Viewer, id: number): Promise<BinnedRef> {
  await requireShareToWrite(viewer, id);
  const share = await readShare(id);
  await db('shares').where({ id }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  const row = await db('shares').where({ id }).first('binned_at');
  return { id, name: binnedName(share), binnedAt: toIsoTime(row?.binned_at ?? null), restorableUntil: restorableUntil(row?.binned_at ?? null) };
}

/** Out of the bin within BIN_DAYS days (409 after that). */
export async function restoreShare(viewer: Viewer, id: number, now = new Date()): Promise<Share> {
  await requireShareToWrite(viewer, id, { binned: true });
  const row = await db('shares').where({ id }).first('binned_at');
  if (!row || !row.binned_at) throw new NotFoundError('No share with this id in the bin.');
  if (!withinBin(row.binned_at, now)) throw new ConflictError(`This share was removed more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('shares').where({ id }).update({ binned_at: null });
  return readShare(id);
}
