import 'server-only';
import { randomUUID } from 'node:crypto';
import { rename, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { ZodError } from 'zod';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { getEnv } from '@/lib/env';
import { enqueueRecording } from '@/lib/jobs/queue';
import { wakeAppWorker } from '@/lib/jobs/start';
import { getStore } from '@/lib/storage';
import { requireAthlete } from '@/lib/auth/access';
import { localCopyName, spoolDirOf, STALE_SPOOL_MS, sweepStaleSpools } from '@/lib/storage/spool';
import { uploadFieldsSchema, type UploadFields } from './fields';
import { BadUploadError, readMultipart, type ReceivedFile } from './multipart';
import type { RecordingOptions } from './options';
import { loadProfileOfCoach, saveProfileOfCoach } from './profiles';

export interface UploadedRecording {
  id: number;
  filename: string;
  status: 'received' | 'processing' | 'ready' | 'failed';
  /** true when this session already held a file with the same SHA-256: the existing recording is reported */
  duplicate: boolean;
  sessionId: number;
}

function fieldError(field: string, message: string): ZodError {
  return new ZodError([{ code: 'custom', path: [field], message, input: undefined }]);
}

/** Options for processing: the form's explicit values; the athlete's profile only where the file says nothing. */
export async function optionsFor(viewer: Viewer, fields: UploadFields): Promise<RecordingOptions> {
  const athlete = await db('athletes').where({ id: fields.athleteId }).first('handedness', 'stance_width_mm');
  let profile = fields.profile ?? null;
  if (!profile && fields.profileId !== undefined) {
    profile = await loadProfileOfCoach(viewer, fields.profileId);
    if (!profile) throw fieldError('profileId', 'No saved import profile with this id among yours.');
  }
  if (fields.saveProfileAs) {
    if (!fields.profile) throw fieldError('saveProfileAs', 'Send the import profile (field "profile") to save it.');
    await saveProfileOfCoach(viewer, fields.saveProfileAs, fields.profile);
  }
  return {
    layout: fields.layout ?? null,
    profile,
    handedness: fields.handedness ?? null,
    stanceWidthMm: fields.stanceWidthMm ?? null,
    profileHandedness: athlete.handedness,
    profileStanceWidthMm: Number(athlete.stance_width_mm),
    cutoffHz: fields.cutoffHz ?? null,
  };
}

async function sessionFor(viewer: Viewer, fields: UploadFields): Promise<number> {
  if (fields.sessionId !== undefined) {
    const session = await db('practice_sessions').where({ id: fields.sessionId }).first('athlete_id', 'binned_at');
    if (!session || Number(session.athlete_id) !== fields.athleteId || session.binned_at !== null) {
      throw fieldError('sessionId', 'This session is not one of this athlete’s sessions.');
    }
    return fields.sessionId;
  }
  // No session given: a practice session today, run by this coach.
  const [id] = await db('practice_sessions').insert({
    athlete_id: fields.athleteId,
    coach_user_id: viewer.id,
    session_date: new Date().toISOString().slice(0, 10),
    context: 'practice',
  });
  return Number(id);
}

function isDuplicateKey(error: unknown): boolean {
  return (error as { code?: string })?.code === 'ER_DUP_ENTRY';
}

/** Keeps one spooled file: raw bytes into storage first, then the recording row and its job in one transaction. */
async function keepFile(viewer: Viewer, athleteId: number, sessionId: number, file: ReceivedFile, options: RecordingOptions): Promise<UploadedRecording> {
  const existing = await db('recordings').where({ session_id: sessionId, sha256: file.sha256 }).first('id', 'status', 'binned_at');
  // The same bytes uploaded again after the recording was deleted: it comes back out of the bin.
  if (existing?.binned_at) await db('recordings').where({ id: existing.id }).update({ binned_at: null });
  if (existing) return { id: Number(existing.id), filename: file.filename, status: existing.status, duplicate: true, sessionId };
  const store = getStore();
  const key = `recordings/${athleteId}/${randomUUID()}`;
  await store.putFile(key, file.path, file.byteSize);
  try {
    const id = await db.transaction(async (trx) => {
      const [recordingId] = await trx('recordings').insert({
        athlete_id: athleteId,
        session_id: sessionId,
        uploaded_by: viewer.id,
        filename: file.filename,
        byte_size: file.byteSize,
        sha256: file.sha256,
        storage_key: key,
        status: 'received',
        options: JSON.stringify(options),
      });
      await enqueueRecording(trx, Number(recordingId), getEnv().JOB_MAX_ATTEMPTS);
      return Number(recordingId);
    });
    // an object store copied the spool file: keep it for the first processing on this machine (no second download)
    await rename(file.path, join(spoolDir(), localCopyName(id))).catch(() => undefined);
    return { id, filename: file.filename, status: 'received', duplicate: false, sessionId };
  } catch (error) {
    await store.remove(key).catch(() => undefined);
    if (!isDuplicateKey(error)) throw error;
    // the same file arrived twice at once: the other request stored it
    const other = await db('recordings').where({ session_id: sessionId, sha256: file.sha256 }).first('id', 'status');
    return { id: Number(other.id), filename: file.filename, status: other.status, duplicate: true, sessionId };
  }
}

/** Where uploads are spooled while they arrive (removed on every exit path of a request). */
export function spoolDir(): string {
  return spoolDirOf(getEnv().STORAGE_DIR);
}

const globalForSweeper = globalThis as typeof globalThis & { __stancelineSpoolSweeper?: NodeJS.Timeout };

/** At server start and then every STALE_SPOOL_MS: removes spool files a crashed request left behind. */
export function startSpoolSweeper(): void {
  if (globalForSweeper.__stancelineSpoolSweeper) return;
  const sweep = () =>
    void sweepStaleSpools(spoolDir())
      .then((n) => (n > 0 ? console.error(`[stanceline] removed ${n} stale upload spool file(s) from ${spoolDir()}`) : undefined))
      .catch(() => undefined);
  sweep();
  globalForSweeper.__stancelineSpoolSweeper = setInterval(sweep, STALE_SPOOL_MS);
  globalForSweeper.__stancelineSpoolSweeper.unref();
}

/** POST /api/recordings: read the form, check the athlete, keep every file, queue processing. */
export async function receiveRecordings(viewer: Viewer, request: Request): Promise<UploadedRecording[]> {
  const env = getEnv();
  const form = await readMultipart(request, { maxFileBytes: env.MAX_UPLOAD_BYTES, maxFiles: env.MAX_UPLOAD_FILES }, spoolDir());
  try {
    const fields = uploadFieldsSchema.parse(form.fields);
    await requireAthlete(viewer, fields.athleteId, 'write');
    if (form.files.length === 0) throw new BadUploadError('no_file', 'No file was sent; add at least one file part named "file".');
    const options = await optionsFor(viewer, fields);
    const sessionId = await sessionFor(viewer, fields);
    const out: UploadedRecording[] = [];
    for (const file of form.files) out.push(await keepFile(viewer, fields.athleteId, sessionId, file, options));
    wakeAppWorker();
    return out;
  } finally {
    await Promise.all(form.files.map((f) => rm(f.path, { force: true })));
  }
}
