import 'server-only';
import { randomUUID } from 'node:crypto';
import { readFile, rm } from 'node:fs/promises';
import { z, ZodError } from 'zod';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoDate } from '@/lib/db/values';
import { getEnv } from '@/lib/env';
import { DEFAULT_SHOT_PROFILE, shotProfileSchema, type ShotImportResult, type ShotProfile } from '@/lib/contracts/shots';
import { BadUploadError, readMultipart } from '@/lib/recordings/multipart';
import { spoolDir } from '@/lib/recordings/upload';
import { getStore } from '@/lib/storage';
import { describeProblem, parseShotLog, ShotFileError } from './parse';
import { loadShotProfileOfCoach, saveShotProfileOfCoach } from './profiles';
import { recordFailedImport, saveImport } from './session-shots';

/** A shot log is a few hundred lines; 5 MB is far beyond any real one. */
export const MAX_SHOT_FILE_BYTES = 5 * 1024 * 1024;

const fieldError = (field: string, messages: string[]): ZodError => new ZodError(messages.map((message) => ({ code: 'custom' as const, path: [field], message, input: undefined })));

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

const shotFieldsSchema = z.strictObject({
  profile: z.preprocess(blankToUndefined, z.string().optional()),
  profileId: z.preprocess(blankToUndefined, z.coerce.number({ error: 'profileId must be a whole number.' }).int().positive().optional()),
  saveProfileAs: z.preprocess(blankToUndefined, z.string().trim().max(80, { error: 'Use at most 80 characters.' }).optional()),
});

/** The `profile` field: JSON text checked with the shots contract; a bad one is a 422 on that field. */
function profileFromText(text: string): ShotProfile {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw fieldError('profile', [`The shot profile is not valid JSON: ${(error as Error).message}`]);
  }
  const parsed = shotProfileSchema.safeParse(value);
  if (!parsed.success) throw fieldError('profile', parsed.error.issues.map((i) => `${i.path.length ? `${i.path.join('.')}: ` : ''}${i.message}`));
  return parsed.data;
}

/**
 * POST /api/sessions/:id/shots: keeps the raw file, reads it with the profile (the `profile` JSON, a saved one by
 * `profileId`, else our own plain layout), finds the clock offset and pairs the shots. A file that cannot be read is
 * still kept (a failed import) and answered 422 with every problem's line and column on the `file` field.
 */
export async function receiveShotLog(viewer: Viewer, sessionId: number, request: Request): Promise<ShotImportResult> {
  const form = await readMultipart(request, { maxFileBytes: Math.min(getEnv().MAX_UPLOAD_BYTES, MAX_SHOT_FILE_BYTES), maxFiles: 1 }, spoolDir());
  try {
    const fields = shotFieldsSchema.parse(form.fields);
    const file = form.files[0];
    if (!file) throw new BadUploadError('no_file', 'No file was sent; add the shot log as a file part named "file".');
    let profile: ShotProfile = DEFAULT_SHOT_PROFILE;
    if (fields.profile) profile = profileFromText(fields.profile);
    else if (fields.profileId !== undefined) {
      const saved = await loadShotProfileOfCoach(viewer, fields.profileId);
      if (!saved) throw fieldError('profileId', ['No saved shot profile with this id among yours.']);
      profile = saved;
    }
    if (fields.saveProfileAs) {
      if (!fields.profile) throw fieldError('saveProfileAs', ['Send the shot profile (field "profile") to save it.']);
      await saveShotProfileOfCoach(viewer, fields.saveProfileAs, profile);
    }
    const session = await db('practice_sessions').where({ id: sessionId }).first('athlete_id', 'session_date');
    const text = (await readFile(file.path)).toString('utf8');
    const key = `shots/${Number(session.athlete_id)}/${randomUUID()}`;
    await getStore().putFile(key, file.path, file.byteSize); // the raw upload is kept before anything is read
    const input = { sessionId, uploadedBy: viewer.id, filename: file.filename, byteSize: file.byteSize, sha256: file.sha256, storageKey: key, profile };
    let shots;
    try {
      shots = parseShotLog(text, profile, toIsoDate(session.session_date) ?? '1970-01-01', profile !== DEFAULT_SHOT_PROFILE);
    } catch (error) {
      if (!(error instanceof ShotFileError)) throw error;
      await recordFailedImport(db, input, error.message);
      throw fieldError('file', error.problems.map(describeProblem));
    }
    const { importId: _id, ...result } = await saveImport(db, input, shots);
    return result;
  } finally {
    await Promise.all(form.files.map((f) => rm(f.path, { force: true })));
  }
}
