import 'server-only';
import { paged, pageOf, type Page, type PageQuery } from '@/lib/pagination';
import type { Knex } from 'knex';
import { db } from '@/lib/db/client';
import { toIsoDate } from '@/lib/db/values';
import type { Viewer } from '@/lib/auth/viewer';
import { NotFoundError } from '@/lib/http';
import type { AthleteInput, AthleteListQuery, AthletePatch } from '@/lib/contracts/athletes';
import type { AthleteSummary } from '@/lib/contracts/athletes';

// Scoping rules (who sees which athlete):
// - coach: athletes linked to them in coach_athletes, in their academy;
// - student: only the athlete row tied to their own account (athletes.user_id);
// - admin and researcher: none through these functions (route handlers forbid them before calling).
// An athlete outside the viewer's scope is reported as "not found", never as "forbidden", so ids of other
// coaches' athletes cannot be probed.

type AthleteRow = {
  id: number;
  display_name: string;
  handedness: AthleteSummary['handedness'];
  stance_width_mm: number;
  date_of_birth: unknown;
  home_club: string | null;
  last_session_date: unknown;
  last_session_context: string | null;
  archived_at: Date | null;
};

function toSummary(row: AthleteRow): AthleteSummary {
  const lastDate = toIsoDate(row.last_session_date);
  return {
    id: Number(row.id),
    displayName: row.display_name,
    handedness: row.handedness,
    stanceWidthMm: Number(row.stance_width_mm),
    dateOfBirth: toIsoDate(row.date_of_birth),
    homeClub: row.home_club,
    lastSession:
      lastDate && row.last_session_context
        ? { date: lastDate, context: row.last_session_context as NonNullable<AthleteSummary['lastSession']>['context'] }
        : null,
    archivedAt: row.archived_at ? new Date(row.archived_at).toISOString() : null,
  };
}

function scopedAthletes(viewer: Viewer): Knex.QueryBuilder {
  const query = db('athletes as a')
    .select(
      'a.id',
      'a.display_name',
      'a.handedness',
      'a.stance_width_mm',
      'a.date_of_birth',
      'a.home_club',
      'a.archived_at',
      db.raw(
        '(select p.session_date from practice_sessions p where p.athlete_id = a.id and p.binned_at is null order by p.session_date desc, p.id desc limit 1) as last_session_date',
      ),
      db.raw(
        '(select p.context from practice_sessions p where p.athlete_id = a.id and p.binned_at is null order by p.session_date desc, p.id desc limit 1) as last_session_context',
      ),
    )
    .where('a.academy_id', viewer.academyId);
  if (viewer.role === 'coach') {
    query.whereExists(
      db('coach_athletes as ca').select(db.raw('1')).whereRaw('ca.athlete_id = a.id').andWhere('ca.coach_user_id', viewer.id),
    );
  } else if (viewer.role === 'student') {
    query.where('a.user_id', viewer.id);
  } else {
    query.whereRaw('1 = 0');
  }
  return query;
}

/** LIKE pattern that matches `text` literally anywhere. */
function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export async function listAthletesForViewer(viewer: Viewer, filters: AthleteListQuery = {}): Promise<AthleteSummary[]> {
  const rows: AthleteRow[] = await filteredAthletes(viewer, filters).orderBy('a.display_name', 'asc').orderBy('a.id', 'asc');
  return rows.map(toSummary);
}

/** Largest `limit` of GET /api/athletes. */
export const ROSTER_MAX = 200;

/** One page of the roster (name order, then id), with the number of athletes the filters match. */
export async function listAthletesPage(viewer: Viewer, filters: AthleteListQuery, page: PageQuery): Promise<{ athletes: AthleteSummary[]; page: Page }> {
  const [rows, count] = await Promise.all([
    paged(filteredAthletes(viewer, filters).orderBy('a.display_name', 'asc').orderBy('a.id', 'asc'), page) as Promise<AthleteRow[]>,
    db.count<{ n: number | string }[]>({ n: '*' }).from(filteredAthletes(viewer, filters).as('f')).first(),
  ]);
  return { athletes: rows.map(toSummary), page: pageOf(page, Number(count?.n ?? 0)) };
}

