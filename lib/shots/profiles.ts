import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { jsonColumn } from '@/lib/db/values';
import { shotProfileSchema, type SavedShotProfile, type ShotProfile } from '@/lib/contracts/shots';

// Shot profiles are per coach, like the import profiles of recordings: saved under a name (the same name replaces
// the old one), reused on later shot imports, deleted when no longer wanted.

export async function loadShotProfileOfCoach(viewer: Viewer, id: number): Promise<ShotProfile | null> {
  const row = await db('shot_profiles').where({ id, coach_user_id: viewer.id }).first('profile');
  return row ? shotProfileSchema.parse(jsonColumn(row.profile)) : null;
}

export async function saveShotProfileOfCoach(viewer: Viewer, name: string, profile: ShotProfile): Promise<number> {
  await db('shot_profiles')
    .insert({ coach_user_id: viewer.id, name, profile: JSON.stringify(profile) })
    .onConflict(['coach_user_id', 'name'])
    .merge({ profile: JSON.stringify(profile) });
  const row = await db('shot_profiles').where({ coach_user_id: viewer.id, name }).first('id');
  return Number(row.id);
}

export async function listShotProfilesOfCoach(viewer: Viewer): Promise<SavedShotProfile[]> {
  const rows = await db('shot_profiles').where({ coach_user_id: viewer.id }).orderBy('name').select('id', 'name', 'profile');
  return rows.map((row) => ({ id: Number(row.id), name: row.name, profile: shotProfileSchema.parse(jsonColumn(row.profile)) }));
}

/** Deletes one of the coach's profiles; false when it is not theirs (the route answers 404). */
export async function deleteShotProfileOfCoach(viewer: Viewer, id: number): Promise<boolean> {
  return (await db('shot_profiles').where({ id, coach_user_id: viewer.id }).delete()) > 0;
}
