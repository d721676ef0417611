import 'server-only';
import { ZodError } from 'zod';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import type { DrillAssignmentRow, DrillRow } from '@/lib/db/tables';
import { jsonColumnOf, toIsoDate, toIsoTime } from '@/lib/db/values';
import { ConflictError, ForbiddenError, NotFoundError } from '@/lib/http';
import { restorableUntil, withinBin } from '@/lib/sessions/store';
import { BIN_DAYS, type BinnedRef } from '@/lib/contracts/sessions';
import { requireAssignment, requireAthlete, requireDrillToWrite, requireSession } from '@/lib/auth/access';
import { swingFacts } from '@/lib/targets/swing-facts';
import type { DrillInput } from '@/lib/contracts/drills';
import { checkMoves, type CheckMove } from './report';
import type { Drill, DrillAssignment } from './types';

// A coach's own drill library and its assignments. A coach sees and edits their own drills and assigns them to
// athletes on their roster; a student sees the drills assigned to them and may only mark practice done with a note.

const parse = jsonColumnOf;

type DrillFields = Pick<DrillRow, 'id' | 'name' | 'steps' | 'addresses_checks' | 'cautions' | 'owner_user_id'>;

function toDrill(row: DrillFields): Drill {
  return { id: row.id, name: row.name, steps: parse<string[]>(row.steps), addressesChecks: parse(row.addresses_checks), cautions: row.cautions, ownerUserId: row.owner_user_id };
}

/** The drill as saved (after an insert or update). */
async function savedDrill(id: number): Promise<Drill> {
  const row = await db('drills').where({ id }).first();
  if (!row) throw new NotFoundError('No drill with this id.');
  return toDrill(row);
}

async function studentAthleteId(viewer: Viewer): Promise<number | null> {
  const row = await db('athletes').where({ user_id: viewer.id, academy_id: viewer.academyId }).first('id');
  return row ? Number(row.id) : null;
}

export async function listDrills(viewer: Viewer): Promise<Drill[]> {
  if (viewer.role === 'coach') return (await db('drills').where({ owner_user_id: viewer.id }).whereNull('binned_at').orderBy('id')).map(toDrill);
  const athleteId = await studentAthleteId(viewer);
  if (athleteId === null) return [];
  const rows = await db('drills as d')
    .join('drill_assignments as a', 'a.drill_id', 'd.id')
    .where('a.athlete_id', athleteId)
    .whereNull('d.binned_at')
    .whereNull('a.binned_at')
    .distinct('d.*')
    .orderBy('d.id');
  return rows.map(toDrill);
}

function drillColumns(input: Partial<DrillInput>): Record<string, unknown> {
  const c: Record<string, unknown> = {};
  if (input.name !== undefined) c.name = input.name;
  if (input.steps !== undefined) c.steps = JSON.stringify(input.steps);
  if (input.addressesChecks !== undefined) c.addresses_checks = JSON.stringify(input.addressesChecks);
  if (input.cautions !== undefined) c.cautions = input.cautions;
  return c;
}

export async function createDrill(viewer: Viewer, input: DrillInput): Promise<Drill> {
  const [id] = await db('drills').insert({ ...drillColumns(input), academy_id: viewer.academyId, owner_user_id: viewer.id });
  return savedDrill(id);
}

const ownDrill = requireDrillToWrite;

export async function updateDrill(viewer: Viewer, id: number, input: Partial<DrillInput>): Promise<Drill> {
  await ownDrill(viewer, id);
  await db('drills').where({ id }).update({ ...drillColumns(input), updated_at: db.raw('NOW(3)') });
  return savedDrill(id);
}

function binnedRef(row: { id: number; binned_at: Date | null }, name: string): BinnedRef {
  return { id: Number(row.id), name, binnedAt: toIsoTime(row.binned_at), restorableUntil: restorableUntil(row.binned_at) };
}

function tooOld(what: string): ConflictError {
  return new ConflictError(`This ${what} was deleted more than ${BIN_DAYS} days ago and can no longer be restored.`);
}