function filteredAthletes(viewer: Viewer, filters: AthleteListQuery): Knex.QueryBuilder {
  const query = scopedAthletes(viewer);
  // the roster and every pick list leave archived players out; `archived` lists only them (to restore)
  if (filters.archived) query.whereNotNull('a.archived_at');
  else query.whereNull('a.archived_at');
  if (filters.q) {
    const pattern = containsPattern(filters.q);
    query.where((w) => w.where('a.display_name', 'like', pattern).orWhere('a.home_club', 'like', pattern));
  }
  if (filters.handedness) query.where('a.handedness', filters.handedness);
  if (filters.context) {
    // "has at least one session in this context"
    query.whereExists(
      db('practice_sessions as pc').select(db.raw('1')).whereRaw('pc.athlete_id = a.id').whereNull('pc.binned_at').andWhere('pc.context', filters.context),
    );
  }
  return query;
}

export async function findAthleteForViewer(viewer: Viewer, athleteId: number): Promise<AthleteSummary | null> {
  const row: AthleteRow | undefined = await scopedAthletes(viewer).where('a.id', athleteId).first();
  return row ? toSummary(row) : null;
}

export async function getAthleteForViewer(viewer: Viewer, athleteId: number): Promise<AthleteSummary> {
  const athlete = await findAthleteForViewer(viewer, athleteId);
  if (!athlete) throw new NotFoundError('No athlete with this id on your roster.');
  return athlete;
}

function toColumns(input: AthletePatch): Record<string, unknown> {
  const columns: Record<string, unknown> = {};
  if (input.displayName !== undefined) columns.display_name = input.displayName;
  if (input.handedness !== undefined) columns.handedness = input.handedness;
  if (input.stanceWidthMm !== undefined) columns.stance_width_mm = input.stanceWidthMm;
  if (input.dateOfBirth !== undefined) columns.date_of_birth = input.dateOfBirth;
  if (input.homeClub !== undefined) columns.home_club = input.homeClub === '' ? null : input.homeClub;
  return columns;
}

/** A coach creates an athlete in their academy; the athlete joins that coach's roster. */
export async function createAthleteForCoach(coach: Viewer, input: AthleteInput): Promise<AthleteSummary> {
  const id = await db.transaction(async (trx) => {
    const now = new Date();
    const [athleteId] = await trx('athletes').insert({
      ...toColumns(input),
      academy_id: coach.academyId,
      created_at: now,
      updated_at: now,
    });
    await trx('coach_athletes').insert({ coach_user_id: coach.id, athlete_id: athleteId, created_at: now });
    return Number(athleteId);
  });
  return getAthleteForViewer(coach, id);
}

export async function updateAthleteForViewer(viewer: Viewer, athleteId: number, patch: AthletePatch): Promise<AthleteSummary> {
  await getAthleteForViewer(viewer, athleteId);
  await db('athletes')
    .where({ id: athleteId })
    .update({ ...toColumns(patch), updated_at: new Date() });
  return getAthleteForViewer(viewer, athleteId);
}

/**
 * Archive (coach of the player): they leave the roster and pick lists; sessions, swings, notes and drills stay, and
 * the player's own page still opens. Restore clears the mark. Both answer the player as saved.
 */
export async function setAthleteArchived(viewer: Viewer, athleteId: number, archived: boolean): Promise<AthleteSummary> {
  await getAthleteForViewer(viewer, athleteId);
  await db('athletes')
    .where({ id: athleteId })
    .update({ archived_at: archived ? db.raw('NOW(3)') : null, updated_at: new Date() });
  return getAthleteForViewer(viewer, athleteId);
}

/** Roster size and sessions in the last 30 days, for the coach home page. */
export async function countSessionsSince(viewer: Viewer, sinceIsoDate: string): Promise<number> {
  const ids = scopedAthletes(viewer).clearSelect().select('a.id');
  const row = await db('practice_sessions').whereIn('athlete_id', ids).whereNull('binned_at').andWhere('session_date', '>=', sinceIsoDate).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** Every player of an academy by name, for the admin's account linking (ids and names only). */
export async function listAcademyPlayers(academyId: number): Promise<{ id: number; displayName: string }[]> {
  const rows = await db('athletes').where({ academy_id: academyId }).orderBy('display_name').select('id', 'display_name');
  return rows.map((a) => ({ id: Number(a.id), displayName: String(a.display_name) }));
}
