import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TsMigrationSource } from '@/knexfile';
import { createScratchDatabase, listTables, type ScratchDatabase } from './scratch-database';

// The tables in migration order: people and sessions, then recordings and their results, then the swing viewer's data.
const APP_TABLES = [
  'academies',
  'users',
  'athletes',
  'coach_athletes',
  'practice_sessions',
  'login_attempts',
  'import_profiles',
  'recordings',
  'processing_jobs',
  'swings',
  'swing_events',
  'swing_phase_metrics',
  'swing_event_values',
  'recording_series',
  // the swing viewer's data and the coach's work on swings
  'swing_series',
  'swing_labels',
  'swing_event_corrections',
  'swing_annotations',
  // targets, reference bands, drills
  'targets',
  'bands',
  'drills',
  'drill_assignments',
  // the swing finder's rejected candidates and the coach's promotions
  'recording_candidates',
  'candidate_promotions',
  // the stored viewer payload of each swing (GET /api/swings/:id)
  'swing_payloads',
  // accounts by e-mail: invitations, password resets, shares, the notification log, the reset rate limiter's counters
  'invitations',
  'password_resets',
  'shares',
  'mail_log',
  'rate_limits',
  // research: consent history, personal API tokens, the export audit
  'consent_records',
  'api_tokens',
  'export_audit',
  // live lessons: the stream, its events for the coach's screen, the swings found live, the buffer's lease
  'live_sessions',
  'live_chunks',
  'live_events',
  'live_swings',
  'live_leases',
  // launch-monitor shots: saved shot profiles, imports (raw file kept) and shots paired with swings
  'shot_profiles',
  'shot_imports',
  'shots',
  // paid remote reviews: the coach's offer, the requests with their history, payments and refunds, handled events
  'review_offers',
  'reviews',
  'review_history',
  'review_payments',
  'payment_events',
  // a recording's videos: original kept, playable mp4, poster, the sync offset
  'videos',
  // the viewer payload's part shared by every swing of a recording (overview, layout)
  'recording_payloads',
];
const KNEX_TABLES = ['knex_migrations', 'knex_migrations_lock'];
// Migrations that change an existing table, newest last (each adds one column): [file name part, table, column].
const ALTERATIONS: [string, string, string][] = [
  // the swing finder's per-swing fields (partial, forward press, promoted); the first column stands for all four
  ['add_finder_fields_to_swings', 'swings', 'partial'],
  // users.session_version, checked against the token's version on every request
  ['add_users_session_version', 'users', 'session_version'],
  // the bin: sessions and recordings deleted by a coach wait 30 days before the sweep removes them
  ['add_practice_sessions_binned_at', 'practice_sessions', 'binned_at'],
  ['add_recordings_binned_at', 'recordings', 'binned_at'],
  // archived players (kept with their data) and the bin of drills, bands and drill assignments
  ['add_athletes_archived_at', 'athletes', 'archived_at'],
  ['add_drills_binned_at', 'drills', 'binned_at'],
  ['add_bands_binned_at', 'bands', 'binned_at'],
  ['add_drill_assignments_binned_at', 'drill_assignments', 'binned_at'],
  // a student's opt-out of drill reminder mails
  ['add_users_drill_mail_opt_out', 'users', 'drill_mail_opt_out'],
  // the units a user reads shot values in
  ['add_users_shot_units', 'users', 'shot_units'],
  // which form of the swing view's stored part a row holds (older forms are rebuilt on their next read)
  ['add_swing_payloads_format', 'swing_payloads', 'format'],
  // the bin for shares: a coach removes what they sent a student, with undo for 30 days
  ['add_shares_binned_at', 'shares', 'binned_at'],
  // a coach stops taking review requests (the offer row is kept so it can be offered again)
  ['add_review_offers_withdrawn_at', 'review_offers', 'withdrawn_at'],
  // removed swing notes wait in the bin
  ['add_swing_annotations_binned_at', 'swing_annotations', 'binned_at'],
];

let scratch: ScratchDatabase;
beforeAll(async () => {
  scratch = await createScratchDatabase();
});
afterAll(async () => {
  await scratch?.drop();
});

