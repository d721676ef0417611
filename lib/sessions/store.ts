import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoDate, toIsoTime } from '@/lib/db/values';
import { ConflictError, NotFoundError } from '@/lib/http';
import type { PracticeSession } from '@/lib/contracts/athletes';
import { BIN_DAYS, type BinnedRecording, type SessionInputParsed, type SessionPatch, type SessionResponse } from '@/lib/contracts/sessions';

// Sessions of an athlete: create, edit, and the bin (delete -> restore within BIN_DAYS -> the sweep in bin.ts).
// Callers check access first (lib/auth/access.ts requireAthlete / requireSession / requireRecording).

const DAY_MS = 24 * 60 * 60 * 1000;

type SessionRow = {
  id: number;
  athlete_id: number;
  session_date: unknown;
  context: PracticeSession['context'];
  location: string | null;
  notes: string | null;
  binned_at: Date | null;
};

const SESSION_COLUMNS = ['id', 'athlete_id', 'session_date', 'context', 'location', 'notes', 'binned_at'];

/** The last day (YYYY-MM-DD, UTC) a thing binned at `binnedAt` can be restored. */
export function restorableUntil(binnedAt: Date | null): string | null {
  return binnedAt ? new Date(new Date(binnedAt).getTime() + BIN_DAYS * DAY_MS).toISOString().slice(0, 10) : null;
}

/** Still restorable at `now`: binned less than BIN_DAYS days ago. */
export function withinBin(binnedAt: Date, now = new Date()): boolean {
  return now.getTime() - new Date(binnedAt).getTime() < BIN_DAYS * DAY_MS;
}

function toResponse(row: SessionRow): SessionResponse {
  return {
    id: Number(row.id),
    athleteId: Number(row.athlete_id),
    sessionDate: toIsoDate(row.session_date) ?? '',
    context: row.context,
    location: row.location,
    notes: row.notes,
    binnedAt: toIsoTime(row.binned_at),
    restorableUntil: restorableUntil(row.binned_at),
  };
}

async function readSession(id: number): Promise<SessionResponse> {
  const row: SessionRow | undefined = await db('practice_sessions').where({ id }).first(SESSION_COLUMNS);
  if (!row) throw new NotFoundError('No session with this id.');
  return toResponse(row);
}

export async function createSession(viewer: Viewer, athleteId: number, input: SessionInputParsed): Promise<SessionResponse> {
  const [id] = await db('practice_sessions').insert({
    athlete_id: athleteId,
    coach_user_id: viewer.role === 'coach' ? viewer.id : null,
    session_date: input.date,
    context: input.context,
    location: input.location ?? null,
    notes: input.notes ?? null,
  });
  return readSession(Number(id));
}

export async function updateSession(sessionId: number, patch: SessionPatch): Promise<SessionResponse> {
  const changes: Record<string, unknown> = {};
  if (patch.date !== undefined) changes.session_date = patch.date;
  if (patch.context !== undefined) changes.context = patch.context;
  if (patch.location !== undefined) changes.location = patch.location;
  if (patch.notes !== undefined) changes.notes = patch.notes;
  if (Object.keys(changes).length > 0) await db('practice_sessions').where({ id: sessionId }).update(changes);
  return readSession(sessionId);
}

/** Into the bin with its recordings: they are reached only through the session, so they go with it. */
export async function binSession(sessionId: number): Promise<SessionResponse> {
  await db('practice_sessions').where({ id: sessionId }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  return readSession(sessionId);
}

export async function restoreSession(sessionId: number, now = new Date()): Promise<SessionResponse> {
  const row: SessionRow | undefined = await db('practice_sessions').where({ id: sessionId }).first(SESSION_COLUMNS);
  if (!row || row.binned_at === null) throw new NotFoundError('No session with this id in the bin.');
  if (!withinBin(row.binned_at, now)) throw new ConflictError(`This session was deleted more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('practice_sessions').where({ id: sessionId }).update({ binned_at: null });
  return readSession(sessionId);
}

/** Sessions of an athlete in the bin, newest deletion first. */
export async function listBinnedSessions(athleteId: number): Promise<SessionResponse[]> {
  const rows: SessionRow[] = await db('practice_sessions').where({ athlete_id: athleteId }).whereNotNull('binned_at').orderBy('binned_at', 'desc').select(SESSION_COLUMNS);
  return rows.map(toResponse);
}

async function readRecording(id: number): Promise<BinnedRecording> {
  const row = await db('recordings').where({ id }).first('id', 'session_id', 'filename', 'binned_at');
  if (!row) throw new NotFoundError('No recording with this id.');
  return { id: Number(row.id), sessionId: Number(row.session_id), filename: row.filename, binnedAt: toIsoTime(row.binned_at), restorableUntil: restorableUntil(row.binned_at) };
}

export async function binRecording(recordingId: number): Promise<BinnedRecording> {
  await db('recordings').where({ id: recordingId }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  return readRecording(recordingId);
}

export async function restoreRecording(recordingId: number, now = new Date()): Promise<BinnedRecording> {
  const row = await db('recordings').where({ id: recordingId }).first('binned_at');
  if (!row || row.binned_at === null) throw new NotFoundError('No recording with this id in the bin.');
  if (!withinBin(row.binned_at, now)) throw new ConflictError(`This recording was deleted more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('recordings').where({ id: recordingId }).update({ binned_at: null });
  return readRecording(recordingId);
}

/** Recordings of a session in the bin (the session itself in use). */
export async function listBinnedRecordings(sessionId: number): Promise<BinnedRecording[]> {
  const rows = await db('recordings').where({ session_id: sessionId }).whereNotNull('binned_at').orderBy('binned_at', 'desc').select('id', 'session_id', 'filename', 'binned_at');
  return rows.map((row) => ({ id: Number(row.id), sessionId: Number(row.session_id), filename: row.filename, binnedAt: toIsoTime(row.binned_at), restorableUntil: restorableUntil(row.binned_at) }));
}
