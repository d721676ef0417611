import 'server-only';
import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Viewer } from '@/lib/auth/viewer';
import { requireAthlete } from '@/lib/auth/access';
import { db } from '@/lib/db/client';
import type { LiveStartInput } from '@/lib/contracts/live';
import { ConflictError, NotFoundError, UnauthenticatedError } from '@/lib/http';
import { ZodError } from 'zod';

// Starting a live session and checking the bridge's bearer token. The token is 32 random bytes (base64url); only
// its SHA-256 is stored, and it works for this live session's samples only, while the session is active.

export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');

export interface LiveRow {
  id: number;
  athlete_id: number;
  session_id: number;
  coach_user_id: number | null;
  token_hash: string;
  status: 'active' | 'ended';
  preamble: string | null;
  preamble_lines: number | null;
  drill_focus: string | null;
  recording_id: number | null;
}

export async function addLiveEvent(liveId: number, kind: 'swing' | 'gap' | 'status', payload: unknown): Promise<void> {
  await db('live_events').insert({ live_session_id: liveId, kind, payload: JSON.stringify(payload) });
}

async function sessionForToday(viewer: Viewer, input: LiveStartInput): Promise<number> {
  if (input.sessionId !== undefined) {
    const s = await db('practice_sessions').where({ id: input.sessionId }).first('athlete_id', 'binned_at');
    if (!s || Number(s.athlete_id) !== input.athleteId || s.binned_at !== null) {
      throw new ZodError([{ code: 'custom', path: ['sessionId'], message: 'This session is not one of this student’s sessions.', input: undefined }]);
    }
    return input.sessionId;
  }
  const today = new Date().toISOString().slice(0, 10);
  const context = input.context ?? 'lesson';
  const existing = await db('practice_sessions')
    .where({ athlete_id: input.athleteId, session_date: today, context, coach_user_id: viewer.id })
    .whereNull('binned_at')
    .orderBy('id', 'desc')
    .first('id');
  if (existing) return Number(existing.id);
  const [id] = await db('practice_sessions').insert({ athlete_id: input.athleteId, coach_user_id: viewer.id, session_date: today, context });
  return Number(id);
}

/** POST /api/live: a coach starts a live session for one of their students. */
export async function startLive(viewer: Viewer, input: LiveStartInput): Promise<{ id: number; token: string }> {
  await requireAthlete(viewer, input.athleteId, 'write', 'student');
  const sessionId = await sessionForToday(viewer, input);
  const token = randomBytes(32).toString('base64url');
  const [id] = await db('live_sessions').insert({
    athlete_id: input.athleteId,
    session_id: sessionId,
    coach_user_id: viewer.id,
    token_hash: hashToken(token),
    drill_focus: input.drillFocus || null,
    last_chunk_at: db.raw('CURRENT_TIMESTAMP(3)'),
  });
  await addLiveEvent(Number(id), 'status', { status: 'waiting', message: 'Waiting for the insoles.', recordingId: null });
  return { id: Number(id), token };
}

/** The bridge's bearer token for this live session; anything else is 401 (the same answer for a wrong id). */
export async function requireIngestToken(liveId: number, authorization: string | null): Promise<LiveRow> {
  const m = /^Bearer ([A-Za-z0-9_-]{20,200})$/.exec(authorization ?? '');
  if (!m) throw new UnauthenticatedError('Send the live session’s ingest token as "Authorization: Bearer <token>".');
  const row = (await db('live_sessions').where({ id: liveId }).first()) as LiveRow | undefined;
  const given = Buffer.from(hashToken(m[1]), 'hex');
  if (!row || !timingSafeEqual(given, Buffer.from(row.token_hash, 'hex'))) throw new UnauthenticatedError('This ingest token is not valid for this live session.');
  if (row.status !== 'active') throw new UnauthenticatedError('This live session has ended; its ingest token has expired.');
  return row;
}

/** A live session the viewer (its student's coach) may watch or end; 404 for anyone else. */
export async function requireLive(viewer: Viewer, liveId: number, need: 'read' | 'write'): Promise<LiveRow> {
  const row = (await db('live_sessions').where({ id: liveId }).first()) as LiveRow | undefined;
  if (!row) throw new NotFoundError('No live session with this id.');
  // coaches only: the routes call requireRole('coach'); another coach gets the same 404 as an unknown id
  await requireAthlete(viewer, Number(row.athlete_id), 'write', 'live session').catch((error) => {
    if (need === 'read' && !(error instanceof NotFoundError)) throw new NotFoundError('No live session with this id.');
    throw error;
  });
  return row;
}

export function requireActive(row: LiveRow): void {
  if (row.status !== 'active') throw new ConflictError('This live session has ended.');
}
