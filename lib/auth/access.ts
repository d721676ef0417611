import 'server-only';
import type { DrillAssignmentRow, DrillRow, TargetRow } from '@/lib/db/tables';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ForbiddenError, NotFoundError } from '@/lib/http';

// The one access layer: may this viewer read or write this athlete, recording, session, swing, band, target, drill or
// assignment? Every check answers the same way:
// - an object the viewer may not know exists (unknown id, another academy, another coach's roster or private library)
//   -> 404 with the same message as an unknown id, so an outsider cannot tell which ids exist;
// - an object the viewer sees but may not change (a student's own swing, a shared band of another coach, a coach
//   marking practice done) -> 403, which tells them nothing new.
// Roles are checked before this (lib/auth/roles.ts requireRole): an admin or researcher never reaches these checks.
//
// Who sees what: a coach sees the athletes linked to them (coach_athletes, same academy) and everything recorded for
// them; a student sees their own athlete (athletes.user_id); bands, targets and drills have their own rules below.

export type Need = 'read' | 'write';
export type AthleteAccess = 'coach' | 'student';

/** How the viewer relates to an athlete: their coach, the athlete themself, or null (not theirs to know). */
export async function athleteAccess(viewer: Viewer, athleteId: number): Promise<AthleteAccess | null> {
  const athlete = await db('athletes as a')
    .leftJoin('coach_athletes as ca', (j) => j.on('ca.athlete_id', 'a.id').andOnVal('ca.coach_user_id', viewer.id))
    .where({ 'a.id': athleteId })
    .first('a.academy_id', 'a.user_id', 'ca.athlete_id as coach_link');
  return athlete ? accessFromRow(viewer, athlete) : null;
}

/**
 * The same rule on columns a caller read together with its own row (one query instead of two): the athlete's
 * `academy_id` and `user_id`, and `coach_link`, non-null when coach_athletes links the viewer to the athlete
 * (LEFT JOIN coach_athletes ON athlete_id = the athlete AND coach_user_id = the viewer).
 */
export function accessFromRow(viewer: Viewer, row: { academy_id: unknown; user_id: unknown; coach_link: unknown }): AthleteAccess | null {
  if (Number(row.academy_id) !== viewer.academyId) return null;
  if (viewer.role === 'coach') return row.coach_link !== null && row.coach_link !== undefined ? 'coach' : null;
  if (viewer.role === 'student' && row.user_id !== null && Number(row.user_id) === viewer.id) return 'student';
  return null;
}

/**
 * The athlete, read: their coach or the athlete themself; write (record, set targets, assign drills): their coach.
 * `what` names the object in the 404 message (an athlete by default; a session or swing when reached through one).
 */
export async function requireAthlete(viewer: Viewer, athleteId: number, need: Need, what = 'athlete'): Promise<AthleteAccess> {
  const access = await athleteAccess(viewer, athleteId);
  if (!access) throw new NotFoundError(`No ${what} with this id.`);
  if (need === 'write' && access !== 'coach') throw new ForbiddenError(`Only the athlete’s coach can change this ${what}; it is read-only for you.`);
  return access;
}

async function requireOwnedBy(viewer: Viewer, athleteId: number | null, need: Need, what: string): Promise<{ athleteId: number; access: AthleteAccess }> {
  if (athleteId === null) throw new NotFoundError(`No ${what} with this id.`);
  return { athleteId, access: await requireAthlete(viewer, athleteId, need, what) };
}

// The bin: a session or recording (and a drill, band or drill assignment) a coach deleted (binned_at set) is unknown to every read and write (404) until it
// is restored; only the restore routes reach it, with `{ binned: true }`.

/** A recording: read as its athlete; write (reprocess, delete) as the athlete's coach. */
export async function requireRecording(viewer: Viewer, recordingId: number, need: Need, opts: { binned?: boolean } = {}) {
  const row = await db('recordings as r')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .where('r.id', recordingId)
    .first('r.athlete_id', 'r.binned_at', 'p.binned_at as session_binned_at');
  const visible = row && row.session_binned_at === null && (opts.binned ? row.binned_at !== null : row.binned_at === null);
  return requireOwnedBy(viewer, visible ? Number(row.athlete_id) : null, need, 'recording');
}

/** A practice session: as its athlete (write: edit, delete, restore: their coach). */
export async function requireSession(viewer: Viewer, sessionId: number, need: Need, opts: { binned?: boolean } = {}) {
  const row = await db('practice_sessions').where({ id: sessionId }).first('athlete_id', 'binned_at');
  const visible = row && (opts.binned ? row.binned_at !== null : row.binned_at === null);
  return requireOwnedBy(viewer, visible ? Number(row.athlete_id) : null, need, 'session');
}

