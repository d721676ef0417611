import 'server-only';
import type { SavedImportProfile } from '@/lib/contracts/import-profiles';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { importProfileSchema, type ImportProfile } from '@/lib/signal';
import { jsonColumn } from '@/lib/db/values';

// Import profiles are per coach: saved under a name, reused on later uploads (the same name replaces the old one).

export async function loadProfileOfCoach(viewer: Viewer, id: number): Promise<ImportProfile | null> {
  const row = await db('import_profiles').where({ id, coach_user_id: viewer.id }).first('profile');
  if (!row) return null;
  return importProfileSchema.parse(jsonColumn(row.profile));
}

export async function saveProfileOfCoach(viewer: Viewer, name: string, profile: ImportProfile): Promise<number> {
  await db('import_profiles')
    .insert({ coach_user_id: viewer.id, name, profile: JSON.stringify(profile) })
    .onConflict(['coach_user_id', 'name'])
    .merge({ profile: JSON.stringify(profile) });
  const row = await db('import_profiles').where({ coach_user_id: viewer.id, name }).first('id');
  return Number(row.id);
}

export async function listProfilesOfCoach(viewer: Viewer): Promise<SavedImportProfile[]> {
  const rows = await db('import_profiles').where({ coach_user_id: viewer.id }).orderBy('name').select('id', 'name', 'profile');
  return rows.map((row) => ({
    id: Number(row.id),
    name: row.name,
    profile: importProfileSchema.parse(jsonColumn(row.profile)),
  }));
}