/** To the bin, its assignments with it (hidden while the drill is binned); restorable for BIN_DAYS days. */
export async function deleteDrill(viewer: Viewer, id: number): Promise<BinnedRef> {
  await ownDrill(viewer, id);
  await db('drills').where({ id }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  const row = await db('drills').where({ id }).first();
  if (!row) throw new NotFoundError('No drill with this id.');
  return binnedRef(row, row.name);
}

export async function restoreDrill(viewer: Viewer, id: number, now = new Date()): Promise<Drill> {
  const row = await requireDrillToWrite(viewer, id, { binned: true });
  if (!withinBin(row.binned_at as Date, now)) throw tooOld('drill');
  await db('drills').where({ id }).update({ binned_at: null });
  return savedDrill(id);
}

/** A row of assignmentQuery(): the assignment, its drill's fields and the athlete's name (a join, so typed here). */
type AssignmentJoinRow = DrillAssignmentRow & Omit<DrillFields, 'id'> & { display_name: string };

function toAssignment(row: AssignmentJoinRow): DrillAssignment {
  return {
    id: row.id,
    drill: toDrill({ id: row.drill_id, name: row.name, steps: row.steps, addresses_checks: row.addresses_checks, cautions: row.cautions, owner_user_id: row.owner_user_id }),
    athleteId: row.athlete_id,
    athleteName: row.display_name,
    assignedBy: row.assigned_by,
    assignedAt: toIsoDate(row.assigned_at) ?? '',
    dueDate: toIsoDate(row.due_date) ?? '',
    practiceDone: row.practice_done,
    doneAt: toIsoTime(row.done_at),
    studentNote: row.student_note,
  };
}

const assignmentQuery = () =>
  db('drill_assignments as a')
    .join('drills as d', 'd.id', 'a.drill_id')
    .join('athletes as t', 't.id', 'a.athlete_id')
    .whereNull('d.binned_at')
    .select('a.*', 'd.name', 'd.steps', 'd.addresses_checks', 'd.cautions', 'd.owner_user_id', 't.display_name')
    .orderBy([{ column: 'a.due_date', order: 'desc' }, { column: 'a.id', order: 'desc' }]);

export async function listAssignments(viewer: Viewer, athleteId?: number): Promise<DrillAssignment[]> {
  const q = assignmentQuery().whereNull('a.binned_at');
  if (viewer.role === 'coach') q.whereIn('a.athlete_id', db('coach_athletes').where({ coach_user_id: viewer.id }).select('athlete_id'));
  else {
    const own = await studentAthleteId(viewer);
    if (own === null) return [];
    q.where('a.athlete_id', own);
  }
  if (athleteId !== undefined) q.where('a.athlete_id', athleteId);
  return (await q).map(toAssignment);
}

function dueBefore(assignedAt: string): ZodError {
  return new ZodError([{ code: 'custom', path: ['dueDate'], message: `The due date cannot be before the day it was assigned (${assignedAt}).`, input: undefined }]);
}

export async function assignDrill(viewer: Viewer, athleteId: number, drillId: number, dueDate: string, today: string): Promise<DrillAssignment> {
  await requireAthlete(viewer, athleteId, 'write');
  await ownDrill(viewer, drillId);
  if (dueDate < today) throw dueBefore(today);
  const [id] = await db('drill_assignments').insert({ drill_id: drillId, athlete_id: athleteId, assigned_by: viewer.id, assigned_at: today, due_date: dueDate });
  return toAssignment(await assignmentQuery().where('a.id', id).first());
}

/** Student: own assignment, practiceDone + note only. Coach of the athlete: dueDate (and may also reset done). */
export async function updateAssignment(viewer: Viewer, id: number, patch: { practiceDone?: boolean; studentNote?: string; dueDate?: string }): Promise<DrillAssignment> {
  const { row, access } = await requireAssignment(viewer, id);
  const columns: Record<string, unknown> = {};
  if (access === 'student') {
    if (patch.dueDate !== undefined) throw new ForbiddenError('Only your coach can move the due date; you can mark practice done and add a note.');
  } else {
    if (patch.studentNote !== undefined) throw new ForbiddenError('The note is the student’s own.');
    if (patch.practiceDone === true) throw new ForbiddenError('Only the student marks practice done.');
  }
  if (patch.practiceDone !== undefined) {
    columns.practice_done = patch.practiceDone;
    columns.done_at = patch.practiceDone ? db.raw('NOW(3)') : null;
  }
  if (patch.studentNote !== undefined) columns.student_note = patch.studentNote === '' ? null : patch.studentNote;
  if (patch.dueDate !== undefined) {
    const assignedAt = toIsoDate(row.assigned_at) ?? '';
    if (patch.dueDate < assignedAt) throw dueBefore(assignedAt);
    columns.due_date = patch.dueDate;
  }
  await db('drill_assignments').where({ id }).update(columns);
  return toAssignment(await assignmentQuery().where('a.id', id).first());
}

/** The athlete's coach takes an assignment back: to the bin, restorable for BIN_DAYS days. */
export async function deleteAssignment(viewer: Viewer, id: number): Promise<BinnedRef> {
  const { access } = await requireAssignment(viewer, id);
  if (access !== 'coach') throw new ForbiddenError('Only your coach can remove a drill from your list.');
  await db('drill_assignments').where({ id }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  const row = await assignmentQuery().where('a.id', id).first();
  if (!row) throw new NotFoundError('No drill assignment with this id.');
  return binnedRef(row, row.name);
}

export async function restoreAssignment(viewer: Viewer, id: number, now = new Date()): Promise<DrillAssignment> {
  const { row, access } = await requireAssignment(viewer, id, { binned: true });
  if (access !== 'coach') throw new ForbiddenError('Only your coach can put a drill back on your list.');
  if (!withinBin(row.binned_at as Date, now)) throw tooOld('drill assignment');
  await db('drill_assignments').where({ id }).update({ binned_at: null });
  return toAssignment(await assignmentQuery().where('a.id', id).first());
}

export interface DrillReport {
  sessionId: number;
  sessionDate: string;
  assignments: { id: number; drill: Drill; assignedAt: string; dueDate: string; practiceDone: boolean; studentNote: string | null; checks: CheckMove[] }[];
}

/** Assignments given on or before the session's date, with the move of each check they address. */
export async function drillReport(viewer: Viewer, sessionId: number): Promise<DrillReport> {
  const { athleteId } = await requireSession(viewer, sessionId, 'read');
  const session = await db('practice_sessions').where({ id: sessionId }).first('session_date');
  const sessionDate = toIsoDate(session.session_date) ?? '';
  const rows = (await assignmentQuery().where('a.athlete_id', athleteId).whereNull('a.binned_at')).map(toAssignment).filter((a) => a.assignedAt <= sessionDate);
  const facts = rows.length > 0 ? await swingFacts({ athleteId }) : [];
  return {
    sessionId,
    sessionDate,
    assignments: rows.map((a) => ({
      id: a.id,
      drill: a.drill,
      assignedAt: a.assignedAt,
      dueDate: a.dueDate,
      practiceDone: a.practiceDone,
      studentNote: a.studentNote,
      checks: checkMoves(a.drill.addressesChecks, facts, a.assignedAt, sessionId),
    })),
  };
}