/** A swing: read as its athlete; write (events, labels, notes) as the athlete's coach. */
export async function requireSwing(viewer: Viewer, swingId: number, need: Need) {
  const row = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .where('s.id', swingId)
    .whereNull('r.binned_at')
    .whereNull('p.binned_at')
    .first('r.athlete_id');
  return requireOwnedBy(viewer, row ? Number(row.athlete_id) : null, need, 'swing');
}

/** Every swing of a list, for writing with them (building a band): the first one the viewer does not coach is a 404. */
export async function requireSwingsToUse(viewer: Viewer, swingIds: number[]): Promise<void> {
  const owners = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .whereIn('s.id', swingIds)
    .select('s.id', 'r.athlete_id', 'r.binned_at', 'p.binned_at as session_binned_at');
  const binned = owners.find((o) => o.binned_at !== null || o.session_binned_at !== null);
  if (binned) throw new NotFoundError(`No swing with id ${binned.id} on your roster.`);
  const coached = new Map<number, boolean>();
  for (const o of owners) {
    const athleteId = Number(o.athlete_id);
    if (!coached.has(athleteId)) coached.set(athleteId, (await athleteAccess(viewer, athleteId)) === 'coach');
    if (!coached.get(athleteId)) throw new NotFoundError(`No swing with id ${o.id} on your roster.`);
  }
}

/**
 * A band: a coach reads their own and the academy's shared bands; a student reads the bands of their coaches; only
 * the coach who built it writes (deletes) it.
 */
export async function requireBand(viewer: Viewer, bandId: number, need: Need, opts: { binned?: boolean } = {}): Promise<void> {
  const found = await db('bands').where({ id: bandId, academy_id: viewer.academyId }).first('owner_user_id', 'shared', 'binned_at');
  // a band in the bin is known to its builder only
  const row = found && (opts.binned ? found.binned_at !== null && found.owner_user_id === viewer.id : found.binned_at === null) ? found : undefined;
  const owner = row ? row.owner_user_id : null;
  let visible = false;
  if (row && viewer.role === 'coach') visible = owner === viewer.id || row.shared;
  else if (row && viewer.role === 'student') {
    visible = Boolean(
      await db('coach_athletes as c').join('athletes as a', 'a.id', 'c.athlete_id').where({ 'a.user_id': viewer.id, 'c.coach_user_id': owner }).first('c.coach_user_id'),
    );
  }
  if (!visible) throw new NotFoundError('No band with this id.');
  if (need === 'write' && owner !== viewer.id) throw new ForbiddenError('Only the coach who built this band can change or delete it.');
}

/**
 * A target, for writing: the academy's defaults (editable by design) and the coach's own targets. Another coach's
 * target is a 404 unless it was made for an athlete the viewer coaches (then they see it, and get 403).
 */
export async function requireTargetToWrite(viewer: Viewer, targetId: number): Promise<TargetRow> {
  const row = await db('targets').where({ id: targetId, academy_id: viewer.academyId }).first();
  if (!row) throw new NotFoundError('No target with this id.');
  if (row.is_default || row.owner_user_id === viewer.id) return row;
  const forMyAthlete = row.athlete_id !== null && (await athleteAccess(viewer, row.athlete_id)) === 'coach';
  if (!forMyAthlete) throw new NotFoundError('No target with this id.');
  throw new ForbiddenError('Only the coach who made this target can change it.');
}

/** A drill, for writing: the coach's own library only; another coach's drill is a 404. */
export async function requireDrillToWrite(viewer: Viewer, drillId: number, opts: { binned?: boolean } = {}): Promise<DrillRow> {
  const row = await db('drills').where({ id: drillId }).first();
  const visible = row && (opts.binned ? row.binned_at !== null : row.binned_at === null);
  if (!row || !visible || row.owner_user_id !== viewer.id) throw new NotFoundError('No drill with this id.');
  return row;
}

/** A drill assignment: as its athlete (the student writes practice done and a note; the coach the due date). */
export async function requireAssignment(viewer: Viewer, assignmentId: number, opts: { binned?: boolean } = {}): Promise<{ row: DrillAssignmentRow; access: AthleteAccess }> {
  // an assignment of a binned drill is in the bin with it
  const row = await db('drill_assignments').where({ id: assignmentId }).first();
  const drill = row ? await db('drills').where({ id: row.drill_id }).first('binned_at') : undefined;
  const visible = row && drill && drill.binned_at === null && (opts.binned ? row.binned_at !== null : row.binned_at === null);
  if (!row || !visible) throw new NotFoundError('No drill assignment with this id.');
  const { access } = await requireOwnedBy(viewer, row.athlete_id, 'read', 'drill assignment');
  return { row, access };
}