describe('migrations', () => {
  it('are timestamped .ts files, one per table (or one change to an earlier table), in schema order', async () => {
    const names = await new TsMigrationSource().getMigrations();
    expect(names).toHaveLength(APP_TABLES.length + ALTERATIONS.length);
    for (const name of names) expect(name).toMatch(/^\d{14}_[a-z0-9_]+\.ts$/);
    const creating = names.filter((name) => name.includes('_create_'));
    creating.forEach((name, index) => expect(name).toContain(APP_TABLES[index]));
    expect(names.filter((name) => !name.includes('_create_')).map((name) => name.slice(15, -3))).toEqual(ALTERATIONS.map(([part]) => part));
  });

  it('latest -> rollback all -> latest gives the same tables each way', async () => {
    const { db } = scratch;
    await db.migrate.latest();
    const afterFirst = await listTables(db);
    expect(afterFirst).toEqual([...APP_TABLES, ...KNEX_TABLES].sort());

    await db.migrate.rollback(undefined, true);
    expect(await listTables(db)).toEqual(KNEX_TABLES);

    await db.migrate.latest();
    expect(await listTables(db)).toEqual(afterFirst);
  });

  it('each down() removes exactly its own table (or undoes its own change), newest first', async () => {
    const { db } = scratch;
    await db.migrate.latest();
    const names = await new TsMigrationSource().getMigrations();
    let remaining = APP_TABLES.length;
    for (const name of [...names].reverse()) {
      const alteration = ALTERATIONS.find(([part]) => name.includes(part));
      if (alteration) expect(await db.schema.hasColumn(alteration[1], alteration[2])).toBe(true);
      await db.migrate.down();
      if (alteration) expect(await db.schema.hasColumn(alteration[1], alteration[2])).toBe(false);
      else remaining -= 1;
      expect(await listTables(db)).toEqual([...APP_TABLES.slice(0, remaining), ...KNEX_TABLES].sort());
    }
    await db.migrate.latest();
    expect(await listTables(db)).toHaveLength(APP_TABLES.length + KNEX_TABLES.length);
  });

  it('creates the column types the schema asks for', async () => {
    const { db } = scratch;
    await db.migrate.latest();
    const columns = await db('information_schema.columns')
      .select<{ t: string; c: string; type: string; nullable: string; def: string | null }[]>({
        t: 'table_name',
        c: 'column_name',
        type: 'column_type',
        nullable: 'is_nullable',
        def: 'column_default',
      })
      .whereRaw('table_schema = database()');
    const column = (t: string, c: string) => columns.find((row) => row.t === t && row.c === c);
    expect(column('users', 'role')?.type).toBe("enum('admin','coach','student','researcher')");
    expect(column('users', 'email')?.type).toBe('varchar(254)');
    // issue 9: what the finder says about a swing
    expect(column('swings', 'partial')?.type).toBe('tinyint(1)');
    expect(column('swings', 'promoted')?.type).toBe("enum('detected','placed')");
    expect(column('swings', 'forward_press_mm')?.nullable).toBe('YES');
    expect(column('athletes', 'stance_width_mm')).toMatchObject({ type: 'smallint(5) unsigned', nullable: 'NO', def: '400' });
    expect(column('athletes', 'handedness')).toMatchObject({ type: "enum('right','left')", def: "'right'" });
    expect(column('athletes', 'user_id')?.nullable).toBe('YES');
    expect(column('practice_sessions', 'session_date')?.type).toBe('date');
    expect(column('practice_sessions', 'context')?.type).toBe("enum('lesson','practice','on-course')");
    expect(column('login_attempts', 'id')?.type).toBe('bigint(20) unsigned');
    expect(column('login_attempts', 'attempted_at')?.type).toBe('datetime(3)');
    expect(column('login_attempts', 'ip')?.type).toBe('varchar(45)');

    const indexes = await db('information_schema.statistics')
      .select<{ t: string; i: string; c: string; seq: number }[]>({
        t: 'table_name',
        i: 'index_name',
        c: 'column_name',
        seq: 'seq_in_index',
      })
      .whereRaw('table_schema = database()')
      .orderBy(['table_name', 'index_name', 'seq_in_index']);
    const indexColumns = (t: string, i: string) => indexes.filter((row) => row.t === t && row.i === i).map((row) => row.c);
    expect(indexColumns('coach_athletes', 'PRIMARY')).toEqual(['coach_user_id', 'athlete_id']);
    expect(indexColumns('practice_sessions', 'practice_sessions_athlete_date_index')).toEqual(['athlete_id', 'session_date']);
    expect(indexColumns('login_attempts', 'login_attempts_email_time_index')).toEqual(['email', 'attempted_at']);
    expect(indexColumns('login_attempts', 'login_attempts_ip_time_index')).toEqual(['ip', 'attempted_at']);
  });
});
