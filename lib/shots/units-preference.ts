import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import type { UnitSystem } from '@/lib/contracts/shots';

/** The units this user reads shot values in (users.shot_units; metric by default). */
export async function shotUnitsOf(viewer: Viewer): Promise<UnitSystem> {
  const row = await db('users').where({ id: viewer.id }).first('shot_units');
  return row?.shot_units === 'imperial' ? 'imperial' : 'metric';
}

export async function setShotUnits(viewer: Viewer, units: UnitSystem): Promise<void> {
  await db('users').where({ id: viewer.id }).update({ shot_units: units });
}
