import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import type { Annotation } from '@/lib/contracts/swings';
import { db } from '@/lib/db/client';
import { ZodError } from 'zod';
import { ConflictError, ForbiddenError, NotFoundError } from '@/lib/http';
import { BIN_DAYS } from '@/lib/contracts/sessions';
import { withinBin } from '@/lib/sessions/store';
import type { AnnotationCreateInput, AnnotationPatchInput } from '@/lib/contracts/swings';

// Notes on a swing. Coaches see all of a swing's notes; the student only those shared with them. A note is changed
// or removed by its author or by the athlete's coach (route handlers check the coach first). A removed note goes to
// the bin (binned_at) and its undo restores the same note; the bin's sweep removes it after BIN_DAYS.

type NoteRow = { id: number; author_name: string | null; author_role: string | null; body: string; time_s: number | null; phase: Annotation['phase']; visibility: Annotation['visibility']; created_at: Date; updated_at: Date };

function toAnnotation(r: NoteRow): Annotation {
  return {
    id: Number(r.id),
    authorName: r.author_name ?? 'Former user',
    authorRole: r.author_role ?? 'coach',
    body: r.body,
    timeS: r.time_s === null ? null : Math.round(Number(r.time_s) * 1000) / 1000,
    phase: r.phase ?? null,
    visibility: r.visibility,
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

// notes in the bin (removed, restorable for BIN_DAYS) are left out everywhere but the restore
const noteQuery = () =>
  db('swing_annotations as n')
    .whereNull('n.binned_at')
    .leftJoin('users as u', 'u.id', 'n.author_user_id')
    .select('n.id', 'u.name as author_name', 'u.role as author_role', 'n.body', 'n.time_s', 'n.phase', 'n.visibility', 'n.created_at', 'n.updated_at');

export async function listAnnotations(swingId: number, sharedOnly: boolean): Promise<Annotation[]> {
  const q = noteQuery().where('n.swing_id', swingId).orderBy([{ column: 'n.created_at' }, { column: 'n.id' }]);
  if (sharedOnly) q.andWhere('n.visibility', 'shared');
  return (await q).map(toAnnotation);
}

async function one(id: number): Promise<Annotation> {
  return toAnnotation(await noteQuery().where('n.id', id).first());
}

/** A time pin and a phase pin exclude each other: setting one clears the other. */
function pins(input: { timeS?: number | null; phase?: Annotation['phase'] | null }): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  if (input.timeS !== undefined) out.time_s = input.timeS;
  if (input.phase !== undefined) out.phase = input.phase;
  if (input.timeS != null) out.phase = null;
  if (input.phase != null) out.time_s = null;
  return out;
}

/** A time pin is a moment of this swing: inside its window on the recording's time axis (422 on timeS otherwise). */
async function checkPinTime(swingId: number, timeS: number | null | undefined): Promise<void> {
  if (timeS === null || timeS === undefined) return;
  const swing = await db('swings').where({ id: swingId }).first('start_s', 'end_s');
  if (!swing) throw new NotFoundError('No swing with this id.');
  const start = Number(swing.start_s);
  const end = Number(swing.end_s);
  if (!(timeS >= start && timeS <= end)) {
    const message = `Pin the note to a moment of this swing, from ${start.toFixed(3)} s to ${end.toFixed(3)} s.`;
    throw new ZodError([{ code: 'custom', path: ['timeS'], message, input: undefined }]);
  }
}

export async function createAnnotation(viewer: Viewer, swingId: number, input: AnnotationCreateInput): Promise<Annotation> {
  await checkPinTime(swingId, input.timeS);
  const [id] = await db('swing_annotations').insert({ swing_id: swingId, author_user_id: viewer.id, body: input.body, visibility: input.visibility, time_s: null, phase: null, ...pins(input) });
  return one(Number(id));
}

async function noteOf(swingId: number, annotationId: number, binned = false): Promise<{ author_user_id: number | null; binned_at: Date }> {
  const row = await db('swing_annotations')
    .where({ id: annotationId, swing_id: swingId })
    .where((q) => (binned ? q.whereNotNull('binned_at') : q.whereNull('binned_at')))
    .first('author_user_id', 'binned_at');
  if (!row) throw new NotFoundError(binned ? 'No removed note with this id on this swing.' : 'No note with this id on this swing.');
  return row;
}

/** `isCoach`: the viewer coaches the swing's athlete (may change any note of the swing); else only their own. */
export async function updateAnnotation(viewer: Viewer, isCoach: boolean, swingId: number, annotationId: number, input: AnnotationPatchInput): Promise<Annotation> {
  const note = await noteOf(swingId, annotationId);
  if (!isCoach && Number(note.author_user_id) !== viewer.id) throw new ForbiddenError('Only the author or the athlete’s coach can change this note.');
  await checkPinTime(swingId, input.timeS);
  const changes: Record<string, unknown> = { ...pins(input) };
  if (input.body !== undefined) changes.body = input.body;
  if (input.visibility !== undefined) changes.visibility = input.visibility;
  await db('swing_annotations').where({ id: annotationId }).update({ ...changes, updated_at: db.raw('NOW(3)') });
  return one(annotationId);
}

export async function deleteAnnotation(viewer: Viewer, isCoach: boolean, swingId: number, annotationId: number): Promise<void> {
  const note = await noteOf(swingId, annotationId);
  if (!isCoach && Number(note.author_user_id) !== viewer.id) throw new ForbiddenError('Only the author or the athlete’s coach can remove this note.');
  await db('swing_annotations').where({ id: annotationId }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
}

/** Undo of a removal: the same note (id, text, pin, visibility) back, within BIN_DAYS of its removal (409 after). */
export async function restoreAnnotation(viewer: Viewer, isCoach: boolean, swingId: number, annotationId: number, now = new Date()): Promise<Annotation> {
  const note = await noteOf(swingId, annotationId, true);
  if (!isCoach && Number(note.author_user_id) !== viewer.id) throw new ForbiddenError('Only the author or the athlete’s coach can restore this note.');
  if (!withinBin(note.binned_at, now)) throw new ConflictError(`This note was removed more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('swing_annotations').where({ id: annotationId }).update({ binned_at: null });
  return one(annotationId);
}
