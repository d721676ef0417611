import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ConflictError, ForbiddenError, NotFoundError } from '@/lib/http';
import { requireAthlete, requireTargetToWrite } from '@/lib/auth/access';
import type { TargetInput } from '@/lib/contracts/targets';
import type { ClubGroup, Target, TargetCheck } from './types';
import type { TargetRow } from '@/lib/db/tables';
import { jsonColumnOf } from '@/lib/db/values';

// Who sees which targets: a coach sees the academy defaults, their own, and any target for an athlete on their
// roster; a student sees the defaults, their coaches' general targets and the ones made for them. Coaches edit their
// own targets and the academy defaults (editable by design); other roles are refused by the routes.

function parseChecks(v: unknown): TargetCheck[] {
  return jsonColumnOf<TargetCheck[]>(v);
}

export function toTarget(row: TargetRow): Target {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    clubGroup: row.club_group,
    athleteId: row.athlete_id,
    ownerUserId: row.owner_user_id,
    isDefault: row.is_default,
    commonPractice: row.common_practice,
    checks: parseChecks(row.checks),
    tempo: row.tempo_min === null || row.tempo_max === null ? null : { min: row.tempo_min, max: row.tempo_max },
    updatedAt: row.updated_at.toISOString(),
  };
}

/** The target as saved (after an insert or update). */
async function savedTarget(id: number): Promise<Target> {
  const row = await db('targets').where({ id }).first();
  if (!row) throw new NotFoundError('No target with this id.');
  return toTarget(row);
}

async function coachesOf(athleteId: number): Promise<number[]> {
  return (await db('coach_athletes').where({ athlete_id: athleteId }).pluck('coach_user_id')).map(Number);
}

async function studentAthleteId(viewer: Viewer): Promise<number | null> {
  const row = await db('athletes').where({ user_id: viewer.id, academy_id: viewer.academyId }).first('id');
  return row ? Number(row.id) : null;
}

export async function listTargets(viewer: Viewer): Promise<Target[]> {
  const q = db('targets').where({ academy_id: viewer.academyId });
  if (viewer.role === 'coach') {
    const roster = db('coach_athletes').where({ coach_user_id: viewer.id }).select('athlete_id');
    q.andWhere((w) => w.where('is_default', true).orWhere('owner_user_id', viewer.id).orWhereIn('athlete_id', roster));
  } else {
    const athleteId = await studentAthleteId(viewer);
    const coaches = athleteId === null ? [] : await coachesOf(athleteId);
    q.andWhere((w) => {
      w.where('is_default', true);
      if (athleteId !== null) w.orWhere('athlete_id', athleteId).orWhere((x) => x.whereNull('athlete_id').whereIn('owner_user_id', coaches));
    });
  }
  const rows = await q.orderBy([{ column: 'is_default', order: 'desc' }, 'club_group', 'id']);
  return rows.map(toTarget);
}

/** The target a swing is scored against: athlete-specific for its club group, else its coach's, else the default. */
export async function targetForSwing(athleteId: number, academyId: number, group: ClubGroup): Promise<Target | null> {
  const own = await db('targets').where({ academy_id: academyId, athlete_id: athleteId, club_group: group }).orderBy('updated_at', 'desc').orderBy('id', 'desc').first();
  if (own) return toTarget(own);
  const coaches = await coachesOf(athleteId);
  if (coaches.length > 0) {
    const coach = await db('targets').where({ academy_id: academyId, club_group: group, is_default: false }).whereNull('athlete_id').whereIn('owner_user_id', coaches).orderBy('updated_at', 'desc').orderBy('id', 'desc').first();
    if (coach) return toTarget(coach);
  }
  const def = await db('targets').where({ academy_id: academyId, club_group: group, is_default: true }).orderBy('id').first();
  return def ? toTarget(def) : null;
}

function columns(input: Partial<TargetInput>): Record<string, unknown> {
  const c: Record<string, unknown> = {};
  if (input.name !== undefined) c.name = input.name;
  if (input.description !== undefined) c.description = input.description;
  if (input.clubGroup !== undefined) c.club_group = input.clubGroup;
  if (input.athleteId !== undefined) c.athlete_id = input.athleteId;
  if (input.checks !== undefined) c.checks = JSON.stringify(input.checks);
  if (input.tempo !== undefined) {
    c.tempo_min = input.tempo?.min ?? null;
    c.tempo_max = input.tempo?.max ?? null;
  }
  return c;
}

async function requireAthleteOnRoster(viewer: Viewer, athleteId: number | null | undefined): Promise<void> {
  if (athleteId === null || athleteId === undefined) return;
  await requireAthlete(viewer, athleteId, 'write');
}

export async function createTarget(viewer: Viewer, input: TargetInput): Promise<Target> {
  await requireAthleteOnRoster(viewer, input.athleteId);
  const [id] = await db('targets').insert({ ...columns(input), academy_id: viewer.academyId, owner_user_id: viewer.id, is_default: false, common_practice: false });
  return savedTarget(id);
}

const editable = requireTargetToWrite;

export async function updateTarget(viewer: Viewer, id: number, input: Partial<TargetInput>): Promise<Target> {
  const row = await editable(viewer, id);
  if (row.is_default && input.athleteId) throw new ConflictError('An academy default cannot be tied to one athlete; make a new target for them instead.');
  await requireAthleteOnRoster(viewer, input.athleteId);
  await db('targets').where({ id }).update({ ...columns(input), updated_at: db.raw('NOW(3)') });
  return savedTarget(id);
}

export async function deleteTarget(viewer: Viewer, id: number): Promise<void> {
  const row = await editable(viewer, id);
  if (row.is_default) throw new ConflictError('Academy defaults can be edited but not deleted.');
  await db('targets').where({ id }).delete();
}
